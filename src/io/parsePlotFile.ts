import type { PlotCollection } from '../core/designTypes';
import { InputError } from '../core/InputError';
import { PLOT_DERIVED_FIELDS } from '../core/plotCollectionForField';

/**
 * Reads a plot file as `stratplot plan` writes it: a GeoJSON FeatureCollection of points whose
 * properties carry plot_id, stratum, role and rank, with the design summary in `design`. The
 * plots' field state (status, reject_reason, rejected_at, replaces) is kept as it is; the fields
 * worked out from it for people (field_state, field_note) are dropped, so a copy never drives
 * anything: writers work them out again.
 * @throws InputError naming the file (and feature index) when the text is not JSON, not a
 *   FeatureCollection, has no design summary with an allocation table and footprint, or a feature
 *   lacks plot_id, stratum, role (primary|reserve) or rank
 */
export function parsePlotFile(fileName: string, bytes: Uint8Array | string): PlotCollection {
  const text = typeof bytes === 'string' ? bytes : new TextDecoder().decode(bytes);
  let data: unknown;
  try {
    data = JSON.parse(text.charCodeAt(0) === 0xfeff ? text.slice(1) : text);
  } catch (error) {
    throw new InputError(`${fileName}: not valid JSON (${(error as Error).message})`);
  }
  const fc = data as Partial<PlotCollection> | null;
  if (!fc || typeof fc !== 'object' || fc.type !== 'FeatureCollection' || !Array.isArray(fc.features)) {
    throw new InputError(`${fileName}: not a GeoJSON FeatureCollection of plots`);
  }
  const design = fc.design;
  if (!design || typeof design !== 'object' || !Array.isArray(design.allocation) || !design.settings?.footprint) {
    throw new InputError(`${fileName}: no "design" summary with an allocation table and footprint; give the plot file that stratplot plan wrote`);
  }
  design.allocation.forEach((row, i) => {
    if (typeof row?.stratum !== 'string' || !(row.usable_m2 >= 0) || !(row.mapped_m2 >= 0)) {
      throw new InputError(`${fileName}: design allocation row ${i} needs stratum, mapped_m2 and usable_m2`);
    }
  });
  fc.features.forEach((f, i) => {
    const p = f?.properties as unknown as Record<string, unknown> | null | undefined;
    if (!p) throw new InputError(`${fileName}: feature ${i} has no properties`);
    for (const key of ['plot_id', 'stratum'] as const) {
      if (typeof p[key] !== 'string' || p[key] === '') throw new InputError(`${fileName}: feature ${i} has no ${key}`);
    }
    if (p.role !== 'primary' && p.role !== 'reserve') {
      throw new InputError(`${fileName}: feature ${i} (${p.plot_id}) has role ${JSON.stringify(p.role)}; expected primary or reserve`);
    }
    if (typeof p.rank !== 'number') throw new InputError(`${fileName}: feature ${i} (${p.plot_id}) has no rank`);
    if (p.status !== undefined && p.status !== 'planned' && p.status !== 'rejected' && p.status !== 'promoted') {
      throw new InputError(`${fileName}: feature ${i} (${p.plot_id}) has status ${JSON.stringify(p.status)}; expected planned, rejected or promoted`);
    }
    for (const k of PLOT_DERIVED_FIELDS) delete p[k];
  });
  return fc as PlotCollection;
}
