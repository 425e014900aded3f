import { localFrameAt } from './src/core/localFrame';
import { stratumUsableRegion } from './src/core/stratumUsableRegion';
const frame = localFrameAt(150.5, -35.1);
const [X0, Y0] = frame.toXY(150.5, -35.1);
const at = (dx: number, dy: number) => frame.toLonLat(X0 + dx, Y0 + dy);
const sq = { type: 'Polygon' as const, coordinates: [[at(0,0), at(2000,0), at(2000,2000), at(0,2000), at(0,0)]] };
const line = []; for (let i = 0; i <= 2000; i++) line.push(at(i, 1000 + 50 * Math.sin(i / 40)));
const pts = []; for (let i = 0; i < 300; i++) pts.push(at((i * 137) % 2000, (i * 263) % 2000));
const site: any = { name: 'x', strata: [], parts: [{ id: 'a', stratum: 's', geometry: sq }], exclusions: [
  { id: 'c', kind: 'cliff', bufferM: 15, geometry: { type: 'LineString', coordinates: line } },
  { id: 'h', kind: 'hazard', bufferM: 10, geometry: { type: 'MultiPoint', coordinates: pts } },
], access: [], boundary: null };
let t = performance.now();
const r = stratumUsableRegion(site, 's', frame);
console.log('ms', performance.now() - t, r.areaM2, r.xy.length);
