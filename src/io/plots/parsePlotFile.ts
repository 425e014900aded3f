import type { PlotCollection } from '../../core/model/designTypes';
import { footprintAreaM2 } from '../../core/design/footprintParse';
import { jsonDepthOver, limitExceeded, limitNumber, limitText, MAX_AREA_M2, MAX_DESIGN_PLOTS, MAX_ID_LENGTH, MAX_NAME_LENGTH, MAX_NESTING_DEPTH } from '../../core/common/inputLimits';
import { InputError } from '../../core/common/InputError';
import { PLOT_DERIVED_FIELDS } from '../../core/field/plotCollectionForField';
import { plotVisitFieldsCheck } from './plotVisitFieldsCheck';

/**
 * Reads a plot file as `stratplot plan` writes it: a GeoJSON FeatureCollection of points whose
 * properties carry plot_id, stratum, role and rank, with the design summary in `design`. The
 * plots' field state (status, reject_reason, rejected_at, replaces) is kept as it is; the fields
 * worked out from it for people (field_state, field_note) are dropped, so a copy never drives
 * anything: writers work them out again. A crew's visit record (visited_at, the visit position,
 * field_values, crew_note) is kept too, checked by plotVisitFieldsCheck.
 * @throws InputError naming the file (and feature index) when the text is not JSON, not a
 *   FeatureCollection, has no design summary with an allocation table and footprint, states an
 *   area that is not a finite number within the Earth's surface or a footprint of no known shape,
 *   or a feature lacks plot_id, stratum, role (primary|reserve), rank or a Point position in
 *   WGS84 ranges; and for ids, names, plot counts or nesting beyond the limits in inputLimits
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
  if (jsonDepthOver(fc, MAX_NESTING_DEPTH + 4)) {
    throw limitExceeded(fileName, `its members are nested more than ${MAX_NESTING_DEPTH + 4} deep`, `${MAX_NESTING_DEPTH + 4} levels`);
  }
  if (fc.features.length > MAX_DESIGN_PLOTS) throw limitExceeded(fileName, `${limitNumber(fc.features.length)} plots`, `${limitNumber(MAX_DESIGN_PLOTS)} plots in one design`);
  if (!(footprintAreaM2(design.settings.footprint) >= 0)) {
    throw new InputError(`${fileName}: the design's footprint is not a known shape with sizes in metres; give the plot file that stratplot plan wrote`);
  }
  design.allocation.forEach((row, i) => {
    if (typeof row?.stratum !== 'string' || !(row.usable_m2 >= 0) || !(row.mapped_m2 >= 0)) {
      throw new InputError(`${fileName}: design allocation row ${i} needs stratum, mapped_m2 and usable_m2`);
    }
    // An area beyond the Earth's surface is damage; left in, the weights would overflow and the estimate read 0.
    if (!(row.usable_m2 <= MAX_AREA_M2) || !(row.mapped_m2 <= MAX_AREA_M2)) {
      throw new InputError(`${fileName}: design allocation row ${i} ("${row.stratum.slice(0, 60)}") states an area larger than the Earth's surface (${MAX_AREA_M2} m²)`);
    }
    limitText(row.stratum, MAX_NAME_LENGTH, `${fileName}: design allocation row ${i}`, 'its stratum name');
  });
  fc.features.forEach((f, i) => {
    const p = f?.properties as unknown as Record<string, unknown> | null | undefined;
    if (!p) throw new InputError(`${fileName}: feature ${i} has no properties`);
    for (const key of ['plot_id', 'stratum'] as const) {
      if (typeof p[key] !== 'string' || p[key] === '') throw new InputError(`${fileName}: feature ${i} has no ${key}`);
    }
    limitText(p.plot_id as string, MAX_ID_LENGTH, `${fileName}: feature ${i}`, 'its plot_id');
    limitText(p.stratum as string, MAX_NAME_LENGTH, `${fileName}: feature ${i}`, 'its stratum');
    const g = f.geometry as { type?: unknown; coordinates?: unknown } | null | undefined;
    const c = g?.type === 'Point' && Array.isArray(g.coordinates) ? (g.coordinates as unknown[]) : null;
    if (!c || typeof c[0] !== 'number' || typeof c[1] !== 'number' || !(Math.abs(c[0]) <= 180) || !(Math.abs(c[1]) <= 90)) {
      throw new InputError(`${fileName}: feature ${i} (${p.plot_id}) has no Point position in WGS84 longitude/latitude; every plot needs one`);
    }
    if (p.role !== 'primary' && p.role !== 'reserve') {
      throw new InputError(`${fileName}: feature ${i} (${p.plot_id}) has role ${JSON.stringify(p.role)}; expected primary or reserve`);
    }
    if (typeof p.rank !== 'number' || !Number.isFinite(p.rank)) throw new InputError(`${fileName}: feature ${i} (${p.plot_id}) has no rank`);
    if (p.status !== undefined && p.status !== 'planned' && p.status !== 'rejected' && p.status !== 'promoted') {
      throw new InputError(`${fileName}: feature ${i} (${p.plot_id}) has status ${JSON.stringify(p.status)}; expected planned, rejected or promoted`);
    }
    for (const k of PLOT_DERIVED_FIELDS) delete p[k];
  });
  plotVisitFieldsCheck(fc.features, fileName);
  return fc as PlotCollection;
}
