// Builds the invented "Ochre Spit Coastal Reserve" demo site (all names, habitats and outlines are
// invented; the coordinates are only a plausible setting on a real coastline) and writes the GeoJSON
// files in demo-maps/. Run: npx tsx scripts/make-demo-site.ts [--dir <folder>]
// Everything is drawn in metres in the site's UTM frame, then converted to WGS84, so that shared
// stratum edges come out of one computation and carry identical vertices.
import { writeFileSync } from 'node:fs';
import { resolve } from 'node:path';
import * as polyclip from 'polyclip-ts';
import { uniformFloat64 } from 'pure-rand/distribution/uniformFloat64';
import { xoroshiro128plus } from 'pure-rand/generator/xoroshiro128plus';
import { localFrameAt } from '../src/core/geo/localFrame';
import { ringsWeld } from './demo/ringsWeld';
import { cutAtLength, insideRing, lengthM, type P, type Ring, sliceByX, wobblyLoop as loopR, wobblyPath as pathR } from './demo/shapesXY';

/** Seed of every wobble in the demo site; change it and the outlines change. */
export const DEMO_SITE_SEED = 20_261_201;
/** Plausible setting only: a point inland of a south-facing coast (Natural Earth 1:50m shows land). */
export const DEMO_ORIGIN_LON = 119.1;
export const DEMO_ORIGIN_LAT = -34.445;

const rng = xoroshiro128plus(DEMO_SITE_SEED);
const rand = (): number => uniformFloat64(rng);
const frame = localFrameAt(DEMO_ORIGIN_LON, DEMO_ORIGIN_LAT);
const [E0, N0] = frame.toXY(DEMO_ORIGIN_LON, DEMO_ORIGIN_LAT);
const wobblyPath = (ctrl: P[], stepM: number, amplitudeM: number) => pathR(rand, ctrl, stepM, amplitudeM);
const wobblyLoop = (cx: number, cy: number, radiusM: number, stepM: number) => loopR(rand, cx, cy, radiusM, stepM);

// ---- the coast: top of beach / cliff edge, west to east, extending past the site for the image
const coast = wobblyPath(
  [
    [-1900, -600],
    [-1150, -640],
    [-800, -700],
    [-450, -735],
    [-260, -765],
    [-160, -850],
    [-125, -990],
    [0, -1075],
    [125, -1035],
    [185, -900],
    [265, -785],
    [500, -730],
    [800, -700],
    [1000, -660],
    [1150, -600],
    [1900, -560],
  ],
  11,
  7,
);
const SITE_WEST_X = -1150;
const SITE_EAST_X = 1160;
const siteCoast = sliceByX(coast, SITE_WEST_X, SITE_EAST_X);
const westStart = siteCoast[0];
const eastEnd = siteCoast[siteCoast.length - 1];
const eastSide = wobblyPath([eastEnd, [1230, -250], [1150, 150], [1210, 480], [1050, 760], [880, 960]], 14, 9);
const northSide = wobblyPath([[880, 960], [560, 1000], [250, 1010], [-100, 1045], [-450, 980], [-700, 1035], [-960, 930]], 14, 8);
const westSide = wobblyPath([[-960, 930], [-1100, 700], [-1230, 420], [-1160, 60], [-1240, -300], westStart], 14, 9);
const siteRing: Ring = [...siteCoast, ...eastSide.slice(1), ...northSide.slice(1), ...westSide.slice(1)];
siteRing[siteRing.length - 1] = siteRing[0];

// ---- dividing zones (drawn larger than the site, then clipped to it)
const belowLine = (line: P[]): Ring => [...line, [line[line.length - 1][0], -2500], [line[0][0], -2500], line[0]];
const clearing = wobblyLoop(-350, 600, 165, 12);
const saltZone: Ring = [
  ...wobblyPath([[1600, -150], [1250, -140], [1080, -200], [960, -300], [880, -470], [850, -620], [860, -2500]], 12, 6),
  [1600, -2500],
  [1600, -150],
];
const duneWest: Ring = [
  ...wobblyPath([[-1700, -470], [-1200, -480], [-900, -520], [-560, -575], [-330, -640], [-250, -720], [-215, -900]], 12, 7),
  [-215, -2500],
  [-1700, -2500],
  [-1700, -470],
];
const duneEast: Ring = [
  ...wobblyPath([[230, -900], [280, -720], [370, -650], [560, -615], [760, -600], [860, -640], [900, -900]], 12, 7),
  [900, -2500],
  [230, -2500],
  [230, -900],
];
const heathLine = wobblyPath(
  [[-1700, -300], [-1100, -180], [-800, -320], [-500, -190], [-250, -330], [0, -200], [300, -360], [550, -230], [800, -330], [1000, -120], [1700, -40]],
  12,
  12,
);
const scrubLine = wobblyPath(
  [[-1700, 150], [-1000, 350], [-700, 170], [-450, 330], [-150, 120], [150, 380], [450, 200], [750, 330], [1000, 120], [1700, 260]],
  12,
  12,
);

