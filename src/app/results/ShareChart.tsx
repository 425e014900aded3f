import { useId } from 'react';
import type { AllocationRow } from '../../core/model/designTypes';
import { fmtPct } from '../format';

/** Each stratum's share of the plots allocated beside its share of the area the design weighted by. */
export function allocationShares(rows: readonly AllocationRow[]): { stratum: string; plotShare: number; areaShare: number }[] {
  const plots = rows.reduce((a, r) => a + r.plots, 0);
  return rows.map((r) => ({ stratum: r.stratum, plotShare: plots > 0 ? r.plots / plots : 0, areaShare: r.share }));
}

const W = 440;
const LABEL_W = 128;
const BAR_H = 9;
const ROW_H = 30;
const TOP = 24;

/**
 * Paired bars per stratum: area share (white with diagonal hatching) over plot share (solid ink),
 * with the percentages printed, so the pairs read without colour and in grey-scale. Under
 * proportional allocation the pairs match; Neyman and minimum rules move plots between strata.
 */
export function ShareChart({ rows, basis }: { rows: readonly AllocationRow[]; basis: 'usable' | 'mapped' }) {
  const id = useId().replace(/:/g, '');
  const shares = allocationShares(rows);
  const H = TOP + shares.length * ROW_H + 6;
  const maxShare = Math.max(0.01, ...shares.flatMap((s) => [s.plotShare, s.areaShare]));
  const barW = (v: number) => (v / maxShare) * (W - LABEL_W - 70);
  const hatch = `hatch-${id}`;
  const desc = shares.map((s) => `${s.stratum}: ${fmtPct(s.areaShare)} of the ${basis} area, ${fmtPct(s.plotShare)} of the plots`).join('; ');
  return (
    <svg className="results-chart" viewBox={`0 0 ${W} ${H}`} width="100%" role="img" aria-labelledby={`${hatch}-t ${hatch}-d`}>
      <title id={`${hatch}-t`}>Share of plots against share of area, by stratum</title>
      <desc id={`${hatch}-d`}>{desc}</desc>
      <defs>
        <pattern id={hatch} width={5} height={5} patternUnits="userSpaceOnUse" patternTransform="rotate(45)">
          <line x1={0} y1={0} x2={0} y2={5} stroke="#1d2a2e" strokeWidth={1.4} />
        </pattern>
      </defs>
      <g fontSize={10} fill="#1d2a2e">
        <rect x={LABEL_W + 6} y={5} width={14} height={BAR_H} fill={`url(#${hatch})`} stroke="#1d2a2e" />
        <text x={LABEL_W + 24} y={13}>{`area share (${basis})`}</text>
        <rect x={LABEL_W + 136} y={5} width={14} height={BAR_H} fill="#1d2a2e" />
        <text x={LABEL_W + 154} y={13}>plot share (primaries)</text>
      </g>
      {shares.map((s, i) => {
        const y = TOP + i * ROW_H;
        return (
          <g key={s.stratum} fontSize={10} fill="#1d2a2e">
            <text x={LABEL_W} y={y + BAR_H + 4} textAnchor="end" fontSize={11}>
              {s.stratum.length > 20 ? `${s.stratum.slice(0, 19)}…` : s.stratum}
            </text>
            <rect x={LABEL_W + 6} y={y} width={Math.max(0.5, barW(s.areaShare))} height={BAR_H} fill={`url(#${hatch})`} stroke="#1d2a2e" />
            <text x={LABEL_W + 10 + barW(s.areaShare)} y={y + BAR_H - 1}>{fmtPct(s.areaShare)}</text>
            <rect x={LABEL_W + 6} y={y + BAR_H + 2} width={Math.max(0.5, barW(s.plotShare))} height={BAR_H} fill="#1d2a2e" />
            <text x={LABEL_W + 10 + barW(s.plotShare)} y={y + 2 * BAR_H + 1}>{fmtPct(s.plotShare)}</text>
          </g>
        );
      })}
    </svg>
  );
}
