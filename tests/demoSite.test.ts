import { execFileSync } from 'node:child_process';
import { existsSync, mkdtempSync, readdirSync, readFileSync, rmSync, statSync } from 'node:fs';
import { createRequire } from 'node:module';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { area, booleanPointInPolygon, buffer, difference, featureCollection, intersect } from '@turf/turf';
import { fromArrayBuffer } from 'geotiff';
import { feature as topoFeature } from 'topojson-client';
import type { Topology } from 'topojson-specification';
import type { Feature, FeatureCollection, LineString, MultiPolygon, Point, Polygon, Position } from 'geojson';
import { describe, expect, it } from 'vitest';
import { geodesicPathLengthM } from '../src/core/geo/geodesicRingAreaM2';
import { localFrameAt } from '../src/core/geo/localFrame';
import { M2_PER_HA, polygonAreaM2 } from '../src/core/geo/polygonAreaM2';
import { holeProblems } from '../src/core/site/holeProblems';
import { polygonSelfIntersections } from '../src/core/geometry/polygonSelfIntersections';
import { ringProblems } from '../src/core/site/ringProblems';
import { EXCLUSION_KINDS } from '../src/core/model/types';
import { accessFromFeatures } from '../src/io/site/accessFromFeatures';
import { exclusionsFromFeatures } from '../src/io/site/exclusionsFromFeatures';
import { strataFromFeatures } from '../src/io/site/strataFromFeatures';

const dir = resolve(import.meta.dirname, '../demo-maps');
const load = (name: string) => JSON.parse(readFileSync(resolve(dir, name), 'utf8')) as FeatureCollection;
const strata = load('ochre-spit-strata.geojson');
const exclusions = load('ochre-spit-exclusions.geojson');
const access = load('ochre-spit-access.geojson');
const boundary = load('ochre-spit-boundary.geojson');
const baseline = load('ochre-spit-baseline.geojson');

type AreaFeature = Feature<Polygon | MultiPolygon>;
const areaFeatures = strata.features as AreaFeature[];
const boundaryGeom = boundary.features[0].geometry as Polygon;
const centre = boundaryGeom.coordinates[0][0];
const frame = localFrameAt(centre[0], centre[1]);

/** Projects a polygon's rings into the site's UTM frame, so planar clipping measures real m². */
function projected(geom: Polygon | MultiPolygon): Feature<Polygon | MultiPolygon> {
  const ring = (r: Position[]) => r.map(([lon, lat]) => [...frame.toXY(lon, lat)]);
  const polys = geom.type === 'Polygon' ? [geom.coordinates] : geom.coordinates;
  const coords = polys.map((p) => p.map(ring));
  return { type: 'Feature', properties: {}, geometry: { type: 'MultiPolygon', coordinates: coords } };
}

function planarAreaM2(f: Feature<Polygon | MultiPolygon> | null): number {
  if (!f) return 0;
  const polys = f.geometry.type === 'Polygon' ? [f.geometry.coordinates] : f.geometry.coordinates;
  let total = 0;
  for (const p of polys) {
    p.forEach((r, i) => {
      let a = 0;
      for (let k = 1; k < r.length; k++) a += r[k - 1][0] * r[k][1] - r[k][0] * r[k - 1][1];
      total += (i === 0 ? 1 : -1) * Math.abs(a / 2);
    });
  }
  return total;
}

function signedDeg2(ring: Position[]): number {
  let a = 0;
  for (let k = 1; k < ring.length; k++) a += ring[k - 1][0] * ring[k][1] - ring[k][0] * ring[k - 1][1];
  return a / 2;
}