// ---- partition of the site: each zone takes what is left of the site, the woodland takes the rest
type MP = polyclip.Geom;
let remaining: MP = [[siteRing]];
function take(zone: Ring[][]): P[][][] {
  const part = polyclip.intersection(remaining, zone as MP) as P[][][];
  remaining = polyclip.difference(remaining, zone as MP);
  return part;
}
const parts: Record<string, P[][][]> = {};
parts['Wet meadow'] = take([[clearing]]);
parts['Saltmarsh'] = take([[saltZone]]);
parts['Dune grassland'] = take([[duneWest], [duneEast]]);
parts['Coastal heath'] = take([[belowLine(heathLine)]]);
parts['Banksia scrub'] = take([[belowLine(scrubLine)]]);
parts['Eucalypt woodland'] = remaining as P[][][];

// ---- weld: shared edges get identical vertex lists
ringsWeld([siteRing, ...Object.values(parts).flatMap((mp) => mp.flat())]);
const weldedSite = siteRing;

// ---- to WGS84, 7 decimals, RFC 7946 winding (shells counter-clockwise, holes clockwise)
const r7 = (v: number) => Math.round(v * 1e7) / 1e7;
const toLL = (p: P): [number, number] => {
  const ll = frame.toLonLat(p[0] + E0, p[1] + N0);
  return [r7(ll[0]), r7(ll[1])];
};
function signedArea(ring: [number, number][]): number {
  let a = 0;
  for (let i = 1; i < ring.length; i++) a += ring[i - 1][0] * ring[i][1] - ring[i][0] * ring[i - 1][1];
  return a / 2;
}
function ringLL(ring: Ring, shell: boolean): [number, number][] {
  const out: [number, number][] = [];
  for (const p of ring) {
    const q = toLL(p);
    const last = out[out.length - 1];
    if (!last || last[0] !== q[0] || last[1] !== q[1]) out.push(q);
  }
  if (signedArea(out) > 0 !== shell) out.reverse();
  return out;
}
const lineLL = (line: P[]) => line.map(toLL);

const INVENTED = 'Invented demo data: fictional site, names and habitats; coordinates are only a plausible setting.';
const strataMeta: { stratum: string; code: string; colour: string; description: string }[] = [
  // Colours: Paul Tol's "muted" qualitative scheme (colour-blind safe), https://personal.sron.nl/~pault/
  { stratum: 'Coastal heath', code: 'HEA', colour: '#ddcc77', description: 'Low heath on the headland and behind the dunes (invented).' },
  { stratum: 'Dune grassland', code: 'DUN', colour: '#cc6677', description: 'Grassed foredunes behind the two beaches (invented).' },
  { stratum: 'Saltmarsh', code: 'SAL', colour: '#44aa99', description: 'Tidal flats at the creek mouth (invented).' },
  { stratum: 'Banksia scrub', code: 'BAN', colour: '#882255', description: 'Tall closed scrub on the sand plain (invented).' },
  { stratum: 'Eucalypt woodland', code: 'EUC', colour: '#117733', description: 'Open woodland on the inland rise (invented).' },
  { stratum: 'Wet meadow', code: 'WET', colour: '#88ccee', description: 'Sedge meadow in a woodland clearing around the pond (invented).' },
];
const strataFeatures = strataMeta.map((m, i) => {
  const mp = parts[m.stratum];
  const polys = mp.map((poly) => poly.map((ring, r) => ringLL(ring, r === 0)));
  return {
    type: 'Feature',
    id: `stratum-${i + 1}`,
    properties: { stratum: m.stratum, label: m.stratum, code: m.code, colour: m.colour, description: m.description, invented: true },
    geometry: polys.length === 1 ? { type: 'Polygon', coordinates: polys[0] } : { type: 'MultiPolygon', coordinates: polys },
  };
});

