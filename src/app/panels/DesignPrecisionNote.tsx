import { designAllocation } from '../../core/design/designAllocation';
import { isInputError } from '../../core/common/InputError';
import { useAreaTable } from '../useAreaTable';
import { usePlanner } from '../usePlanner';

function fmt(v: number): string {
  return Number(v.toPrecision(4)).toString();
}

/**
 * What the current settings give before the design is run: the plots per the sizing rule (total,
 * target or budget) and, from the pilot SDs, the expected 95 % CI half-width at that n — the same
 * figures the design summary states (core/designAllocation).
 */
export function DesignPrecisionNote() {
  const d = usePlanner((s) => s.design);
  const { table, current } = useAreaTable();
  if (d.method !== 'random' && d.method !== 'balanced') return null;
  if (!table || !current) return <p className="fine" data-fact="precision">Expected precision: waiting for the stratum areas.</p>;
  const strata = table.rows
    .map((r) => ({ key: r.stratum, basisM2: d.shareBasis === 'usable' ? r.usable_m2 : r.area_m2 }))
    .filter((s) => s.basisM2 > 0);
  let text: string;
  try {
    const a = designAllocation(strata, d);
    const n = a.allocation.plots.reduce((x, y) => x + y, 0);
    const parts = [`${n} plots`];
    if (a.budget) parts.push(`costing ${fmt(a.budget.plotsCost)} of the ${fmt(a.budget.total - a.budget.overhead)} left after the overhead`);
    if (a.precision && Number.isFinite(a.precision.halfwidth)) {
      parts.push(
        `expected 95 % CI half-width ±${fmt(a.precision.halfwidth)} from the pilot SDs (t on ${a.precision.df === null ? '–' : a.precision.df.toFixed(1)} Satterthwaite df; ±${fmt(a.precision.halfwidthNormal)} in the normal approximation)`,
      );
    } else {
      parts.push('give every stratum a pilot SD to see the expected half-width');
    }
    text = `Expected: ${parts.join('; ')}.`;
  } catch (e) {
    if (!isInputError(e)) throw e;
    text = `Not yet: ${e.message}.`;
  }
  return (
    <p className="fine" data-fact="precision" role="status">
      {text}
    </p>
  );
}
