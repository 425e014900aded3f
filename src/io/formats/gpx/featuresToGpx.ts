import type { Feature, FeatureCollection, Position } from 'geojson';
import { InputError } from '../../../core/common/InputError';
import { xmlDecimal, xmlText } from '../../common/xmlText';

/** Namespace of stratplot's GPX extension elements (our own URN; GPX 1.1 allows any other namespace there). */
export const GPX_EXT_NS = 'urn:stratplot:gpx:1';

/** What a waypoint or track shows on a GPS unit, chosen per feature. */
export interface GpxLabels {
  name: string;
  cmt?: string;
  desc?: string;
  type?: string;
}

/** Options of {@link featuresToGpx}. */
export interface GpxWriteOptions {
  /** Name of the file's metadata (e.g. the site). */
  name?: string;
  /** Description in the file's metadata (e.g. the safety note). */
  description?: string;
  creator?: string;
  /** Labels per feature; default: name/plot_id/id, desc/stratum/kind, notes, role. */
  labels?: (f: Feature, index: number) => GpxLabels;
}

function str(v: unknown): string | undefined {
  return v === null || v === undefined || v === '' ? undefined : String(v);
}

function defaultLabels(f: Feature, index: number): GpxLabels {
  const p = f.properties ?? {};
  return {
    name: str(p.name) ?? str(p.plot_id) ?? str(p.id) ?? str(f.id) ?? `feature ${index + 1}`,
    cmt: str(p.notes) ?? str(p.cmt),
    desc: str(p.desc) ?? str(p.stratum) ?? str(p.kind),
    type: str(p.role) ?? str(p.kind) ?? str(p.type),
  };
}

function pt(tag: string, p: Position, indent: string, inner = ''): string {
  const ele = p.length > 2 && Number.isFinite(p[2]) ? `<ele>${xmlDecimal(p[2])}</ele>` : '';
  return `${indent}<${tag} lat="${xmlDecimal(p[1])}" lon="${xmlDecimal(p[0])}">${ele}${inner}</${tag}>`;
}

function labelXml(l: GpxLabels): string {
  return (['name', 'cmt', 'desc'] as const)
    .map((k) => (l[k] !== undefined ? `<${k}>${xmlText(l[k])}</${k}>` : ''))
    .join('');
}

function extensions(f: Feature, shape?: string): string {
  const props = `<sp:properties>${xmlText(JSON.stringify(f.properties ?? {}))}</sp:properties>`;
  const s = shape ? `<sp:shape>${shape}</sp:shape>` : '';
  return `<extensions>${props}${s}</extensions>`;
}

function closedRing(r: Position[]): Position[] {
  const a = r[0];
  const b = r[r.length - 1];
  return a && b && (a[0] !== b[0] || a[1] !== b[1]) ? [...r, a] : r;
}

/**
 * A GPX 1.1 document (valid against the Topografix GPX 1.1 schema) of any feature collection:
 * points as waypoints, lines as tracks, polygons as tracks with one closed segment per ring.
 * Each element also carries its full properties (and, for polygons, the ring layout) as JSON in
 * an `<extensions>` element of our own namespace, so stratplot reads it back exactly; other
 * readers ignore it. Source: GPX 1.1 Schema Documentation (topografix.com/GPX/1/1).
 * Throws InputError naming the feature for a GeometryCollection or a position outside ±90/±180.
 */
export function featuresToGpx(fc: FeatureCollection, options: GpxWriteOptions = {}): string {
  const labels = options.labels ?? defaultLabels;
  const wpts: string[] = [];
  const trks: string[] = [];
  fc.features.forEach((f, i) => {
    const g = f.geometry;
    if (!g) return;
    const check = (p: Position) => {
      if (!(Math.abs(p[1]) <= 90 && Math.abs(p[0]) <= 180)) {
        throw new InputError(`feature ${i}: position ${p[0]}, ${p[1]} is not a WGS84 longitude/latitude`);
      }
      return p;
    };
    const l = labels(f, i);
    const type = l.type !== undefined ? `<type>${xmlText(l.type)}</type>` : '';
    const trk = (segments: Position[][], shape?: string) => {
      const segs = segments.map((s) => `    <trkseg>\n${s.map((p) => pt('trkpt', check(p), '      ')).join('\n')}\n    </trkseg>`);
      trks.push(`  <trk>${labelXml(l)}${type}${extensions(f, shape)}\n${segs.join('\n')}\n  </trk>`);
    };
    switch (g.type) {
      case 'Point':
        wpts.push(pt('wpt', check(g.coordinates), '  ', `${labelXml(l)}${type}${extensions(f)}`));
        break;
      case 'MultiPoint':
        for (const p of g.coordinates) wpts.push(pt('wpt', check(p), '  ', `${labelXml(l)}${type}${extensions(f, `MultiPoint:${i}`)}`));
        break;
      case 'LineString':
        trk([g.coordinates]);
        break;
      case 'MultiLineString':
        trk(g.coordinates, 'MultiLineString');
        break;
      case 'Polygon':
        trk(g.coordinates.map(closedRing), `Polygon:${g.coordinates.length}`);
        break;
      case 'MultiPolygon':
        trk(g.coordinates.flat().map(closedRing), `MultiPolygon:${g.coordinates.map((p) => p.length).join(',')}`);
        break;
      default:
        throw new InputError(`feature ${i}: a GeometryCollection cannot be written to GPX; split it first`);
    }
  });
  const metaName = options.name ? `<name>${xmlText(options.name)}</name>` : '';
  const metaDesc = options.description ? `<desc>${xmlText(options.description)}</desc>` : '';
  const meta = metaName || metaDesc ? `  <metadata>${metaName}${metaDesc}</metadata>\n` : '';
  return (
    '<?xml version="1.0" encoding="UTF-8"?>\n' +
    `<gpx version="1.1" creator="${xmlText(options.creator ?? 'stratplot')}" xmlns="http://www.topografix.com/GPX/1/1" ` +
    `xmlns:sp="${GPX_EXT_NS}" xmlns:xsi="http://www.w3.org/2001/XMLSchema-instance" ` +
    'xsi:schemaLocation="http://www.topografix.com/GPX/1/1 http://www.topografix.com/GPX/1/1/gpx.xsd">\n' +
    meta +
    [...wpts, ...trks].map((s) => `${s}\n`).join('') +
    '</gpx>\n'
  );
}
