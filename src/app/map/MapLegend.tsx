import { useState } from 'react';
import { EXCLUSION_KINDS } from '../../core/model/types';
import { usePlanner } from '../usePlanner';
import { EXCLUSION_COLOURS } from './palette';
import { PlotCheckKey } from '../plotCheck/PlotCheckKey';
import { PlotSymbolKey } from './PlotSymbolKey';

/** True on a tablet or phone, where the map is too small to give the open key room of its own. */
function narrow(): boolean {
  return typeof window !== 'undefined' && window.matchMedia('(max-width: 1100px)').matches;
}

/**
 * The key to the map: strata by colour, code and name; exclusion kinds by colour and hatch; plot
 * symbols. It folds to its title (folded from the start on a tablet or phone); the map keeps the site clear of it.
 */
export function MapLegend() {
  const [open, setOpen] = useState(() => !narrow());
  const strata = usePlanner((s) => s.site.strata);
  const exclusions = usePlanner((s) => s.site.exclusions);
  const kinds = new Set(exclusions.map((e) => e.kind));
  const hasPlots = usePlanner((s) => s.result !== null);
  return (
    <details className="legend" open={open} onToggle={(e) => setOpen(e.currentTarget.open)}>
      <summary>Key</summary>
      <ul aria-label="Strata">
        {strata.map((s) => (
          <li key={s.key}>
            <span className="sw" style={{ background: s.colour, opacity: 0.75 }} />
            <span className="mono">{s.code}</span> {s.label}
          </li>
        ))}
      </ul>
      <ul aria-label="Exclusions and buffers">
        {EXCLUSION_KINDS.filter((k) => kinds.has(k)).map((k) => (
          <li key={k}>
            <span className="sw sw-hatch" style={{ color: EXCLUSION_COLOURS[k], borderColor: EXCLUSION_COLOURS[k] }} />
            {k} + buffer
          </li>
        ))}
      </ul>
      {hasPlots ? <PlotSymbolKey compact /> : null}
      <PlotCheckKey />
    </details>
  );
}
