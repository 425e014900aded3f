import type { PlotCollection } from '../core/model/designTypes';
import type { StratumInfo } from '../core/model/types';
import { STRATUM_PALETTE } from '../io/site/strataFromFeatures';
import { stratumCodeDerive } from '../io/site/stratumCodeDerive';
import type { PlanFile } from './planFileTypes';
import { PLAN_FILE_VERSION } from './planFileTypes';
import { siteEmpty } from './plannerStore';

/**
 * A plan made from a plot file written by `stratplot plan` (read by parsePlotFile), so the field
 * view can walk it: its strata named as the plots name them (with their codes, or codes derived),
 * no mapped parts or exclusions (the plot file carries none: hazard warnings need the plan file),
 * the design's settings, and the plots with their field state and visits as the file holds them.
 */
export function planFromPlotFile(collection: PlotCollection, fileName: string): PlanFile {
  const strata: StratumInfo[] = [];
  const codes = new Set<string>();
  const add = (name: string, code: string | undefined) => {
    if (strata.some((s) => s.key === name)) return;
    const c = code && !codes.has(code) ? code : stratumCodeDerive(name, codes);
    codes.add(c);
    strata.push({ key: name, label: name, code: c, colour: STRATUM_PALETTE[strata.length % STRATUM_PALETTE.length] });
  };
  for (const f of collection.features) add(f.properties.stratum, f.properties.stratum_code);
  for (const row of collection.design.allocation) add(row.stratum, undefined);
  const site = { ...siteEmpty(fileName.replace(/\.(geo)?json$/i, '')), strata };
  return { format: 'stratplot-plan', version: PLAN_FILE_VERSION, savedAt: '', site, design: collection.design.settings, result: collection };
}
