import type { PlotCollection } from '../core/model/designTypes';
import { PLAN_FILE_VERSION } from './planFileTypes';
import { InputError } from '../core/common/InputError';
import { plotCollectionNamed } from '../core/field/plotCollectionNamed';
import type { StratumInfo } from '../core/model/types';

function isObject(v: unknown): v is Record<string, unknown> {
  return typeof v === 'object' && v !== null && !Array.isArray(v);
}

/**
 * Plan-file JSON of version 1 (strata as key/label, field decisions kept twice: a `rejections`
 * list beside the plots' statuses) brought to version 2: strata as { id, name, code, colour },
 * parts naming their stratum by `stratum_id`, the result named as a plot file with `stratum_id` on every plot and allocation row, and each
 * rejection's time written onto its plot (`rejected_at`) so the plots' field state is the one
 * record; where the list knew a decision the plots did not, the plots take it. Pure; returns
 * new objects. Throws InputError naming the file for a list or plot collection of the wrong shape.
 */
export function planFileMigrateV1(data: Record<string, unknown>, fileName: string): Record<string, unknown> {
  const site = isObject(data.site) ? data.site : {};
  const strataIn = Array.isArray(site.strata) ? site.strata : [];
  const infos: StratumInfo[] = strataIn.map((s, i) => {
    if (!isObject(s) || typeof s.key !== 'string') throw new InputError(`${fileName}: site.strata[${i}] has no key`);
    const label = typeof s.label === 'string' && s.label.trim() ? s.label : s.key;
    return { key: s.key, label, code: typeof s.code === 'string' ? s.code : '', colour: typeof s.colour === 'string' ? s.colour : '#777777' };
  });
  const rejections = data.rejections ?? [];
  if (!Array.isArray(rejections)) throw new InputError(`${fileName}: "rejections" must be a list`);
  let result = data.result ?? null;
  if (result !== null) {
    if (!isObject(result) || !Array.isArray(result.features)) throw new InputError(`${fileName}: "result" is not a plot collection`);
    const plots = result as unknown as PlotCollection;
    const byId = new Map(plots.features.map((f, i) => [f?.properties?.plot_id, i]));
    const features = plots.features.map((f) => ({ ...f, properties: { ...f.properties } }));
    rejections.forEach((r, i) => {
      if (!isObject(r) || typeof r.plot_id !== 'string') throw new InputError(`${fileName}: rejections[${i}] has no plot_id`);
      const at = byId.get(r.plot_id);
      if (at === undefined) return;
      const p = features[at].properties;
      if (p.status !== 'rejected') {
        p.status = 'rejected';
        if (typeof r.reason === 'string') p.reject_reason = r.reason;
      }
      if (typeof r.at === 'string' && p.rejected_at === undefined) p.rejected_at = r.at;
      const by = typeof r.replacement === 'string' ? byId.get(r.replacement) : undefined;
      if (by !== undefined && !features[by].properties.replaces) {
        features[by].properties.status = features[by].properties.status === 'rejected' ? 'rejected' : 'promoted';
        features[by].properties.replaces = r.plot_id;
      }
    });
    result = plotCollectionNamed({ ...plots, features }, infos, { ids: true });
  }
  const partsIn = Array.isArray(site.parts) ? site.parts : [];
  const parts = partsIn.map((p, i) => {
    if (!isObject(p) || typeof p.stratum !== 'string') throw new InputError(`${fileName}: site.parts[${i}] needs a stratum name and a geometry`);
    const { stratum, ...rest } = p;
    return { ...rest, stratum_id: stratum };
  });
  const { rejections: _dropped, ...rest } = data;
  return {
    ...rest,
    version: PLAN_FILE_VERSION,
    site: { ...site, strata: infos.map((s) => ({ id: s.key, name: s.label, code: s.code, colour: s.colour })), parts },
    result,
  };
}
