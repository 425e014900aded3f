/** How many observations one stratum has, in the design's list order. */
export interface StratumCount {
  stratum: string;
  n: number;
}

/** Strata collapsed together for the variance: indices into the list, in list order. */
export interface CollapsedGroup {
  indices: number[];
  strata: string[];
}

/** The grouping rule, in words, for reports and the CLI. */
export const COLLAPSE_RULE =
  'a stratum with only one observation is grouped with the next stratum in the design’s list order that has observations (the previous one when none follows), and a group is extended the same way until it holds at least 2 observations; the stratified mean still weights every original stratum by its own area, and only the variance of each group is replaced by the collapsed-strata (between-strata) estimator, which is conservative: differences between the grouped strata’s means count as sampling error, so the SE tends to be too large rather than too small';

/**
 * Groups strata with a single observation so that their variance can be estimated by the
 * collapsed-strata technique. Partners are chosen by list order, which is fixed before the data are
 * seen — the condition Cochran (Sampling Techniques, 3rd ed. 1977, §5A.12, section number from
 * memory) sets for forming the groups; a choice by nearest observed mean would make the variance look
 * smaller than it is. Strata without observations are left out (no technique gives them a mean).
 * @param strata observation counts in the design's list order
 * @returns the groups of two or more strata (strata not listed keep their own variance) and one line
 *   per group saying what was grouped
 */
export function collapseStrata(strata: readonly StratumCount[]): { groups: CollapsedGroup[]; merged: string[] } {
  const observed = strata.map((s, i) => ({ i, n: s.n })).filter((s) => s.n > 0);
  const blocks = observed.map((s) => ({ indices: [s.i], n: s.n }));
  while (blocks.length > 1) {
    const k = blocks.findIndex((b) => b.n < 2);
    if (k < 0) break;
    const j = k < blocks.length - 1 ? k + 1 : k - 1;
    const [first, second] = k < j ? [blocks[k], blocks[j]] : [blocks[j], blocks[k]];
    blocks.splice(Math.min(k, j), 2, { indices: [...first.indices, ...second.indices], n: first.n + second.n });
  }
  const groups = blocks
    .filter((b) => b.indices.length > 1)
    .map((b) => ({ indices: b.indices, strata: b.indices.map((i) => strata[i].stratum) }));
  const merged = groups.map((g) => g.indices.map((i) => `${strata[i].stratum} (n = ${strata[i].n})`).join(' + '));
  return { groups, merged };
}
