import { useId } from 'react';
import type { EstimateReport } from '../../core/results/estimateFromResults';
import { tQuantile95 } from '../../core/stats/tQuantile';
import { chartLinear, chartTicks } from './chartScale';
import { fmtInterval, fmtValue } from './resultsFormat';

/** One stratum's mean and its own 95 % interval (t on n − 1 df), or null when n < 2. */
export interface StratumMeanBar {
  stratum: string;
  n: number;
  mean: number | null;
  ci95: [number, number] | null;
}

/**
 * Per-stratum means with 95 % intervals: ȳ_h ± t(0.975, n_h − 1) × SE_h, SE_h with the stratum's
 * finite-population correction (Cochran 1977, ch. 5), clipped to the
 * values the kind can take (0–100 for cover, 0–1 for presence, ≥ 0 for counts).
 */
export function stratumMeanBars(report: EstimateReport): StratumMeanBar[] {
  const [lo, hi] = KIND_RANGE[report.kind];
  return report.strata.map((s) => {
    const half = s.se !== null && s.n >= 2 ? tQuantile95(s.n - 1) * s.se : null;
    const ci95: [number, number] | null = s.mean !== null && half !== null ? [Math.max(lo, s.mean - half), Math.min(hi, s.mean + half)] : null;
    return { stratum: s.stratum, n: s.n, mean: s.mean, ci95 };
  });
}

/** Values a kind can take; intervals are clipped to them (a cover below 0 % means nothing). */
const KIND_RANGE = {
  measure: [Number.NEGATIVE_INFINITY, Number.POSITIVE_INFINITY],
  cover: [0, 100],
  count: [0, Number.POSITIVE_INFINITY],
  presence: [0, 1],
} as const;

/** A tick label: the round number as it is, grouped in thousands. */
function tickText(v: number): string {
  return Number(v.toPrecision(6)).toLocaleString('en', { maximumFractionDigits: 6 });
}

const W = 440;
const LABEL_W = 128;
const VALUE_W = 112;
const ROW_H = 26;
const TOP = 8;
const AXIS_H = 26;

/**
 * Dot-and-whisker chart of each stratum's mean with its 95 % interval, the stratified mean as a
 * dashed line over its own interval band. Ink only (dots, lines, a light band), so it reads in
 * grey-scale; the numbers are printed beside each row and in the accessible description.
 */
export function MeansChart({ report }: { report: EstimateReport }) {
  const id = useId();
  const bars = stratumMeanBars(report);
  const rowsH = Math.max(1, bars.length + 1) * ROW_H;
  const H = TOP + rowsH + AXIS_H;
  const values = [...bars.flatMap((b) => (b.ci95 ? b.ci95 : b.mean !== null ? [b.mean] : [])), ...(report.ci95 ?? []), ...(report.mean !== null ? [report.mean] : [])];
  const ticks = chartTicks(Math.min(...values, report.kind === 'measure' ? Number.POSITIVE_INFINITY : 0), Math.max(...values));
  const x = chartLinear(ticks[0], ticks[ticks.length - 1], LABEL_W + 6, W - VALUE_W - 6);
  const desc = [
    ...bars.map((b) => `${b.stratum}: mean ${fmtValue(b.mean)}, ${b.ci95 ? `95 % interval ${fmtInterval(b.ci95)}` : 'no interval (fewer than 2 plots)'}, n = ${b.n}`),
    `stratified mean ${fmtValue(report.mean)}, 95 % CI ${fmtInterval(report.ci95)}`,
  ].join('; ');
  const stY = TOP + bars.length * ROW_H + ROW_H / 2;
  return (
    <svg className="results-chart" viewBox={`0 0 ${W} ${H}`} width="100%" role="img" aria-labelledby={`${id}-t ${id}-d`}>
      <title id={`${id}-t`}>{`Mean ${report.variable} by stratum with 95 % intervals`}</title>
      <desc id={`${id}-d`}>{desc}</desc>
      {report.ci95 ? <rect x={x(report.ci95[0])} y={TOP} width={Math.max(1, x(report.ci95[1]) - x(report.ci95[0]))} height={rowsH} fill="#1d2a2e" fillOpacity={0.1} /> : null}
      {ticks.map((t) => (
        <g key={t}>
          <line x1={x(t)} x2={x(t)} y1={TOP} y2={TOP + rowsH} stroke="#1d2a2e" strokeOpacity={0.15} />
          <text x={x(t)} y={TOP + rowsH + 16} textAnchor="middle" fontSize={10} fill="#1d2a2e">
            {tickText(t)}
          </text>
        </g>
      ))}
      <line x1={LABEL_W + 6} x2={W - VALUE_W - 6} y1={TOP + rowsH} y2={TOP + rowsH} stroke="#1d2a2e" />
      {bars.map((b, i) => {
        const y = TOP + i * ROW_H + ROW_H / 2;
        return (
          <g key={b.stratum}>
            <text x={LABEL_W} y={y + 4} textAnchor="end" fontSize={11} fill="#1d2a2e">
              {b.stratum.length > 20 ? `${b.stratum.slice(0, 19)}…` : b.stratum}
            </text>
            {b.ci95 ? (
              <g stroke="#1d2a2e" strokeWidth={1.5}>
                <line x1={x(b.ci95[0])} x2={x(b.ci95[1])} y1={y} y2={y} />
                <line x1={x(b.ci95[0])} x2={x(b.ci95[0])} y1={y - 5} y2={y + 5} />
                <line x1={x(b.ci95[1])} x2={x(b.ci95[1])} y1={y - 5} y2={y + 5} />
              </g>
            ) : null}
            {b.mean !== null ? <circle cx={x(b.mean)} cy={y} r={4.5} fill="#1d2a2e" /> : null}
            <text x={W - VALUE_W} y={y + 4} fontSize={10} fill="#1d2a2e">
              {b.mean === null ? 'no plots' : b.ci95 ? fmtValue(b.mean) : `${fmtValue(b.mean)} (n < 2)`}
            </text>
          </g>
        );
      })}
      <text x={LABEL_W} y={stY + 4} textAnchor="end" fontSize={11} fontWeight={700} fill="#1d2a2e">
        Stratified
      </text>
      {report.mean !== null ? (
        <g>
          <line x1={x(report.mean)} x2={x(report.mean)} y1={TOP} y2={TOP + rowsH} stroke="#1d2a2e" strokeWidth={1.5} strokeDasharray="5 3" />
          <rect x={x(report.mean) - 4.5} y={stY - 4.5} width={9} height={9} fill="#ffffff" stroke="#1d2a2e" strokeWidth={2} />
        </g>
      ) : null}
      <text x={W - VALUE_W} y={stY + 4} fontSize={10} fontWeight={700} fill="#1d2a2e">
        {fmtValue(report.mean)}
      </text>
    </svg>
  );
}
