import type { Geometry } from 'geojson';
import type { Site } from '../../core/model/types';

/** [west, south, east, north] of everything mapped at a site, or null when nothing is. */
export function siteBounds(site: Site): [number, number, number, number] | null {
  const b = [Infinity, Infinity, -Infinity, -Infinity] as [number, number, number, number];
  const add = (lon: number, lat: number) => {
    if (lon < b[0]) b[0] = lon;
    if (lat < b[1]) b[1] = lat;
    if (lon > b[2]) b[2] = lon;
    if (lat > b[3]) b[3] = lat;
  };
  const walk = (c: unknown): void => {
    if (Array.isArray(c) && typeof c[0] === 'number') add(c[0] as number, c[1] as number);
    else if (Array.isArray(c)) for (const x of c) walk(x);
  };
  // A polygon lies within its outer ring: its holes need not be read (a mosaic's are large).
  for (const p of site.parts) {
    const outers = p.geometry.type === 'Polygon' ? [p.geometry.coordinates[0]] : p.geometry.coordinates.map((poly) => poly[0]);
    for (const ring of outers) {
      if (!ring) continue;
      for (let i = 0; i < ring.length; i++) add(ring[i][0], ring[i][1]);
    }
  }
  for (const e of site.exclusions) walk((e.geometry as Exclude<Geometry, { type: 'GeometryCollection' }>).coordinates);
  for (const a of site.access) add(a.lon, a.lat);
  return Number.isFinite(b[0]) ? b : null;
}

/** Bounds of one geometry. */
export function geometryBounds(g: Geometry): [number, number, number, number] | null {
  return siteBounds({ name: '', strata: [], parts: [], exclusions: [{ id: '', kind: 'other', bufferM: 0, geometry: g as never }], access: [], boundary: null });
}
