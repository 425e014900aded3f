import { allocateProportional } from '../design/allocate/allocateProportional';
import { designUsableAreas } from '../design/designUsableAreas';
import type { LocalFrame } from '../geo/localFrame';
import type { PlotCheckRecord, StratumCheckRow } from './plotCheckTypes';
import type { Site } from '../model/types';
import { M2_PER_HA } from '../common/units';

const ha = (m2: number): string => `${(m2 / M2_PER_HA).toFixed(2)} ha`;
const plural = (n: number, one: string, many = `${one}s`): string => `${n} ${n === 1 ? one : many}`;
const idList = (rs: readonly PlotCheckRecord[]): string => {
  const ids = rs.slice(0, 8).map((r) => r.id);
  return rs.length > 8 ? `${ids.join(', ')} and ${rs.length - 8} more` : ids.join(', ');
};

/**
 * The set as a sample: each stratum's sample plots (and how many pass) against what a proportional
 * allocation of the same number of plots on the usable area would give it (largest remainder,
 * no minimum), and plain notes — strata without a plot (inference cannot cover them), plots on
 * excluded ground (so the set cannot be a probability sample of the usable area, where such
 * ground has no chance of selection), plots outside every stratum, reserves and rejected plots
 * checked but not counted. Usable areas are those a design shares plots by (designUsableAreas).
 * Source of the allocation: Cochran, Sampling Techniques, 3rd ed. 1977, §5.3 (proportional allocation).
 */
export function plotsCheckSummary(site: Site, frame: LocalFrame, records: readonly PlotCheckRecord[]): { strata: StratumCheckRow[]; notes: string[]; warnings: string[] } {
  const { mapped, usable, warnings } = designUsableAreas(site, frame);
  const counted = records.filter((r) => r.counted);
  const inStratum = (key: string) => counted.filter((r) => r.stratum?.id === key);
  const total = usable.reduce((a, b) => a + b, 0);
  const proportional =
    total > 0 && site.strata.length > 0
      ? allocateProportional(site.strata.map((s, i) => ({ key: s.key, basisM2: usable[i] })), counted.length, 0).plots
      : site.strata.map(() => 0);
  if (!(total > 0)) warnings.push('the strata have no usable area, so there is no proportional allocation to compare with');
  const strata: StratumCheckRow[] = site.strata.map((s, i) => {
    const mine = inStratum(s.key);
    return { id: s.key, name: s.label, code: s.code, mappedM2: mapped[i], usableM2: usable[i], plots: mine.length, passing: mine.filter((r) => r.ok).length, proportional: proportional[i] };
  });

  const notes: string[] = [];
  for (const row of strata) {
    if (row.plots > 0) continue;
    notes.push(`No sample plot lies in stratum "${row.name}" (${row.code}, ${ha(row.usableM2)} usable): inference from this set cannot cover it.`);
  }
  const excluded = records.filter((r) => r.exclusions.length > 0);
  if (excluded.length) {
    notes.push(
      `${plural(excluded.length, 'plot lies', 'plots lie')} on excluded ground, inside an exclusion or its safety buffer (${idList(excluded)}): a probability sample of the usable area gives such ground no chance of selection, so this set cannot be one.`,
    );
  }
  const outside = records.filter((r) => !r.stratum);
  if (outside.length) {
    notes.push(`${plural(outside.length, 'plot lies', 'plots lie')} outside every mapped stratum or in a hole (${idList(outside)}): estimates by stratum cannot use ${outside.length === 1 ? 'it' : 'them'}.`);
  }
  const reserves = records.filter((r) => !r.counted && r.status !== 'rejected').length;
  const rejected = records.filter((r) => !r.counted && r.status === 'rejected').length;
  if (reserves + rejected > 0) {
    const parts = [reserves ? plural(reserves, 'waiting reserve') : '', rejected ? plural(rejected, 'rejected plot') : ''].filter(Boolean);
    notes.push(`${parts.join(' and ')} ${reserves + rejected === 1 ? 'was' : 'were'} checked but not counted as sample plots.`);
  }
  if (strata.some((r) => Math.abs(r.plots - r.proportional) > 1)) {
    notes.push(
      `Plots per stratum differ from a proportional allocation of the ${plural(counted.length, 'sample plot')} on the usable area (see the table): stratified estimates weight each stratum by its area, whatever its number of plots.`,
    );
  }
  return { strata, notes, warnings };
}
