import { type F, type Folder, kmlWithFolders } from '@tmcw/togeojson';
import type { Feature, FeatureCollection, Geometry, Position } from 'geojson';
import { InputError } from '../../../core/common/InputError';
import { KML_SCHEMA_ID } from './featuresToKml';
import type { ImportOptions } from '../../common/importOptions';
import { xmlParse } from '../../common/xmlParse';
import { zipEntries } from '../../common/zipEntries';

/** Properties togeojson derives from KML styles rather than from the data. */
const STYLE_KEYS = [
  'styleUrl', 'styleHash', 'styleMapHash', 'stroke', 'stroke-opacity', 'stroke-width', 'fill', 'fill-opacity',
  'icon', 'icon-color', 'icon-opacity', 'icon-scale', 'icon-heading', 'icon-offset', 'icon-offset-units',
  'label-color', 'label-opacity', 'label-scale', 'visibility', 'open', 'coordinateProperties',
];

function isZip(bytes: Uint8Array): boolean {
  return bytes[0] === 0x50 && bytes[1] === 0x4b && bytes[2] === 0x03 && bytes[3] === 0x04;
}

/** The KML text of a .kml file or of the main document inside a .kmz (doc.kml, else the first .kml at the top). */
function kmlText(fileName: string, bytes: Uint8Array): string {
  if (!isZip(bytes)) return new TextDecoder().decode(bytes);
  const entries = zipEntries(fileName, bytes, (p) => p.toLowerCase().endsWith('.kml'));
  const names = Object.keys(entries).filter((p) => p.toLowerCase().endsWith('.kml'));
  const main = names.find((p) => p.toLowerCase() === 'doc.kml') ?? names.sort((a, b) => a.split('/').length - b.split('/').length)[0];
  if (!main) throw new InputError(`${fileName}: the KMZ archive holds no .kml document`);
  return new TextDecoder().decode(entries[main]);
}

type Row = Record<string, unknown>;

/** Typed SimpleData of each Placemark in document order, for files carrying our Schema; else null. */
function ourRows(doc: Document): Row[] | null {
  const schema = Array.from(doc.getElementsByTagName('Schema')).find((s) => s.getAttribute('id') === KML_SCHEMA_ID);
  if (!schema) return null;
  const numeric = new Set(
    Array.from(schema.getElementsByTagName('SimpleField'))
      .filter((f) => f.getAttribute('type') === 'double')
      .map((f) => f.getAttribute('name') ?? ''),
  );
  return Array.from(doc.getElementsByTagName('Placemark')).map((pm) => {
    const row: Row = {};
    for (const d of Array.from(pm.getElementsByTagName('SimpleData'))) {
      const name = d.getAttribute('name') ?? '';
      const text = d.textContent ?? '';
      row[name] = numeric.has(name) ? Number(text) : text;
    }
    return row;
  });
}

/** A KML number (xsd:double as written in <coordinates>): no hexadecimal, no "NaN", no empty text. */
const KML_NUMBER = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

/**
 * Every tuple of every <coordinates> must be lon,lat[,alt] numbers in range (OGC KML 2.2 §16.9:
 * tuples separated by white space, values by commas, no spaces inside a tuple); togeojson drops or
 * misreads a tuple it cannot parse, which turns a square into a triangle without a word.
 */
function coordinatesChecked(fileName: string, doc: Document): void {
  const placemarks = Array.from(doc.getElementsByTagName('Placemark'));
  placemarks.forEach((pm, index) => {
    polygonRingsChecked(fileName, pm, index);
    for (const el of Array.from(pm.getElementsByTagName('coordinates'))) {
      const tuples = (el.textContent ?? '').trim().split(/\s+/).filter((t) => t !== '');
      tuples.forEach((tuple, k) => {
        const values = tuple.split(',');
        const numbers = values.map(Number);
        const ok =
          (values.length === 2 || values.length === 3) &&
          values.every((v) => KML_NUMBER.test(v)) &&
          Math.abs(numbers[0]) <= 180 &&
          Math.abs(numbers[1]) <= 90;
        if (ok) return;
        const shown = tuple.length > 40 ? `${tuple.slice(0, 40)}…` : tuple;
        throw new InputError(`${fileName}: ${placemarkShown(pm, index)}: coordinate ${k + 1} "${shown}" is not longitude,latitude[,altitude] in WGS84 degrees`);
      });
    }
  });
}