describe('the invented Ochre Spit demo site', () => {
  it('has at least six strata, each labelled, coded and coloured', () => {
    const names = new Set(areaFeatures.map((f) => f.properties?.stratum));
    expect(names.size).toBeGreaterThanOrEqual(6);
    for (const f of areaFeatures) {
      expect(f.properties?.code).toMatch(/^[A-Z]{3}$/);
      expect(f.properties?.colour).toMatch(/^#[0-9a-f]{6}$/);
      expect(typeof f.properties?.label).toBe('string');
    }
  });

  it('has one stratum in two separate patches and one with a hole', () => {
    const multi = areaFeatures.filter((f) => f.geometry.type === 'MultiPolygon');
    expect(multi.length).toBeGreaterThanOrEqual(1);
    expect((multi[0].geometry as MultiPolygon).coordinates.length).toBe(2);
    const holed = areaFeatures.filter((f) => f.geometry.type === 'Polygon' && f.geometry.coordinates.length > 1);
    expect(holed.length).toBeGreaterThanOrEqual(1);
  });

  it('winds shells counter-clockwise and holes clockwise and writes 7 decimals at most (RFC 7946 §3.1.6)', () => {
    const all = [...areaFeatures, ...(boundary.features as AreaFeature[])];
    for (const f of all) {
      const polys = f.geometry.type === 'Polygon' ? [f.geometry.coordinates] : f.geometry.coordinates;
      for (const p of polys) {
        p.forEach((r, i) => {
          expect(r[0]).toEqual(r[r.length - 1]);
          expect(Math.sign(signedDeg2(r))).toBe(i === 0 ? 1 : -1);
          for (const [lon, lat] of r) {
            expect(Math.abs(lon * 1e7 - Math.round(lon * 1e7))).toBeLessThan(1e-6);
            expect(Math.abs(lat * 1e7 - Math.round(lat * 1e7))).toBeLessThan(1e-6);
          }
        });
      }
    }
  });

  it('covers 200–600 ha in all, and the strata sum to the boundary area (WGS84 geodesic area, Karney 2013)', () => {
    const strataM2 = areaFeatures.reduce((s, f) => s + polygonAreaM2(f.geometry), 0);
    const boundaryM2 = polygonAreaM2(boundaryGeom);
    expect(strataM2 / M2_PER_HA).toBeGreaterThan(200);
    expect(strataM2 / M2_PER_HA).toBeLessThan(600);
    // Exact tiling: the parts add up to the whole to well under a square metre.
    expect(Math.abs(strataM2 - boundaryM2)).toBeLessThan(1);
  });

  // GeographicLib's own Planimeter (Debian geographiclib-tools 2.1, geodesic edges on WGS84) is the
  // outside reference for the area; the test runs where the tool is installed, as on the build machine.
  it.skipIf(!existsSync('/usr/bin/Planimeter'))('measures the boundary as GeographicLib Planimeter does, to 0.01 m² (-p 9 prints area to 1e-4 m²)', () => {
    const input = boundaryGeom.coordinates[0].slice(0, -1).map(([lon, lat]) => `${lat} ${lon}`).join('\n');
    const out = execFileSync('/usr/bin/Planimeter', ['-p', '9'], { input, encoding: 'utf8' }).trim().split(/\s+/);
    expect(Math.abs(polygonAreaM2(boundaryGeom) - Number(out[2]))).toBeLessThan(0.01);
  });

  it('has no two strata overlapping by more than 1 m² (polyclip intersection in UTM metres)', () => {
    const proj = areaFeatures.map((f) => projected(f.geometry));
    for (let i = 0; i < proj.length; i++) {
      for (let j = i + 1; j < proj.length; j++) {
        expect(planarAreaM2(intersect(featureCollection([proj[i], proj[j]])) as AreaFeature | null)).toBeLessThan(1);
      }
    }
  });

  it('lets neighbouring strata share edges vertex for vertex', () => {
    const key = (a: Position, b: Position) => `${a[0]},${a[1]}>${b[0]},${b[1]}`;
    const edges = new Map<string, number>();
    const outline = new Set<string>();
    const br = boundaryGeom.coordinates[0];
    for (let k = 1; k < br.length; k++) outline.add(key(br[k - 1], br[k]));
    areaFeatures.forEach((f, idx) => {
      const polys = f.geometry.type === 'Polygon' ? [f.geometry.coordinates] : f.geometry.coordinates;
      for (const p of polys) for (const r of p) for (let k = 1; k < r.length; k++) edges.set(key(r[k - 1], r[k]), idx);
    });
    let unmatched = 0;
    for (const [k, idx] of edges) {
      const [a, b] = k.split('>');
      const back = edges.get(`${b}>${a}`);
      const shared = back !== undefined && back !== idx;
      if (!shared && !outline.has(k)) unmatched++;
    }
    expect(unmatched).toBe(0);
  });

  it('maps every exclusion kind but "other", as a point, a line and a polygon, with buffers', () => {
    const kinds = new Set(exclusions.features.map((f) => f.properties?.kind));
    for (const k of EXCLUSION_KINDS.filter((k) => k !== 'other')) expect(kinds).toContain(k);
    const types = new Set(exclusions.features.map((f) => f.geometry.type));
    expect([...types].sort()).toEqual(['LineString', 'Point', 'Polygon']);
    const byKind = (k: string) => exclusions.features.filter((f) => f.properties?.kind === k);
    expect(byKind('cliff')[0].properties?.buffer_m).toBe(15);
    expect(byKind('hazard')[0].properties?.buffer_m).toBe(30);
    expect(byKind('private')[0].properties?.notes).toMatch(/landholder permission needed/);
    expect(byKind('water').map((f) => f.geometry.type).sort()).toEqual(['LineString', 'Polygon']);
  });

  it('cuts the buffered exclusions into several strata but leaves each most of its ground', () => {
    // A ratio only: turf's spherical buffer and area (0.2–0.7 % off the ellipsoid) are plenty here.
    const zones = exclusions.features.flatMap((f) => {
      const m = Number(f.properties?.buffer_m);
      const z = m > 0 ? buffer(f as Feature<Point | LineString | Polygon>, m, { units: 'meters', steps: 16 }) : f;
      return z ? [z as Feature<Polygon | MultiPolygon>] : [];
    });
    let cut = 0;
    for (const f of areaFeatures) {
      let usable: Feature<Polygon | MultiPolygon> | null = f;
      for (const z of zones) {
        if (!usable) break;
        usable = difference(featureCollection([usable, z])) as Feature<Polygon | MultiPolygon> | null;
      }
      const ratio = (usable ? area(usable) : 0) / area(f);
      if (ratio < 0.999) cut++;
      expect(ratio, String(f.properties?.stratum)).toBeGreaterThan(0.7);
    }
    expect(cut).toBeGreaterThanOrEqual(3);
  });

  it('has two named access points and a baseline of about 1.5 km (geodesic length)', () => {
    expect(access.features.length).toBe(2);
    for (const f of access.features) {
      expect(['car_park', 'gate']).toContain(f.properties?.kind);
      expect(f.properties?.name).toBeTruthy();
    }
    const line = baseline.features[0].geometry as LineString;
    const len = geodesicPathLengthM(line.coordinates, false);
    expect(len).toBeGreaterThan(1400);
    expect(len).toBeLessThan(1600);
  });

  it('sits on land beside the sea in Natural Earth 1:50m (world-atlas 2.0.2 land-50m), in a southern UTM zone', () => {
    const require = createRequire(import.meta.url);
    const topology = JSON.parse(readFileSync(require.resolve('world-atlas/land-50m.json'), 'utf8')) as Topology;
    const land = topoFeature(topology, topology.objects.land) as unknown as FeatureCollection<MultiPolygon>;
    const nearby = land.features.flatMap((f) => f.geometry.coordinates).filter((p) => p[0].some(([lon, lat]) => Math.abs(lon - centre[0]) < 3 && Math.abs(lat - centre[1]) < 3));
    const onLand = (ll: Position) => nearby.some((p) => booleanPointInPolygon(ll, { type: 'Polygon', coordinates: p }));
    const [x, y] = frame.toXY(centre[0], centre[1]);
    expect(onLand(frame.toLonLat(x, y + 500))).toBe(true);
    expect(onLand(frame.toLonLat(x, y - 5000))).toBe(false);
    expect(frame.hemisphere).toBe('S');
  });

  it('says in every file that it is invented', () => {
    for (const fc of [strata, exclusions, access, boundary, baseline]) {
      expect(JSON.stringify((fc as unknown as { description: string }).description)).toMatch(/[Ii]nvented/);
    }
  });
});

describe('the demo site read through stratplot\'s own readers and checks', () => {
  it('reads without problems: closed rings, no spikes, holes inside shells, no self-intersections', () => {
    const problems = areaFeatures.flatMap((f, featureIndex) => {
      const polys = f.geometry.type === 'Polygon' ? [f.geometry.coordinates] : f.geometry.coordinates;
      return polys.flatMap((rings) => [
        ...rings.flatMap((r, ring) => ringProblems(r, { featureIndex, ring })),
        ...holeProblems(rings, { featureIndex }),
        ...polygonSelfIntersections(rings, { featureIndex }),
      ]);
    });
    expect(problems).toEqual([]);
  });

  it('loads through the strata, exclusion and access readers with the fields it was made with', () => {
    const { strata: info, parts } = strataFromFeatures(strata, { fileName: 'ochre-spit-strata.geojson' });
    expect(info.map((s) => s.code).sort()).toEqual(['BAN', 'DUN', 'EUC', 'HEA', 'SAL', 'WET']);
    expect(parts.length).toBe(6);
    const excl = exclusionsFromFeatures(exclusions, { fileName: 'ochre-spit-exclusions.geojson' });
    expect(excl.map((e) => `${e.kind}:${e.bufferM}`).sort()).toEqual(['cliff:15', 'hazard:30', 'private:0', 'water:10', 'water:10']);
    const points = accessFromFeatures(access, { fileName: 'ochre-spit-access.geojson' });
    expect(points.map((a) => a.kind).sort()).toEqual(['car_park', 'gate']);
  });
});

describe('the invented synthetic aerial image of the demo site', async () => {
  const file = resolve(dir, 'ochre-spit-aerial.tif');
  const bytes = readFileSync(file);
  // Reference reader: the geotiff package (geotiff.js 3), independent of the writer.
  const tiff = await fromArrayBuffer(bytes.buffer.slice(bytes.byteOffset, bytes.byteOffset + bytes.byteLength));
  const image = await tiff.getImage();
  const [x0, y0, x1, y1] = image.getBoundingBox();
  const [resX, resY] = image.getResolution();
  const w = image.getWidth();
  const pixels = (await image.readRasters({ interleave: true })) as unknown as Uint8Array;
  const meanColour = (lonLats: Position[]) => {
    const sum = [0, 0, 0];
    for (const [lon, lat] of lonLats) {
      const [x, y] = frame.toXY(lon, lat);
      const i = (Math.floor((y1 - y) / -resY) * w + Math.floor((x - x0) / resX)) * 3;
      for (let b = 0; b < 3; b++) sum[b] += pixels[i + b];
    }
    return sum.map((v) => v / lonLats.length);
  };
  /** Points on a 20 m grid inside a stratum, in lon/lat. */
  const samplesIn = (f: AreaFeature) => {
    const ring = (f.geometry.type === 'Polygon' ? f.geometry.coordinates : f.geometry.coordinates.flat())[0];
    const xy = (f.geometry.type === 'Polygon' ? [ring] : f.geometry.coordinates.map((p) => p[0])).flat().map(([lo, la]) => frame.toXY(lo, la));
    const xs = xy.map((p) => p[0]);
    const ys = xy.map((p) => p[1]);
    const out: Position[] = [];
    for (let x = Math.min(...xs); x < Math.max(...xs); x += 20) {
      for (let y = Math.min(...ys); y < Math.max(...ys); y += 20) {
        const ll = frame.toLonLat(x, y);
        if (booleanPointInPolygon(ll, f)) out.push(ll);
      }
    }
    return out;
  };

  it('is an RGB 8-bit GeoTIFF of at most 4 MB', () => {
    expect(statSync(file).size).toBeLessThanOrEqual(4 * 1024 * 1024);
    expect(image.getSamplesPerPixel()).toBe(3);
    expect(image.getBitsPerSample()).toBe(8);
  });

  it("is in the site's UTM zone by EPSG code (ProjectedCSTypeGeoKey, OGC GeoTIFF 1.1)", async () => {
    const keys = (await image.getGeoKeys()) as Record<string, unknown>;
    expect(frame.epsg).toBe(32750);
    expect(keys.ProjectedCSTypeGeoKey).toBe(frame.epsg);
  });

  it('has square pixels of 2–3 m', () => {
    expect(resX).toBeGreaterThanOrEqual(2);
    expect(resX).toBeLessThanOrEqual(3);
    expect(-resY).toBe(resX);
  });

  it('covers the boundary with a margin of at least 100 m', () => {
    for (const [lon, lat] of boundaryGeom.coordinates[0]) {
      const [x, y] = frame.toXY(lon, lat);
      expect(x - x0).toBeGreaterThan(100);
      expect(x1 - x).toBeGreaterThan(100);
      expect(y - y0).toBeGreaterThan(100);
      expect(y1 - y).toBeGreaterThan(100);
    }
  });

  // Colour families are the image's own design (common practice for these habitats, no source).
  const families: [string, (c: number[]) => boolean][] = [
    ['Wet meadow', ([r, g, b]) => g > r + 20 && g > b + 50 && g > 130],
    ['Eucalypt woodland', ([r, g, b]) => g > r && g > b && r + g + b < 330],
    ['Banksia scrub', ([r, g, b]) => g >= b && r + g + b < 330],
    ['Coastal heath', ([r, g, b]) => r > b + 30 && r >= g * 0.95 && r + g + b > 300 && r + g + b < 480],
    ['Dune grassland', ([r, g, b]) => r > b + 25 && r + g + b > 480],
    ['Saltmarsh', ([r, g, b]) => g >= r && Math.abs(g - b) < 45 && b > 80],
  ];
  for (const [name, isFamily] of families) {
    it(`paints the ${name} stratum in its colour family`, () => {
      const f = areaFeatures.find((s) => s.properties?.stratum === name)!;
      const pts = samplesIn(f);
      expect(pts.length).toBeGreaterThan(100);
      const c = meanColour(pts);
      expect(isFamily(c), `${name}: mean RGB ${c.map((v) => v.toFixed(0)).join(', ')}`).toBe(true);
    });
  }

  it('paints the sea blue off the headland', () => {
    const tip = boundaryGeom.coordinates[0].reduce((a, p) => (p[1] < a[1] ? p : a));
    const [x, y] = frame.toXY(tip[0], tip[1]);
    const pts = [0, 20, 40, 60].map((d) => frame.toLonLat(x + d - 30, y - 200));
    const [r, g, b] = meanColour(pts);
    expect(b).toBeGreaterThan(r + 40);
    expect(b).toBeGreaterThan(g);
  });
});

describe('the demo generators', () => {
  // The GeoJSON rebuild is quick and always runs; the image takes several seconds on a shared
  // machine, so it is rebuilt and compared when STRATPLOT_DEMO_IMAGE_CHECK=1.
  const withImage = process.env.STRATPLOT_DEMO_IMAGE_CHECK === '1';
  it(`rebuilds the committed demo GeoJSON${withImage ? ' and image' : ''} byte for byte from the seeds`, () => {
    const out = mkdtempSync(join(tmpdir(), 'ochre-spit-'));
    try {
      const root = resolve(import.meta.dirname, '..');
      const run = (script: string) => execFileSync(process.execPath, ['--import', 'tsx', script, '--dir', out], { cwd: root, stdio: 'pipe' });
      run('scripts/make-demo-site.ts');
      if (withImage) run('scripts/make-demo-image.ts');
      const made = readdirSync(out).sort();
      // Example plot and result files come from the CLI, not from the generators.
      const committed = readdirSync(dir).filter(
        (n) => n.startsWith('ochre-spit-') && !n.includes('-example.') && (withImage || n.endsWith('.geojson')),
      );
      expect(made).toEqual(committed.sort());
      for (const name of made) expect(readFileSync(join(out, name)).equals(readFileSync(join(dir, name))), name).toBe(true);
    } finally {
      rmSync(out, { recursive: true, force: true });
    }
  });
});
