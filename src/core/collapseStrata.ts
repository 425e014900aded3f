/** The observations of one stratum, before or after collapsing. */
export interface StratumValues {
  stratum: string;
  /** Basis area, m². */
  basisM2: number;
  values: number[];
  /** Original strata merged into this one (just itself when not collapsed). */
  members?: string[];
}

/** The rule, in words, for reports and the CLI. */
export const COLLAPSE_RULE =
  'a stratum with fewer than 2 observations is merged with the next stratum in the list order of the design (the previous one when it is last), repeated until every stratum has at least 2; a merged stratum has the summed area, and its mean and variance are those of its pooled plots';

/**
 * Collapses strata that have fewer than 2 observations so that every stratum's variance can be
 * estimated. Partners are chosen by list order, which is fixed before the data are seen — the
 * condition Cochran (Sampling Techniques, 3rd ed. 1977, §5A.12 "collapsed strata", section number
 * from memory) sets for grouping strata; a choice by nearest observed mean would make the variance
 * look smaller than it is. Pooling the plots of merged strata treats them as one stratum; the
 * resulting variance tends to overstate, not understate, the true one when the merged strata differ.
 * @param strata in the design's list order
 * @returns new strata (inputs are not changed); `members` lists what each one holds
 */
export function collapseStrata(strata: readonly StratumValues[]): { strata: StratumValues[]; merged: string[] } {
  const groups: StratumValues[] = strata.map((s) => ({
    stratum: s.stratum,
    basisM2: s.basisM2,
    values: [...s.values],
    members: s.members ? [...s.members] : [s.stratum],
  }));
  const merged: string[] = [];
  while (groups.length > 1) {
    const i = groups.findIndex((g) => g.values.length < 2);
    if (i < 0) break;
    const j = i < groups.length - 1 ? i + 1 : i - 1;
    const [first, second] = i < j ? [groups[i], groups[j]] : [groups[j], groups[i]];
    const members = [...(first.members ?? []), ...(second.members ?? [])];
    const joined: StratumValues = {
      stratum: members.join(' + '),
      basisM2: first.basisM2 + second.basisM2,
      values: [...first.values, ...second.values],
      members,
    };
    merged.push(`${groups[i].stratum} (n = ${groups[i].values.length}) merged with ${groups[j].stratum}`);
    groups.splice(Math.min(i, j), 2, joined);
  }
  return { strata: groups, merged };
}
