import { useId } from 'react';
import type { PlacementMethod } from '../../core/model/designTypes';
import { usePlanner } from '../usePlanner';
import { designSet } from './designSet';
import { FootprintField } from './FootprintField';
import { NumberField } from './NumberField';
import { ToolButton } from './ToolButton';

const PLACEMENTS: [PlacementMethod, string][] = [
  ['random', 'Simple random'],
  ['balanced', 'Spatially balanced (Halton)'],
  ['grid', 'Systematic grid'],
  ['transect', 'Transects from a baseline'],
];

/** The design sheet's placement fields: method, its layout, footprint, spacing and edge buffer. */
export function DesignPlacementFields() {
  const d = usePlanner((s) => s.design);
  const set = designSet;
  const ids = { method: useId() };
  return (
    <fieldset>
      <legend>Placement</legend>
      <div className="field">
        <label htmlFor={ids.method}>Method</label>
        <select id={ids.method} value={d.method} onChange={(e) => set({ method: e.currentTarget.value as PlacementMethod })}>
          {PLACEMENTS.map(([v, t]) => (
            <option key={v} value={v}>
              {t}
            </option>
          ))}
        </select>
      </div>
      {d.method === 'grid' ? (
        <>
          <NumberField label="Grid spacing" unit="m" min={1} value={d.gridSpacingM} allowEmpty hint="Empty: worked out from the plot total" onCommit={(v) => set({ gridSpacingM: v })} />
          <NumberField label="Grid rotation" unit="° from north" value={d.gridAngleDeg} onCommit={(v) => set({ gridAngleDeg: v ?? 0 })} />
        </>
      ) : null}
      {d.method === 'transect' ? (
        <>
          <div className="tools">
            <ToolButton tool="baseline" label={d.baseline ? 'Redraw baseline' : 'Draw baseline'} shortcut="L" hint="Draw the line transects start from" />
            <span className="fine">{d.baseline ? `Baseline of ${d.baseline.length} vertices set.` : 'No baseline yet.'}</span>
          </div>
          <NumberField label="Transect interval" unit="m" min={1} value={d.transectIntervalM} allowEmpty onCommit={(v) => set({ transectIntervalM: v })} />
          <NumberField label="Quadrat interval" unit="m" min={1} value={d.quadratIntervalM} allowEmpty onCommit={(v) => set({ quadratIntervalM: v })} />
        </>
      ) : null}
      <FootprintField />
      <NumberField label="Minimum spacing" unit="m" min={0} value={d.spacingM} onCommit={(v) => set({ spacingM: v ?? 0 })} />
      <NumberField label="Edge buffer" unit="m" min={0} value={d.edgeBufferM} onCommit={(v) => set({ edgeBufferM: v ?? 0 })} />
    </fieldset>
  );
}
