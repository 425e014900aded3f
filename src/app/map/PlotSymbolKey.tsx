import { PLOT_FIELD_STATE_KEYS } from '../../core/field/plotFieldState';
import { PLOT_SYMBOLS } from '../../core/field/plotSymbols';
import { plotSymbolDataUrl } from './plotSymbolImages';

/** The four plot symbols with their meaning: the same code the map, the KMZ and the PDFs use. */
export function PlotSymbolKey({ compact = false }: { compact?: boolean }) {
  return (
    <ul className={compact ? 'symbol-key compact' : 'symbol-key'} aria-label="Plots">
      {PLOT_FIELD_STATE_KEYS.map((k) => (
        <li key={k} data-symbol={k}>
          <img src={plotSymbolDataUrl(k)} alt="" width={18} height={18} />
          {compact ? PLOT_SYMBOLS[k].short : PLOT_SYMBOLS[k].label}
        </li>
      ))}
    </ul>
  );
}
