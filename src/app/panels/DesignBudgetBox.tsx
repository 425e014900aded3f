import { designSettingsSet } from '../../state/designActions';
import { plannerStore } from '../plannerStoreInstance';
import { attempt, usePlanner } from '../usePlanner';
import { NumberField } from './NumberField';

/** The budget a design is sized by: total and fixed overhead; costs per plot are set per stratum in the table below. */
export function DesignBudgetBox() {
  const budget = usePlanner((s) => s.design.budget);
  const allocation = usePlanner((s) => s.design.allocation);
  if (!budget) return null;
  const set = (patch: Partial<{ total: number; overhead: number }>) =>
    attempt(() => designSettingsSet(plannerStore, { budget: { ...budget, ...patch } }));
  return (
    <div className="budget-box" data-box="budget">
      <NumberField label="Budget" unit="total, cost units" min={0} value={budget.total} onCommit={(v) => set({ total: v ?? budget.total })} />
      <NumberField label="Fixed overhead" unit="cost units" min={0} value={budget.overhead} onCommit={(v) => set({ overhead: v ?? 0 })} />
      <p className="fine">
        The design is the largest whose plots cost at most the budget less the overhead, at the cost per plot set for each stratum below.{' '}
        {allocation === 'neyman'
          ? 'With Neyman allocation the plots follow the cost-optimum n_h ∝ W_h S_h/√c_h (Cochran 1977 §5.5).'
          : 'Only Neyman allocation with costs gives the cost-optimum (Cochran 1977 §5.5); this allocation keeps its own shares.'}
      </p>
    </div>
  );
}