/** "placemark 3 ("Heath")" for messages. */
function placemarkShown(pm: Element, index: number): string {
  const name = pm.getElementsByTagName('name')[0]?.textContent?.trim();
  return `placemark ${index}${name ? ` ("${name.slice(0, 60)}")` : ''}`;
}

/**
 * Each Polygon must have one outer ring first, then holes, each a LinearRing inside
 * <outerBoundaryIs> or <innerBoundaryIs> (OGC KML 2.2 §10.8), with at least 4 positions once closed:
 * togeojson takes every LinearRing in document order as outer-then-holes and drops a ring of fewer
 * positions, so a misplaced or short ring would change the area without a word.
 */
function polygonRingsChecked(fileName: string, pm: Element, index: number): void {
  for (const polygon of Array.from(pm.getElementsByTagName('Polygon'))) {
    const rings = Array.from(polygon.getElementsByTagName('LinearRing'));
    rings.forEach((ring, k) => {
      const holder = (ring.parentNode as Element | null)?.localName;
      const where = `${fileName}: ${placemarkShown(pm, index)}: ring ${k}`;
      if (holder !== 'outerBoundaryIs' && holder !== 'innerBoundaryIs') {
        throw new InputError(`${where} is not inside <outerBoundaryIs> or <innerBoundaryIs> (it is in <${holder ?? '?'}>)`);
      }
      if ((holder === 'outerBoundaryIs') !== (k === 0)) {
        throw new InputError(`${where}: a Polygon needs exactly one outer boundary, before its inner boundaries`);
      }
      const text = Array.from(ring.getElementsByTagName('coordinates')).map((c) => c.textContent ?? '').join(' ');
      const tuples = text.trim().split(/\s+/).filter((t) => t !== '');
      const closed = tuples.length > 0 && tuples[0] === tuples[tuples.length - 1];
      const positions = tuples.length + (closed ? 0 : 1);
      if (tuples.length === 0 || positions < 4) {
        throw new InputError(`${where} has ${tuples.length} positions; a ring needs at least 3 corners and the closing position`);
      }
    });
  }
}

function kmlDocument(fileName: string, bytes: Uint8Array): { doc: Document; ours: Row[] | null } {
  const doc = xmlParse(fileName, kmlText(fileName, bytes));
  if (doc.documentElement?.localName !== 'kml') {
    throw new InputError(`${fileName}: not a KML file (the root element is <${doc.documentElement?.nodeName}>, not <kml>)`);
  }
  coordinatesChecked(fileName, doc);
  return { doc, ours: ourRows(doc) };
}

/** A KML MultiGeometry of one kind as the matching GeoJSON Multi* geometry; mixed ones stay collections. */
function multiFromCollection(g: Geometry | null): Geometry | null {
  if (g?.type !== 'GeometryCollection' || g.geometries.length === 0) return g;
  const parts = g.geometries.map(multiFromCollection) as Geometry[];
  const kinds = new Set(parts.map((p) => p.type.replace(/^Multi/, '')));
  if (kinds.size !== 1) return { type: 'GeometryCollection', geometries: parts };
  const flat = <T>(p: Geometry): T[] => ('coordinates' in p ? (p.type.startsWith('Multi') ? p.coordinates : [p.coordinates]) : []) as T[];
  switch ([...kinds][0]) {
    case 'Point':
      return { type: 'MultiPoint', coordinates: parts.flatMap((p) => flat<Position>(p)) };
    case 'LineString':
      return { type: 'MultiLineString', coordinates: parts.flatMap((p) => flat<Position[]>(p)) };
    case 'Polygon':
      return { type: 'MultiPolygon', coordinates: parts.flatMap((p) => flat<Position[][]>(p)) };
    default:
      return { type: 'GeometryCollection', geometries: parts };
  }
}

