import fc from 'fast-check';
import type { Feature, FeatureCollection, Polygon } from 'geojson';
import { describe, expect, it } from 'vitest';
import { polygonAreaM2 } from '../../core/geo/polygonAreaM2';
import { featuresToGeoPackage } from './geopackage/featuresToGeoPackage';
import { featuresToGpx } from './gpx/featuresToGpx';
import { featuresToKml } from './kml/featuresToKml';
import { featuresToShapefileZip } from './shapefile/featuresToShapefileZip';
import { positionGapDeg } from '../fixtures/ioSamples';
import { parseGeoPackage } from './geopackage/parseGeoPackage';
import { parseGpx } from './gpx/parseGpx';
import { parseKml } from './kml/parseKml';
import { parseShapefileZip } from './shapefile/parseShapefileZip';

/** Invented strata: star-shaped rings (so they never self-intersect) with any Unicode name. */
const stratum: fc.Arbitrary<InventedStratum> = fc.record({
  lon: fc.double({ min: -179, max: 179, noNaN: true }),
  lat: fc.double({ min: -79, max: 83, noNaN: true }),
  radii: fc.array(fc.double({ min: 20, max: 400, noNaN: true }), { minLength: 3, maxLength: 12 }),
  name: fc.string({ unit: 'grapheme', minLength: 1, maxLength: 12 }),
  // -0 is written as 0 by every text format; it is the same number to a user.
  value: fc.double({ min: -1e6, max: 1e6, noNaN: true }).map((v) => v + 0),
});

interface InventedStratum {
  lon: number;
  lat: number;
  radii: number[];
  name: string;
  value: number;
}

function toFeature(s: InventedStratum): Feature<Polygon> {
  const mPerDegLat = 111_320;
  const mPerDegLon = mPerDegLat * Math.cos((s.lat * Math.PI) / 180);
  const ring = s.radii.map((r, i) => {
    const a = (2 * Math.PI * i) / s.radii.length;
    return [s.lon + (r * Math.cos(a)) / mPerDegLon, s.lat + (r * Math.sin(a)) / mPerDegLat];
  });
  return { type: 'Feature', properties: { stratum: s.name, value: s.value }, geometry: { type: 'Polygon', coordinates: [[...ring, ring[0]]] } };
}

const collection = fc.array(stratum, { minLength: 1, maxLength: 4 }).map((a): FeatureCollection => ({ type: 'FeatureCollection', features: a.map(toFeature) }));

// Seeded property tests (fast-check seed 4411, 25 runs each): what is written reads back the same.
describe('every writer and reader agree on invented random strata', () => {
  it('shapefile: same areas (rings are re-wound) and attributes', async () => {
    await fc.assert(
      fc.asyncProperty(collection, async (c) => {
        const back = await parseShapefileZip('r.zip', featuresToShapefileZip(c));
        back.features.forEach((f, i) => {
          const want = polygonAreaM2(c.features[i].geometry as Polygon);
          expect(Math.abs(polygonAreaM2(f.geometry as Polygon) - want) / want).toBeLessThan(1e-9);
          // dBASE pads text fields with spaces, so trailing spaces cannot survive (blank reads as null).
          const p = c.features[i].properties!;
          expect(f.properties).toEqual({ ...p, stratum: (p.stratum as string).trimEnd() || null });
        });
      }),
      { numRuns: 25, seed: 4411 },
    );
  });

  it('GeoPackage, KML and GPX: same vertices in order and same attributes', async () => {
    await fc.assert(
      fc.asyncProperty(collection, async (c) => {
        const gpkg = await parseGeoPackage('r.gpkg', await featuresToGeoPackage(c));
        const kml = await parseKml('r.kml', new TextEncoder().encode(featuresToKml(c)));
        const gpx = await parseGpx('r.gpx', new TextEncoder().encode(featuresToGpx(c)));
        for (const back of [gpkg, kml, gpx]) {
          back.features.forEach((f, i) => {
            expect(positionGapDeg(f, c.features[i])).toBeLessThanOrEqual(1e-12);
            expect(f.properties).toEqual(c.features[i].properties);
          });
        }
      }),
      { numRuns: 25, seed: 4411 },
    );
  });
});
