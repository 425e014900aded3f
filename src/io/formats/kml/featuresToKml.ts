import type { Feature, FeatureCollection, Geometry, Position } from 'geojson';
import { zipSync } from 'fflate';
import { EXCLUSION_COLOURS } from '../../../core/site/exclusionColours';
import { InputError } from '../../../core/common/InputError';
import { PLOT_FIELD_STATE_KEYS, type PlotFieldStateKey } from '../../../core/field/plotFieldState';
import { PLOT_SYMBOLS } from '../../../core/field/plotSymbols';
import type { ExclusionKind } from '../../../core/model/types';
import { plotIconPng } from '../../common/plotIcons';
import { xmlDecimal, xmlText } from '../../common/xmlText';

/** One folder of a KML document. */
export interface KmlLayer {
  name: string;
  features: FeatureCollection;
}

/** Options of {@link featuresToKml} and {@link featuresToKmz}. */
export interface KmlWriteOptions {
  /** Document name (e.g. the site). */
  name?: string;
  /** Document description (e.g. the safety note). */
  description?: string;
  /** Icon hrefs for the plot field states (set by the KMZ writer to its embedded icons). */
  iconHref?: Record<PlotFieldStateKey, string>;
}

/** Name of the typed field list every stratplot KML carries; the reader uses it to keep only our fields. */
export const KML_SCHEMA_ID = 'stratplot-fields';

const AREA_DEFAULT = '#4f7a55';
const LINE_DEFAULT = '#3d4852';

/** KML colour aabbggrr from #rrggbb and an alpha byte (OGC KML 2.2, kml:colorType). */
function kmlColour(hex: string, alpha: number): string {
  const a = alpha.toString(16).padStart(2, '0');
  return `${a}${hex.slice(5, 7)}${hex.slice(3, 5)}${hex.slice(1, 3)}`.toLowerCase();
}

function isHexColour(v: unknown): v is string {
  return typeof v === 'string' && /^#[0-9a-fA-F]{6}$/.test(v);
}

/** The field state a plot feature is styled by: its `field_state`, else its status and role. */
function plotStateOf(p: Record<string, unknown>): PlotFieldStateKey | null {
  if (p.role !== 'primary' && p.role !== 'reserve') return null;
  if (typeof p.field_state === 'string' && (PLOT_FIELD_STATE_KEYS as readonly string[]).includes(p.field_state)) return p.field_state as PlotFieldStateKey;
  if (p.status === 'rejected') return 'rejected';
  if (p.status === 'promoted') return 'promoted';
  return p.role;
}

function exclusionColour(kind: unknown): string {
  return EXCLUSION_COLOURS[kind as ExclusionKind] ?? EXCLUSION_COLOURS.other;
}

function styleOf(f: Feature): { id: string; xml: string } {
  const p = f.properties ?? {};
  const type = f.geometry?.type ?? 'Point';
  const state = plotStateOf(p);
  if (state) return { id: `sp-plot-${state}`, xml: '' };
  const isExclusion = typeof p.kind === 'string' && typeof p.buffer_m !== 'undefined';
  const colour = isExclusion ? exclusionColour(p.kind) : isHexColour(p.colour) ? p.colour : isHexColour(p.color) ? p.color : null;
  const area = type === 'Polygon' || type === 'MultiPolygon';
  const base = colour ?? (area ? AREA_DEFAULT : LINE_DEFAULT);
  const id = isExclusion ? `sp-excl-${String(p.kind)}` : `sp-${area ? 'area' : 'line'}-${base.slice(1).toLowerCase()}`;
  const width = isExclusion ? 3 : 2;
  const xml =
    `<Style id="${id}"><IconStyle><color>${kmlColour(base, 0xff)}</color><scale>0.9</scale></IconStyle>` +
    `<LineStyle><color>${kmlColour(base, 0xff)}</color><width>${width}</width></LineStyle>` +
    `<PolyStyle><color>${kmlColour(base, isExclusion ? 0x59 : 0x40)}</color></PolyStyle></Style>`;
  return { id, xml };
}

