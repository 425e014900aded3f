import type { Footprint } from '../model/designTypes';
import { EXCLUSION_KIND_LABELS } from '../site/exclusionKindNotes';
import { footprintFormat } from '../design/footprintParse';
import type { CheckedStratum, PlotCheckRecord, PlotExclusionHit, PlotProblem, PlotProblemCode } from './plotCheckTypes';
import { PLOT_PROBLEM_CODES } from './plotCheckTypes';

/** What the sentences need besides the measured record. */
export interface PlotProblemContext {
  spacingM: number;
  footprint: Footprint;
  edgeBufferM: number;
  /** Ids of the set by index, for naming the other plot. */
  ids: readonly string[];
  wheres: readonly string[];
}

const m = (v: number): string => `${v.toFixed(1)} m`;
const limit = (v: number): string => `${+v.toFixed(2)} m`;
const stratumText = (s: CheckedStratum): string => `stratum "${s.name}" (${s.code})`;

function exclusionText(e: PlotExclusionHit): string {
  return `${EXCLUSION_KIND_LABELS[e.kind].toLowerCase()} "${e.name}"`;
}

function exclusionSentence(id: string, e: PlotExclusionHit, footprint: Footprint): string {
  if (e.inside) return `Plot ${id} lies inside ${exclusionText(e)}, ${m(e.distanceM)} from its edge.`;
  if (e.bufferM > 0 && e.distanceM < e.bufferM) return `Plot ${id} lies ${m(e.distanceM)} from ${exclusionText(e)}, inside its ${limit(e.bufferM)} buffer.`;
  if (e.bufferM <= 0 && e.distanceM === 0) return `Plot ${id} lies on ${exclusionText(e)}.`;
  const fp = footprintFormat(footprint);
  if (e.bufferM > 0) {
    return `The footprint of plot ${id} (${fp}) comes within ${m(e.footprintM)} of ${exclusionText(e)}, inside its ${limit(e.bufferM)} buffer (the plot centre is ${m(e.distanceM)} away).`;
  }
  return `The footprint of plot ${id} (${fp}) overlaps ${exclusionText(e)} (the plot centre is ${m(e.distanceM)} away).`;
}

/**
 * The failed checks of one measured plot as plain sentences naming the plot and what it is too
 * close to, most serious first: on excluded ground (inside an exclusion or its buffer, by the plot
 * or its footprint), outside every stratum or in a hole, over its stratum's boundary or inside the
 * edge buffer, at the same position as another plot, sharing its id, closer than the spacing.
 * Distances to 0.1 m. Our wording; common practice, no source.
 */
export function plotCheckProblems(r: Omit<PlotCheckRecord, 'problems' | 'ok' | 'severity'>, c: PlotProblemContext): PlotProblem[] {
  const out: { code: PlotProblemCode; text: string }[] = [];
  const id = r.id;
  for (const e of r.exclusions) out.push({ code: 'excluded', text: exclusionSentence(id, e, c.footprint) });
  if (r.holeIn) out.push({ code: 'in-hole', text: `Plot ${id} lies in a hole in ${stratumText(r.holeIn)} that no stratum covers.` });
  else if (!r.stratum) out.push({ code: 'outside-strata', text: `Plot ${id} lies outside every mapped stratum.` });
  if (r.stratum && r.edgeM !== null && r.edgeBroken) {
    out.push({
      code: 'stratum-edge',
      text:
        r.edgeM === 0
          ? `The footprint of plot ${id} (${footprintFormat(c.footprint)}) crosses the boundary of ${stratumText(r.stratum)}.`
          : `${c.footprint.shape === 'point' ? `Plot ${id}` : `The footprint of plot ${id} (${footprintFormat(c.footprint)})`} is ${m(r.edgeM)} from the boundary of ${stratumText(r.stratum)}, inside the ${limit(c.edgeBufferM)} edge buffer.`,
    });
  }
  if (r.samePosition.length) {
    out.push({ code: 'duplicate-position', text: `Plot ${id} is at the same position as ${r.samePosition.map((o) => `plot ${o.id} (${o.where})`).join(', ')}.` });
  }
  if (r.idCount > 1) {
    const wheres = c.ids.flatMap((other, i) => (other === id ? [c.wheres[i]] : []));
    out.push({ code: 'duplicate-id', text: `Plot id ${id} is used by ${r.idCount} plots in the file (${wheres.join(', ')}).` });
  }
  if (r.spacingBroken && r.nearestPlot && !r.samePosition.some((o) => o.index === r.nearestPlot!.index)) {
    out.push({ code: 'spacing', text: `Plot ${id} is ${m(r.nearestPlot.distanceM)} from plot ${r.nearestPlot.id}, closer than the ${limit(c.spacingM)} minimum spacing.` });
  }
  return out.sort((a, b) => PLOT_PROBLEM_CODES.indexOf(a.code) - PLOT_PROBLEM_CODES.indexOf(b.code));
}

/** Severity of a plot's problems: 0 when it passes, else higher for the more serious (excluded ground highest). */
export function plotCheckSeverity(problems: readonly PlotProblem[]): number {
  if (problems.length === 0) return 0;
  const worst = Math.min(...problems.map((p) => PLOT_PROBLEM_CODES.indexOf(p.code)));
  return PLOT_PROBLEM_CODES.length - worst;
}
