// Writes the invented plot sets of demo-maps/check-example/: plots "from a contractor" on the invented
// Ochre Spit site, each put where its check has a known answer, by geodesic offsets (GeographicLib)
// from the demo's own cliff edge, creek and freehold block. Run: npx tsx scripts/make-check-example.ts
import { readFileSync, writeFileSync } from 'node:fs';
import { resolve } from 'node:path';
import geodesic from 'geographiclib-geodesic';

const WGS84 = geodesic.Geodesic.WGS84;
const root = resolve(import.meta.dirname, '..');
const read = (name: string) => JSON.parse(readFileSync(resolve(root, 'demo-maps', name), 'utf8'));
const exclusions = read('ochre-spit-exclusions.geojson').features as { properties: { name: string }; geometry: { coordinates: unknown } }[];
const byName = (name: string) => exclusions.find((f) => f.properties.name === name)!.geometry.coordinates;

type LonLat = [number, number];
const round7 = (v: number) => Math.round(v * 1e7) / 1e7;
/** The point `distanceM` from `from` along true bearing `azimuthDeg` (the direct geodesic problem). */
function offset(from: LonLat, azimuthDeg: number, distanceM: number): LonLat {
  const r = WGS84.Direct(from[1], from[0], azimuthDeg, distanceM);
  return [round7(r.lon2!), round7(r.lat2!)];
}
/** The true bearing of the line through vertices i and i+1, turned by `turnDeg`. */
function across(line: LonLat[], i: number, turnDeg: number): number {
  const r = WGS84.Inverse(line[i][1], line[i][0], line[i + 1][1], line[i + 1][0]);
  return r.azi1! + turnDeg;
}
const midpoint = (a: LonLat, b: LonLat): LonLat => {
  const r = WGS84.Inverse(a[1], a[0], b[1], b[0]);
  return offset(a, r.azi1!, r.s12! / 2);
};

const cliff = byName('Ochre Spit cliff edge') as LonLat[];
const creek = byName('Pipit Creek') as LonLat[];
const block = (byName('Freehold block') as LonLat[][])[0];
const cliffAt = midpoint(cliff[36], cliff[37]);
const creekAt = midpoint(creek[60], creek[61]);
// The vertex mean of the block's outline lies well inside it (the block is nearly rectangular).
const blockCentre: LonLat = [round7(block.slice(0, -1).reduce((a, p) => a + p[0], 0) / (block.length - 1)), round7(block.slice(0, -1).reduce((a, p) => a + p[1], 0) / (block.length - 1))];
const scrub: LonLat = [119.095, -34.445];

/** Each plot with the answer it is made for (the `expect` property; a contractor's file would not carry it). */
const plots: { id: string; at: LonLat; expect: string }[] = [
  { id: 'HEA-07', at: offset(cliffAt, across(cliff, 36, -90), 6), expect: '6 m inland of the cliff edge: inside its 15 m buffer' },
  { id: 'EUC-12', at: blockCentre, expect: 'inside the freehold block (private land)' },
  { id: 'HEA-09', at: offset(cliffAt, across(cliff, 36, 90), 150), expect: '150 m seaward of the cliff edge: outside every stratum' },
  { id: 'BAN-03', at: scrub, expect: '3 m from BAN-04: closer than a 50 m spacing' },
  { id: 'BAN-04', at: offset(scrub, 90, 3), expect: '3 m from BAN-03: closer than a 50 m spacing' },
  { id: 'BAN-05', at: offset(scrub, 45, 100), expect: 'shares its id with the next plot' },
  { id: 'BAN-05', at: offset(scrub, 225, 100), expect: 'shares its id with the plot before' },
  { id: 'BAN-06', at: offset(scrub, 270, 250), expect: 'clean' },
  { id: 'EUC-20', at: offset(creekAt, across(creek, 60, 90), 18), expect: '18 m from Pipit Creek: clean as a point, its 20 m square footprint enters the 10 m buffer' },
];

function collection(items: typeof plots, description: string) {
  return {
    type: 'FeatureCollection',
    description,
    features: items.map((p) => ({ type: 'Feature', geometry: { type: 'Point', coordinates: p.at }, properties: { plot_id: p.id, expect: p.expect, invented: true } })),
  };
}

const dir = resolve(root, 'demo-maps', 'check-example');
writeFileSync(
  resolve(dir, 'ochre-spit-plots-to-check.geojson'),
  `${JSON.stringify(collection(plots, 'Invented plot set for stratplot check on the invented Ochre Spit site: each plot is placed where a check has a known answer (see expect).'))}\n`,
);
const clean = plots.filter((p) => p.id === 'BAN-06' || p.id === 'EUC-20' || p.id === 'BAN-03');
writeFileSync(resolve(dir, 'ochre-spit-plots-clean.geojson'), `${JSON.stringify(collection(clean, 'Invented plot set that passes stratplot check on the invented Ochre Spit site (point plots, 50 m spacing).'))}\n`);
