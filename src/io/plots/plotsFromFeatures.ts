import type { FeatureCollection, Position } from 'geojson';
import { InputError } from '../../core/common/InputError';
import type { PlotToCheck } from '../../core/plotCheck/plotCheckTypes';

/** Properties tried, in order (any letter case), for a plot's id when no field is named. */
export const PLOT_ID_FIELDS = ['plot_id', 'plotid', 'plot', 'id', 'name', 'label', 'title', 'ident'] as const;

/** Properties stratplot gives the site's own features in multi-layer files (access points, exclusions, strata). */
const SITE_LAYER_KEYS = ['access_id', 'exclusion_id', 'excl_id', 'part_id'];

/** Plots read from a map file, and what was left out and why. */
export interface PlotsRead {
  plots: PlotToCheck[];
  /** One line each, already naming the file: features that are not plots. */
  warnings: string[];
}

function text(v: unknown): string | null {
  if (typeof v === 'number' && Number.isFinite(v)) return String(v);
  if (typeof v === 'string' && v.trim() !== '') return v.trim();
  return null;
}

/**
 * The point features of a map file as plots to check (parseFeatureFile has made them WGS84), each
 * with its id or name from the file: the property `idField` when given, else the first of
 * {@link PLOT_ID_FIELDS} it carries, else the feature's own id, else where it is in the file
 * ("feature 3", or "row 4" of a CSV, counted as the readers count them). A MultiPoint gives one plot
 * per point ("id/1", "id/2"...). Lines, polygons and the access points and exclusions stratplot
 * writes beside plots in GPX, KML and other multi-layer files are left out, with a warning. The
 * `role`, `status` and `replaces` of stratplot plot files are kept.
 * @throws InputError naming the file when `idField` is on no feature or the file holds no points.
 */
export function plotsFromFeatures(fc: FeatureCollection, options: { fileName: string; idField?: string }): PlotsRead {
  const file = options.fileName;
  const isCsv = file.toLowerCase().endsWith('.csv');
  const plots: PlotToCheck[] = [];
  let other = 0;
  let site = 0;
  const idField = options.idField?.trim();
  if (idField !== undefined) {
    if (idField === '') throw new InputError('--id-field needs a property name');
    if (!fc.features.some((f) => f.properties && Object.hasOwn(f.properties, idField))) {
      const seen = [...new Set(fc.features.flatMap((f) => Object.keys(f.properties ?? {})))].slice(0, 20);
      throw new InputError(`${file}: no feature has the property "${idField}"; properties are: ${seen.join(', ') || '(none)'}`);
    }
  }
  fc.features.forEach((f, i) => {
    const g = f.geometry;
    const props = (f.properties ?? {}) as Record<string, unknown>;
    if (!g || (g.type !== 'Point' && g.type !== 'MultiPoint')) {
      other++;
      return;
    }
    if (SITE_LAYER_KEYS.some((k) => text(props[k]) !== null)) {
      site++;
      return;
    }
    const where = isCsv ? `row ${i + 1}` : `feature ${i}`;
    const lower = new Map(Object.keys(props).map((k) => [k.toLowerCase(), k]));
    const named = idField !== undefined ? text(props[idField]) : PLOT_ID_FIELDS.map((k) => text(props[lower.get(k) ?? ''])).find((v) => v !== null);
    const id = named ?? text(f.id) ?? where;
    const role = props.role === 'primary' || props.role === 'reserve' ? props.role : undefined;
    const status = props.status === 'planned' || props.status === 'rejected' || props.status === 'promoted' ? props.status : undefined;
    const replaces = text(props.replaces) ?? undefined;
    const points: Position[] = g.type === 'Point' ? [g.coordinates] : g.coordinates;
    points.forEach((c, k) => {
      plots.push({
        id: points.length > 1 ? `${id}/${k + 1}` : id,
        where: points.length > 1 ? `${where}, point ${k + 1}` : where,
        lon: c[0],
        lat: c[1],
        ...(role ? { role } : {}),
        ...(status ? { status } : {}),
        ...(replaces ? { replaces } : {}),
      });
    });
  });
  const warnings: string[] = [];
  if (other) warnings.push(`${file}: ${other} line or polygon feature${other === 1 ? ' was' : 's were'} not read: plots are points`);
  if (site) warnings.push(`${file}: ${site} access point or exclusion feature${site === 1 ? ' was' : 's were'} not read as plots`);
  if (plots.length === 0) throw new InputError(`${file}: no point features to check as plots${other ? ` (it holds ${other} lines or polygons)` : ''}`);
  return { plots, warnings };
}