// ---- exclusions
const creek = wobblyPath([[590, 1060], [555, 760], [620, 420], [690, 120], [800, -150], [930, -380], [1050, -560], [1110, -700]], 9, 12);
const cliffEnd = coast.findIndex((p) => p[0] > 245 && p[1] > -820);
const cliffStart = coast.findIndex((p) => p[0] > -210);
const cliff = coast.slice(cliffStart, cliffEnd + 1);
const pond = wobblyLoop(-325, 585, 46, 7);
const privateParcel: Ring = [
  ...wobblyPath([[-1010, 560], [-800, 575]], 20, 1.5),
  ...wobblyPath([[-800, 575], [-785, 760]], 20, 1.5).slice(1),
  ...wobblyPath([[-785, 760], [-995, 775]], 20, 1.5).slice(1),
  ...wobblyPath([[-995, 775], [-1010, 560]], 20, 1.5).slice(1),
];
const shaft: P = [255, 45];
const exclusionFeatures = [
  {
    type: 'Feature',
    id: 'excl-cliff',
    properties: { kind: 'cliff', buffer_m: 15, name: 'Ochre Spit cliff edge', notes: 'Undercut, crumbling edge above the rock platform. Stay back; follow the employer\'s safety plan. Invented.' },
    geometry: { type: 'LineString', coordinates: lineLL(cliff) },
  },
  {
    type: 'Feature',
    id: 'excl-creek',
    properties: { kind: 'water', buffer_m: 10, name: 'Pipit Creek', notes: 'Soft banks; tidal in the lower reach. Invented.' },
    geometry: { type: 'LineString', coordinates: lineLL(creek) },
  },
  {
    type: 'Feature',
    id: 'excl-pond',
    properties: { kind: 'water', buffer_m: 10, name: 'Reed pond', notes: 'Deep water near the reed edge. Invented.' },
    geometry: { type: 'Polygon', coordinates: [ringLL(pond, true)] },
  },
  {
    type: 'Feature',
    id: 'excl-private',
    properties: { kind: 'private', buffer_m: 0, name: 'Freehold block', notes: 'landholder permission needed. Invented parcel.' },
    geometry: { type: 'Polygon', coordinates: [ringLL(privateParcel, true)] },
  },
  {
    type: 'Feature',
    id: 'excl-shaft',
    properties: { kind: 'hazard', buffer_m: 30, name: 'Old mine shaft', notes: 'Unfenced shaft, collapse risk around the collar. Invented.' },
    geometry: { type: 'Point', coordinates: toLL(shaft) },
  },
];

// ---- tracks, access, baseline and image context
const mainTrack = wobblyPath([[40, 1070], [20, 800], [-55, 500], [0, 200], [80, -100], [20, -400], [-25, -650], [0, -930]], 8, 4);
const westTrack = wobblyPath([[0, 200], [-400, 110], [-800, -90], [-1000, -420], [-1060, -640]], 8, 4);
const eastTrack = wobblyPath([[20, 800], [300, 825], [560, 850], [900, 800], [1175, 700], [1500, 660]], 8, 4);
const roadOutside = wobblyPath([[-1900, 1050], [-800, 1095], [40, 1090], [900, 1075], [1900, 1040]], 10, 3);
const baseline = cutAtLength(mainTrack.slice(mainTrack.findIndex((p) => p[1] < 900)), 1500);
const accessFeatures = [
  {
    type: 'Feature',
    id: 'access-north',
    properties: { name: 'North car park', kind: 'car_park', notes: 'Gravel car park off the coast road. Invented.' },
    geometry: { type: 'Point', coordinates: toLL([40, 1070]) },
  },
  {
    type: 'Feature',
    id: 'access-east',
    properties: { name: 'Creek Road gate', kind: 'gate', notes: 'Locked fire-trail gate; key from the reserve office. Invented.' },
    geometry: { type: 'Point', coordinates: toLL(eastTrack[eastTrack.findIndex((p) => p[0] > 600 && !insideRing(p, siteRing))]) },
  },
];

