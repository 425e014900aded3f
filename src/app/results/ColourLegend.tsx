import { useId } from 'react';
import { VIRIDIS_STOPS } from './resultsPlotColours';
import { fmtValue } from './resultsFormat';

/** The map's colour ramp for the chosen variable, lowest value left, with its end values. */
export function ColourLegend({ variable, min, max }: { variable: string; min: number; max: number }) {
  const id = useId().replace(/:/g, '');
  return (
    <svg className="results-legend" viewBox="0 0 300 34" width="300" height="34" role="img" aria-label={`Map colours for ${variable}: dark purple ${fmtValue(min)}, through teal, to yellow ${fmtValue(max)}`}>
      <defs>
        <linearGradient id={`ramp-${id}`}>
          {VIRIDIS_STOPS.map((c, i) => (
            <stop key={c} offset={i / (VIRIDIS_STOPS.length - 1)} stopColor={c} />
          ))}
        </linearGradient>
      </defs>
      <rect x={1} y={2} width={298} height={12} fill={`url(#ramp-${id})`} stroke="#1d2a2e" strokeWidth={0.8} />
      <text x={1} y={28} fontSize={10} fill="#1d2a2e">
        {fmtValue(min)}
      </text>
      <text x={150} y={28} fontSize={10} fill="#1d2a2e" textAnchor="middle">
        {variable}
      </text>
      <text x={299} y={28} fontSize={10} fill="#1d2a2e" textAnchor="end">
        {fmtValue(max)}
      </text>
    </svg>
  );
}
