import { useId } from 'react';
import type { AllocationMethod } from '../../core/model/designTypes';
import { usePlanner } from '../usePlanner';
import { DesignBudgetBox } from './DesignBudgetBox';
import { DesignPrecisionNote } from './DesignPrecisionNote';
import { DesignStratumInputs } from './DesignStratumInputs';
import { designSet } from './designSet';
import { NumberField } from './NumberField';

const ALLOCATIONS: [AllocationMethod, string][] = [
  ['proportional', 'Proportional to area'],
  ['equal', 'Equal per stratum'],
  ['neyman', 'Neyman (area × SD)'],
];

/** The design sheet's sample size and allocation: sized by a total, a target precision or a budget. */
export function DesignSizeFields() {
  const d = usePlanner((s) => s.design);
  const set = designSet;
  const ids = { alloc: useId(), basis: useId(), size: useId() };
  const byTarget = d.targetHalfwidth !== null;
  return (
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
      {d.allocation === 'neyman' || byTarget || d.budget ? <DesignStratumInputs /> : null}
      <DesignPrecisionNote />
    </fieldset>
  );
}