// Waterline: the coast pushed seaward by a beach whose width varies; none under the cliff.
function waterline(): P[] {
  const out: P[] = [];
  for (let i = 0; i < coast.length; i++) {
    const a = coast[Math.max(0, i - 1)];
    const b = coast[Math.min(coast.length - 1, i + 1)];
    const dx = b[0] - a[0];
    const dy = b[1] - a[1];
    const d = Math.hypot(dx, dy) || 1;
    const x = coast[i][0];
    const head = x > -230 && x < 260;
    const width = head ? 14 : x > 950 && x < 1250 ? 70 : 38 + 10 * Math.sin(x / 170);
    out.push([coast[i][0] + (dy / d) * width, coast[i][1] - (dx / d) * width]);
  }
  return out;
}
const wl = waterline();
const seaRing: Ring = [...wl, [1900, -2500], [-1900, -2500], wl[0]];
const beachRing: Ring = [...coast, ...[...wl].reverse(), coast[0]];
const contextFeatures = [
  { type: 'Feature', properties: { role: 'sea', name: 'Sea (invented shoreline)' }, geometry: { type: 'Polygon', coordinates: [ringLL(seaRing, true)] } },
  { type: 'Feature', properties: { role: 'beach', name: 'Beach and rock platform (invented)' }, geometry: { type: 'Polygon', coordinates: [ringLL(beachRing, true)] } },
  { type: 'Feature', properties: { role: 'track', name: 'Headland track (invented)' }, geometry: { type: 'LineString', coordinates: lineLL(mainTrack) } },
  { type: 'Feature', properties: { role: 'track', name: 'West fire trail (invented)' }, geometry: { type: 'LineString', coordinates: lineLL(westTrack) } },
  { type: 'Feature', properties: { role: 'track', name: 'Creek fire trail (invented)' }, geometry: { type: 'LineString', coordinates: lineLL(eastTrack) } },
  { type: 'Feature', properties: { role: 'channel', name: 'Creek mouth across the beach (invented)' }, geometry: { type: 'LineString', coordinates: lineLL([creek[creek.length - 3], creek[creek.length - 1], [1135, -760], [1150, -820]]) } },
  { type: 'Feature', properties: { role: 'road', name: 'Coast road (invented)' }, geometry: { type: 'LineString', coordinates: lineLL(roadOutside) } },
];

// ---- write
// `--dir <folder>` writes elsewhere (the tests regenerate into a temporary folder and compare).
const dirArg = process.argv.indexOf('--dir');
const dir = dirArg > 0 ? resolve(process.argv[dirArg + 1]) : resolve(import.meta.dirname, '../demo-maps');
function write(name: string, title: string, features: unknown[]) {
  const fc = { type: 'FeatureCollection', name: title, description: INVENTED, features };
  writeFileSync(resolve(dir, name), `${JSON.stringify(fc)}\n`);
}
write('ochre-spit-strata.geojson', 'Ochre Spit Coastal Reserve (invented) - habitat strata', strataFeatures);
write('ochre-spit-exclusions.geojson', 'Ochre Spit Coastal Reserve (invented) - exclusions', exclusionFeatures);
write('ochre-spit-access.geojson', 'Ochre Spit Coastal Reserve (invented) - access points', accessFeatures);
write('ochre-spit-boundary.geojson', 'Ochre Spit Coastal Reserve (invented) - site boundary', [
  {
    type: 'Feature',
    id: 'boundary',
    properties: { name: 'Ochre Spit Coastal Reserve (invented)', description: INVENTED },
    geometry: { type: 'Polygon', coordinates: [ringLL(weldedSite, true)] },
  },
]);
write('ochre-spit-baseline.geojson', 'Ochre Spit Coastal Reserve (invented) - transect baseline', [
  {
    type: 'Feature',
    id: 'baseline',
    properties: { name: 'Headland track baseline (invented)', length_m: Math.round(lengthM(baseline)) },
    geometry: { type: 'LineString', coordinates: lineLL(baseline) },
  },
]);
write('ochre-spit-context.geojson', 'Ochre Spit Coastal Reserve (invented) - sea, beach and tracks for the demo image', contextFeatures);

const summary = strataMeta.map((m) => `${m.stratum}: ${parts[m.stratum].length} polygon(s), ${parts[m.stratum].map((p) => p.length - 1).join('+')} hole(s)`);
console.log(`UTM ${frame.utmZone} (EPSG:${frame.epsg}); seed ${DEMO_SITE_SEED}`);
console.log(summary.join('\n'));
console.log(`site vertices ${weldedSite.length}, baseline ${lengthM(baseline).toFixed(0)} m`);
