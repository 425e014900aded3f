import { useId } from 'react';
import type { AllocationMethod, PlacementMethod } from '../../core/model/designTypes';
import { designSeedFresh, designSettingsSet } from '../../state/designActions';
import { designJobCancel, designJobStart } from '../designJob';
import { plannerStore } from '../plannerStoreInstance';
import { attempt, usePlanner } from '../usePlanner';
import { AllocationTable } from './AllocationTable';
import { DesignBudgetBox } from './DesignBudgetBox';
import { DesignPrecisionNote } from './DesignPrecisionNote';
import { FootprintField } from './FootprintField';
import { NumberField } from './NumberField';
import { SeedGeneratorNote } from './SeedGeneratorNote';
import { ToolButton } from './ToolButton';

const PLACEMENTS: [PlacementMethod, string][] = [
  ['random', 'Simple random'],
  ['balanced', 'Spatially balanced (Halton)'],
  ['grid', 'Systematic grid'],
  ['transect', 'Transects from a baseline'],
];
const ALLOCATIONS: [AllocationMethod, string][] = [
  ['proportional', 'Proportional to area'],
  ['equal', 'Equal per stratum'],
  ['neyman', 'Neyman (area × SD)'],
];

/** Step 3: the design sheet — how many plots, how they are shared among strata and placed, and the seed. */
export function DesignPanel() {
  const d = usePlanner((s) => s.design);
  const strata = usePlanner((s) => s.site.strata);
  const job = usePlanner((s) => s.job);
  const set = (patch: Parameters<typeof designSettingsSet>[1]) => attempt(() => designSettingsSet(plannerStore, patch));
  const ids = { method: useId(), alloc: useId(), basis: useId(), size: useId() };
  const byTarget = d.targetHalfwidth !== null;
  return (
    <section className="sheet" aria-labelledby="design-title">
      <h2 id="design-title">
        <span className="step-no">3</span> Design
      </h2>
      <p className="lead">Every setting is stored in the plan with the seed, so the same plots can be made again.</p>
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
      <fieldset>
        <legend>Sample size and allocation</legend>
        <div className="field">
          <label htmlFor={ids.size}>Size from</label>
          <select
            id={ids.size}
            value={byTarget ? 'target' : d.budget ? 'budget' : 'total'}
            onChange={(e) => {
              const v = e.currentTarget.value;
              set({ targetHalfwidth: v === 'target' ? { value: 0.1, relative: true } : null, budget: v === 'budget' ? (d.budget ?? { total: 10_000, overhead: 0 }) : null });
            }}
          >
            <option value="total">a total number of plots</option>
            <option value="target">a target precision</option>
            <option value="budget">a budget</option>
          </select>
        </div>
        {d.budget ? <DesignBudgetBox /> : byTarget && d.targetHalfwidth ? (
          <>
            <NumberField
              label="CI half-width"
              unit={d.targetHalfwidth.relative ? '× pilot mean' : 'units of the mean'}
              min={0}
              value={d.targetHalfwidth.value}
              onCommit={(v) => set({ targetHalfwidth: { value: v ?? 0.1, relative: d.targetHalfwidth?.relative ?? true } })}
            />
            <label className="inline">
              <input type="checkbox" checked={d.targetHalfwidth.relative} onChange={(e) => set({ targetHalfwidth: { value: d.targetHalfwidth?.value ?? 0.1, relative: e.currentTarget.checked } })} />
              relative to the pilot mean
            </label>
            <NumberField label="Pilot mean" value={d.pilotMean} allowEmpty onCommit={(v) => set({ pilotMean: v })} />
          </>
        ) : (
          <NumberField label="Total primary plots" min={1} step={1} value={d.plots} onCommit={(v) => set({ plots: v ?? d.plots })} />
        )}
        <div className="field">
          <label htmlFor={ids.alloc}>Allocation</label>
          <select id={ids.alloc} value={d.allocation} onChange={(e) => set({ allocation: e.currentTarget.value as AllocationMethod })}>
            {ALLOCATIONS.map(([v, t]) => (
              <option key={v} value={v}>
                {t}
              </option>
            ))}
          </select>
        </div>
        <div className="field">
          <label htmlFor={ids.basis}>Shares from</label>
          <select id={ids.basis} value={d.shareBasis} onChange={(e) => set({ shareBasis: e.currentTarget.value as 'usable' | 'mapped' })}>
            <option value="usable">usable area</option>
            <option value="mapped">mapped area</option>
          </select>
        </div>
        <NumberField label="Minimum per stratum" min={0} step={1} value={d.minPerStratum} onCommit={(v) => set({ minPerStratum: v ?? 0 })} />
        <NumberField label="Reserves per stratum" min={0} step={1} value={d.reservePerStratum} onCommit={(v) => set({ reservePerStratum: v ?? 0 })} />
        <label className="inline">
          <input type="checkbox" checked={d.redistributeShortfall ?? false} onChange={(e) => set({ redistributeShortfall: e.currentTarget.checked })} />
          move plots a full stratum cannot hold to strata with room
        </label>
        {d.allocation === 'neyman' || byTarget || d.budget ? (
          <table className="ledger compact" aria-label="Pilot standard deviation and cost by stratum">
            <thead>
              <tr>
                <th scope="col">Stratum</th>
                <th scope="col" className="num">Pilot SD</th>
                <th scope="col" className="num">{d.budget ? 'Cost per plot' : 'Relative cost'}</th>
              </tr>
            </thead>
            <tbody>
              {strata.map((s) => (
                <tr key={s.key}>
                  <td>{s.label}</td>
                  <td className="num">
                    <input type="number" className="num-input" min={0} step="any" aria-label={`Pilot SD of ${s.label}`} defaultValue={d.sd[s.key] ?? ''} key={`sd-${d.sd[s.key]}`} onBlur={(e) => e.currentTarget.value !== '' && set({ sd: { ...d.sd, [s.key]: Number(e.currentTarget.value) } })} />
                  </td>
                  <td className="num">
                    <input type="number" className="num-input" min={0} step="any" aria-label={`Relative cost of ${s.label}`} defaultValue={d.cost[s.key] ?? 1} key={`c-${d.cost[s.key]}`} onBlur={(e) => set({ cost: { ...d.cost, [s.key]: Number(e.currentTarget.value || 1) } })} />
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        ) : null}
        <DesignPrecisionNote />
      </fieldset>
      <fieldset>
        <legend>Seed</legend>
        <div className="field">
          <NumberField label="Seed" min={0} step={1} value={d.seed} onCommit={(v) => set({ seed: v ?? d.seed })} />
          <button type="button" onClick={() => set({ seed: designSeedFresh() })}>
            New seed
          </button>
        </div>
        <p className="fine">The same site, settings and seed always give the same plots.</p>
        <SeedGeneratorNote />
      </fieldset>
      <div className="run-row">
        {job ? (
          <>
            <progress max={1} value={job.fraction} aria-label="Design progress" />
            <span className="fine">
              {Math.round(job.fraction * 100)} % · {job.stage}
            </span>
            <button type="button" className="warn" onClick={designJobCancel}>
              Cancel
            </button>
          </>
        ) : (
          <button type="button" className="primary" onClick={() => void designJobStart()}>
            Make the design
          </button>
        )}
      </div>
      <AllocationTable />
    </section>
  );
}
