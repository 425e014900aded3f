import { PLOT_CHECK_SYMBOLS } from '../../core/plotCheck/plotCheckSymbols';
import { plotCheckSymbolDataUrl } from './plotCheckSymbolImages';
import { usePlotCheck } from './plotCheckStoreInstance';

/** The map key's entry for checked plots, shown while a check is loaded. */
export function PlotCheckKey() {
  const loaded = usePlotCheck((s) => s.report !== null);
  if (!loaded) return null;
  return (
    <ul className="symbol-key compact" aria-label="Checked plots">
      {(['fail', 'pass'] as const).map((k) => (
        <li key={k} data-check-symbol={k}>
          <img src={plotCheckSymbolDataUrl(k)} alt="" width={18} height={18} />
          {PLOT_CHECK_SYMBOLS[k].short}
        </li>
      ))}
    </ul>
  );
}
