import { describe, expect, it } from 'vitest';
import { localFrameAt } from '../../geo/localFrame';
import { polygonAreaM2 } from '../../geo/polygonAreaM2';
import { stratumShapesXY } from './placementStrata';
import type { LonLat, Site } from '../../model/types';

// Invented site (no real place): two touching squares of one stratum, the west one with a hole.
const frame = localFrameAt(118.2, -34.6);
const d = 0.005;
const west: LonLat[] = [
  [118.2, -34.6],
  [118.2 + d, -34.6],
  [118.2 + d, -34.6 + d],
  [118.2, -34.6 + d],
  [118.2, -34.6],
];
const hole: LonLat[] = [
  [118.201, -34.599],
  [118.201, -34.598],
  [118.202, -34.598],
  [118.202, -34.599],
  [118.201, -34.599],
];
const east: LonLat[] = [
  [118.2 + d, -34.6],
  [118.2 + 2 * d, -34.6],
  [118.2 + 2 * d, -34.6 + d],
  [118.2 + d, -34.6 + d],
  [118.2 + d, -34.6],
];
const site: Site = {
  name: 'two squares (invented)',
  strata: [{ key: 'heath', label: 'Heath', code: 'HEA', colour: '#6a8f3c' }],
  parts: [
    { id: 'w', stratum: 'heath', geometry: { type: 'Polygon', coordinates: [west, hole] } },
    { id: 'e', stratum: 'heath', geometry: { type: 'Polygon', coordinates: [east] } },
  ],
  exclusions: [],
  access: [],
  boundary: null,
};

describe('stratumShapesXY', () => {
  it('puts every triangle corner exactly on a vertex as the frame projects it', () => {
    const [shape] = stratumShapesXY(site, frame);
    const vertices = new Set([...west, ...hole, ...east].map(([lon, lat]) => frame.toXY(lon, lat).join(',')));
    for (let i = 0; i < shape.triangles.length; i += 2) expect(vertices.has(`${shape.triangles[i]},${shape.triangles[i + 1]}`)).toBe(true);
  });

  it('covers the stratum less its hole with triangles: grid area equals the ellipsoidal area over k² to 0.1 %', () => {
    // The grid inflates areas by the point scale factor squared (k ≈ 0.99987 here, Snyder 1987 eq. 8-11);
    // polygonAreaM2 is the WGS84 ellipsoidal area (Karney 2013).
    const [shape] = stratumShapesXY(site, frame);
    const ground = polygonAreaM2({ type: 'Polygon', coordinates: [west, hole] }) + polygonAreaM2({ type: 'Polygon', coordinates: [east] });
    const grid = shape.cumulativeArea[shape.cumulativeArea.length - 1];
    expect(Math.abs(grid / ground - 1)).toBeLessThan(1e-3);
  });

  it('drops the edge the two squares share and keeps every other edge', () => {
    const [shape] = stratumShapesXY(site, frame);
    // 4 + 4 outer edges of the squares less the shared one on each side, plus the hole's 4.
    expect(shape.edges.length / 4).toBe(3 + 3 + 4);
    const [sx, sy] = frame.toXY(118.2 + d, -34.6 + d / 2);
    expect(shape.contains(sx - 1, sy)).toBe(true);
    expect(shape.contains(sx + 1, sy)).toBe(true);
    const [hx, hy] = frame.toXY(118.2015, -34.5985);
    expect(shape.contains(hx, hy)).toBe(false);
  });

  it('bounds the stratum by the projected extremes of its vertices', () => {
    const [shape] = stratumShapesXY(site, frame);
    const pts = [...west, ...east].map(([lon, lat]) => frame.toXY(lon, lat));
    expect(shape.bbox).toEqual([Math.min(...pts.map((p) => p[0])), Math.min(...pts.map((p) => p[1])), Math.max(...pts.map((p) => p[0])), Math.max(...pts.map((p) => p[1]))]);
  });
});