// Without embedded icons a KML viewer tints its own marker: use the symbol's main colour.
function plotStyles(iconHref?: KmlWriteOptions['iconHref']): string {
  return PLOT_FIELD_STATE_KEYS.map((key) => {
    const sym = PLOT_SYMBOLS[key];
    const icon = iconHref ? `<Icon><href>${xmlText(iconHref[key])}</href></Icon>` : '';
    // Solid symbols tint by their fill, open ones white (reserve) or by their ink (rejected, grey).
    const tint = kmlColour(sym.solid ? sym.fill : key === 'reserve' ? '#ffffff' : sym.ink, 0xff);
    const scale = key === 'primary' || key === 'promoted' ? 1 : 0.8;
    return `<Style id="sp-plot-${key}"><IconStyle><color>${iconHref ? 'ffffffff' : tint}</color><scale>${scale}</scale>${icon}</IconStyle><LabelStyle><color>${kmlColour(sym.solid ? sym.fill : sym.ink, 0xff)}</color><scale>0.8</scale></LabelStyle></Style>`;
  }).join('\n');
}

function coords(ps: Position[], where: string): string {
  return ps
    .map((p) => {
      if (!(Math.abs(p[1]) <= 90 && Math.abs(p[0]) <= 180)) throw new InputError(`${where}: position ${p[0]}, ${p[1]} is not a WGS84 longitude/latitude`);
      return p.length > 2 && Number.isFinite(p[2]) ? `${xmlDecimal(p[0])},${xmlDecimal(p[1])},${xmlDecimal(p[2])}` : `${xmlDecimal(p[0])},${xmlDecimal(p[1])}`;
    })
    .join(' ');
}

function closedRing(r: Position[]): Position[] {
  const a = r[0];
  const b = r[r.length - 1];
  return a[0] !== b[0] || a[1] !== b[1] ? [...r, a] : r;
}

function polygonXml(rings: Position[][], where: string): string {
  if (rings.some((r) => closedRing(r).length < 4)) throw new InputError(`${where}: a polygon ring has fewer than 3 distinct positions`);
  const [outer, ...inner] = rings.map((r) => `<LinearRing><coordinates>${coords(closedRing(r), where)}</coordinates></LinearRing>`);
  return `<Polygon><tessellate>1</tessellate><outerBoundaryIs>${outer}</outerBoundaryIs>${inner.map((r) => `<innerBoundaryIs>${r}</innerBoundaryIs>`).join('')}</Polygon>`;
}

function geometryXml(g: Geometry, where: string): string {
  switch (g.type) {
    case 'Point':
      return `<Point><coordinates>${coords([g.coordinates], where)}</coordinates></Point>`;
    case 'MultiPoint':
      return `<MultiGeometry>${g.coordinates.map((p) => geometryXml({ type: 'Point', coordinates: p }, where)).join('')}</MultiGeometry>`;
    case 'LineString':
      return `<LineString><tessellate>1</tessellate><coordinates>${coords(g.coordinates, where)}</coordinates></LineString>`;
    case 'MultiLineString':
      return `<MultiGeometry>${g.coordinates.map((l) => geometryXml({ type: 'LineString', coordinates: l }, where)).join('')}</MultiGeometry>`;
    case 'Polygon':
      return polygonXml(g.coordinates, where);
    case 'MultiPolygon':
      return `<MultiGeometry>${g.coordinates.map((p) => polygonXml(p, where)).join('')}</MultiGeometry>`;
    case 'GeometryCollection':
      return `<MultiGeometry>${g.geometries.map((x) => geometryXml(x, where)).join('')}</MultiGeometry>`;
  }
}

function fieldTypes(layers: KmlLayer[]): Map<string, 'double' | 'string'> {
  const types = new Map<string, 'double' | 'string'>();
  for (const l of layers) {
    for (const f of l.features.features) {
      for (const [k, v] of Object.entries(f.properties ?? {})) {
        if (v === null || v === undefined) continue;
        const t = typeof v === 'number' && Number.isFinite(v) ? 'double' : 'string';
        types.set(k, types.get(k) === 'string' ? 'string' : t);
      }
    }
  }
  return types;
}

function labelOf(f: Feature, index: number): string {
  const p = f.properties ?? {};
  const state = plotStateOf(p);
  if (state && typeof p.plot_id === 'string') {
    // The name is what a phone lists: say which plots are not to be visited as they are.
    if (state === 'rejected') return `${p.plot_id} REJECTED`;
    if (state === 'promoted') return typeof p.replaces === 'string' ? `${p.plot_id} (replaces ${p.replaces})` : `${p.plot_id} (promoted)`;
    if (state === 'reserve') return `${p.plot_id} (reserve)`;
    return p.plot_id;
  }
  const v = p.plot_id ?? p.name ?? p.label ?? p.stratum ?? p.kind ?? f.id ?? `feature ${index + 1}`;
  return String(v);
}

