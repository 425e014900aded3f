import type { FeatureCollection } from 'geojson';
import type { PlotCollection } from '../../core/model/designTypes';
import type { Site } from '../../core/model/types';

/** A named feature collection, one per layer of a multi-layer export. */
export interface NamedLayer {
  name: string;
  features: FeatureCollection;
}

/**
 * The layers of a design export in a fixed order: plots, then (with a site) strata parts with
 * their stratum's current name (`stratum`), code and colour, exclusions with kind, buffer and
 * notes, and access points. Empty site layers are left out.
 */
export function siteLayers(collection: PlotCollection, site?: Site | null): NamedLayer[] {
  const layers: NamedLayer[] = [{ name: 'plots', features: { type: 'FeatureCollection', features: collection.features } }];
  if (!site) return layers;
  const info = new Map(site.strata.map((s) => [s.key, s]));
  const strata: FeatureCollection = {
    type: 'FeatureCollection',
    features: site.parts.map((p) => {
      const s = info.get(p.stratum);
      return {
        type: 'Feature',
        geometry: p.geometry,
        properties: { part_id: p.id, stratum: s?.label ?? p.stratum, code: s?.code ?? null, colour: s?.colour ?? null },
      };
    }),
  };
  const exclusions: FeatureCollection = {
    type: 'FeatureCollection',
    features: site.exclusions.map((e) => ({
      type: 'Feature',
      geometry: e.geometry,
      properties: { exclusion_id: e.id, kind: e.kind, buffer_m: e.bufferM, name: e.name ?? null, notes: e.notes ?? null },
    })),
  };
  const access: FeatureCollection = {
    type: 'FeatureCollection',
    features: site.access.map((a) => ({
      type: 'Feature',
      geometry: { type: 'Point', coordinates: [a.lon, a.lat] },
      properties: { access_id: a.id, name: a.name, kind: a.kind, notes: a.notes ?? null },
    })),
  };
  for (const [name, features] of [['strata', strata], ['exclusions', exclusions], ['access', access]] as const) {
    if (features.features.length > 0) layers.push({ name, features });
  }
  return layers;
}