/** togeojson turns unreadable <coordinates> into NaN or drops them; say so instead. */
function checkPositions(fileName: string, index: number, f: F): void {
  const bad = (c: unknown): boolean => {
    if (typeof (c as number[])[0] !== 'number') return (c as unknown[]).some(bad);
    const [lon, lat] = c as number[];
    return !(Math.abs(lat) <= 90 && Math.abs(lon) <= 180);
  };
  const g = f.geometry;
  const coords = g && 'coordinates' in g ? g.coordinates : g?.type === 'GeometryCollection' ? g.geometries.map((x) => ('coordinates' in x ? x.coordinates : [])) : null;
  if (coords && bad(coords)) {
    const name = f.properties?.name ? ` ("${f.properties.name}")` : '';
    throw new InputError(`${fileName}: placemark ${index}${name}: a coordinate is not a WGS84 longitude,latitude`);
  }
}

/** Walks folders depth-first (document order), numbering placemarks in `order`. */
function collect(children: (Folder | F)[], path: string, out: Map<string, F[]>, all: F[], order = new Map<F, number>()): void {
  for (const child of children) {
    if (child.type === 'folder') {
      const name = String(child.meta.name ?? 'unnamed folder');
      const p = path ? `${path}/${name}` : name;
      const own: F[] = [];
      collect(child.children, p, out, own, order);
      // Loops, not spreads: a folder may hold more placemarks than a call can take arguments.
      const kept = out.get(p) ?? [];
      for (const f of own) kept.push(f);
      out.set(p, kept);
      for (const f of own) all.push(f);
    } else {
      order.set(child, order.size);
      all.push(child);
    }
  }
}

/** Folder paths ("Plots", "Site/Strata") of a KML or KMZ file, in document order. */
export function kmlLayers(fileName: string, bytes: Uint8Array): string[] {
  const folders = new Map<string, F[]>();
  collect(kmlWithFolders(kmlDocument(fileName, bytes).doc).children, '', folders, []);
  return [...folders.keys()];
}

/**
 * Reads KML 2.2 or KMZ (via @tmcw/togeojson) as WGS84 GeoJSON: all placemarks, or those under
 * the folder `options.layer` (a path like "Site/Strata"). In files stratplot wrote, properties
 * are exactly the typed SchemaData of each placemark; in others, name, description and ExtendedData, without the style
 * values togeojson adds. A MultiGeometry of one kind becomes the matching Multi* geometry. Throws InputError naming `fileName` for text that is not KML, an empty
 * KMZ, or an unknown folder (listing the folders).
 */
export async function parseKml(fileName: string, bytes: Uint8Array, options: ImportOptions = {}): Promise<FeatureCollection> {
  const { doc, ours } = kmlDocument(fileName, bytes);
  const folders = new Map<string, F[]>();
  const all: F[] = [];
  const order = new Map<F, number>();
  collect(kmlWithFolders(doc).children, '', folders, all, order);
  let chosen = all;
  if (options.layer !== undefined) {
    const hit = folders.get(options.layer) ?? [...folders].find(([k]) => k.toLowerCase() === options.layer!.toLowerCase())?.[1];
    if (!hit) throw new InputError(`${fileName}: no folder "${options.layer}"; folders are: ${[...folders.keys()].join(', ') || '(none)'}`);
    chosen = hit;
  }
  const features: Feature[] = chosen.map((f, i) => {
    checkPositions(fileName, i, f);
    const raw = { ...(f.properties ?? {}) } as Record<string, unknown>;
    let properties: Record<string, unknown>;
    if (ours) {
      properties = ours[order.get(f) ?? -1] ?? {};
    } else {
      properties = raw;
      for (const k of STYLE_KEYS) delete properties[k];
    }
    return { type: 'Feature', properties, geometry: multiFromCollection(f.geometry) as Geometry };
  });
  return { type: 'FeatureCollection', features };
}