function descriptionOf(p: Record<string, unknown>): string {
  const parts = [p.field_note, p.notes].filter((v): v is string => typeof v === 'string' && v.trim() !== '');
  return parts.join(' ');
}

/**
 * A KML 2.2 document (namespace http://www.opengis.net/kml/2.2) with one Folder per layer. Every
 * property is written as typed SchemaData under one Schema, so numbers come back as numbers;
 * plots get the style of their field state (the shared symbol code of core/plotSymbols: primary,
 * reserve, promoted, rejected), a name that says a plot is rejected, a reserve or replaces
 * another, and their `field_note` and notes as description; strata their `colour` (or a
 * default); exclusions the planner's colour of their kind. Rings are closed (≥ 4 positions), coordinates are lon,lat[,alt] tuples, and child
 * elements follow the order of the OGC KML 2.2 schema (OGC 07-147r2). Throws InputError naming the
 * layer and feature for a ring with fewer than 3 distinct positions or a non-WGS84 position.
 */
export function featuresToKml(layers: KmlLayer[] | FeatureCollection, options: KmlWriteOptions = {}): string {
  const list = Array.isArray(layers) ? layers : [{ name: options.name ?? 'features', features: layers }];
  const types = fieldTypes(list);
  const styles = new Map<string, string>();
  const folders = list.map((layer) => {
    const placemarks = layer.features.features.map((f, i) => {
      const where = `${layer.name}: feature ${i}`;
      const style = styleOf(f);
      if (style.xml) styles.set(style.id, style.xml);
      const data = Object.entries(f.properties ?? {})
        .filter(([, v]) => v !== null && v !== undefined)
        .map(([k, v]) => `<SimpleData name="${xmlText(k)}">${xmlText(typeof v === 'object' ? JSON.stringify(v) : v)}</SimpleData>`)
        .join('');
      const geometry = f.geometry ? geometryXml(f.geometry, where) : '';
      const text = descriptionOf(f.properties ?? {});
      const description = text ? `<description>${xmlText(text)}</description>` : '';
      return (
        `    <Placemark><name>${xmlText(labelOf(f, i))}</name>${description}<styleUrl>#${style.id}</styleUrl>` +
        `<ExtendedData><SchemaData schemaUrl="#${KML_SCHEMA_ID}">${data}</SchemaData></ExtendedData>${geometry}</Placemark>`
      );
    });
    return `  <Folder><name>${xmlText(layer.name)}</name>\n${placemarks.join('\n')}\n  </Folder>`;
  });
  const schema = `<Schema name="${KML_SCHEMA_ID}" id="${KML_SCHEMA_ID}">${[...types]
    .map(([k, t]) => `<SimpleField type="${t}" name="${xmlText(k)}"></SimpleField>`)
    .join('')}</Schema>`;
  return (
    '<?xml version="1.0" encoding="UTF-8"?>\n<kml xmlns="http://www.opengis.net/kml/2.2">\n<Document>\n' +
    `<name>${xmlText(options.name ?? 'stratplot')}</name>\n` +
    (options.description ? `<description>${xmlText(options.description)}</description>\n` : '') +
    `${plotStyles(options.iconHref)}\n${[...styles.values()].join('\n')}\n${schema}\n` +
    `${folders.join('\n')}\n</Document>\n</kml>\n`
  );
}

/**
 * A KMZ (zip of doc.kml plus our plot icons under files/) of the same document as
 * {@link featuresToKml}. Source: OGC KML 2.2 (OGC 07-147r2) §6.2 KMZ packaging.
 */
export function featuresToKmz(layers: KmlLayer[] | FeatureCollection, options: KmlWriteOptions = {}): Uint8Array {
  const iconHref = Object.fromEntries(PLOT_FIELD_STATE_KEYS.map((k) => [k, `files/plot-${k}.png`])) as Record<PlotFieldStateKey, string>;
  const kml = featuresToKml(layers, { ...options, iconHref });
  const files: Record<string, Uint8Array> = { 'doc.kml': new TextEncoder().encode(kml) };
  for (const k of PLOT_FIELD_STATE_KEYS) files[iconHref[k]] = plotIconPng(k);
  return zipSync(files, { level: 6, mtime: new Date('2000-01-01T00:00:00Z') });
}
