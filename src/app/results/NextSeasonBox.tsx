import { useId } from 'react';
import type { DesignSettings, PlotCollection } from '../../core/model/designTypes';
import { resultsDesignPatch, resultsOptionsSet } from '../../state/resultsStore';
import { fmtValue } from './resultsFormat';
import { resultsStore, useResults } from './resultsStoreInstance';

/** Plots needed next season for a target 95 % CI half-width, proportional and Neyman, with "Use in design". */
export function NextSeasonBox({ collection, onUseInDesign }: { collection: PlotCollection | null; onUseInDesign: (patch: Partial<DesignSettings>) => void }) {
  const id = useId();
  const target = useResults((s) => s.target);
  const next = useResults((s) => s.next);
  const nextSd = useResults((s) => s.nextSd);
  const nextError = useResults((s) => s.nextError);
  const shown = target.relative ? Number((target.value * 100).toPrecision(6)) : target.value;
  const setTarget = (value: number, relative: boolean) => {
    if (value > 0 && Number.isFinite(value)) resultsOptionsSet(resultsStore, { target: { value, relative } }, collection);
  };
  return (
    <div className="results-next">
      <div className="field">
        <label htmlFor={`${id}-t`}>Target 95 % CI half-width</label>
        <span className="field-input">
          ±
          <input
            id={`${id}-t`}
            className="num-input"
            type="number"
            min={0}
            step="any"
            defaultValue={shown}
            key={`${target.relative}-${shown}`}
            onBlur={(e) => setTarget(Number(e.currentTarget.value) / (target.relative ? 100 : 1), target.relative)}
          />
          <select aria-label="Target given as" value={target.relative ? 'relative' : 'absolute'} onChange={(e) => setTarget(e.currentTarget.value === 'relative' ? target.value / 100 : target.value * 100, e.currentTarget.value === 'relative')}>
            <option value="relative">% of this season’s mean</option>
            <option value="absolute">in the variable’s units</option>
          </select>
        </span>
      </div>
      {nextError ? <p className="problem">Next season cannot be sized: {nextError}</p> : null}
      {next ? (
        <>
          <table className="ledger compact" aria-label="Plots needed next season">
            <thead>
              <tr>
                <th scope="col">Stratum</th>
                <th scope="col" className="num">Proportional</th>
                <th scope="col" className="num">Neyman</th>
              </tr>
            </thead>
            <tbody>
              {next.proportional.plots.map((p, i) => (
                <tr key={p.stratum}>
                  <th scope="row">{p.stratum}</th>
                  <td className="num">{p.plots}</td>
                  <td className="num">{next.neyman.plots[i].plots}</td>
                </tr>
              ))}
            </tbody>
            <tfoot>
              <tr>
                <th scope="row">Plots</th>
                <td className="num" data-allocation="proportional">{next.proportional.n}</td>
                <td className="num" data-allocation="neyman">{next.neyman.n}</td>
              </tr>
              <tr>
                <th scope="row">
                  <span className="sr-only">Action</span>
                </th>
                {[next.proportional, next.neyman].map((o) => (
                  <td key={o.allocation} className="num actions">
                    <button
                      type="button"
                      aria-label={`Use ${o.n} plots, ${o.allocation} allocation, in the design`}
                      onClick={() => {
                        const patch = resultsDesignPatch({ next, nextSd }, o.allocation as 'proportional' | 'neyman');
                        if (patch) onUseInDesign(patch);
                      }}
                    >
                      Use in design
                    </button>
                  </td>
                ))}
              </tr>
            </tfoot>
          </table>
          <p className="fine">
            Aim: ±{fmtValue(next.targetHalfwidth)}. SDs used: {Object.entries(nextSd).map(([k, v]) => `${k} ${fmtValue(v)}`).join(', ')}. Sizes are for the t interval the estimate reports, t(0.975) on each allocation’s Satterthwaite df (Cochran, Sampling Techniques, 3rd ed. 1977, ch. 5; Satterthwaite 1946).
          </p>
          <ul className="fine">
            {next.notes.map((n) => (
              <li key={n}>{n}</li>
            ))}
          </ul>
        </>
      ) : null}
    </div>
  );
}
