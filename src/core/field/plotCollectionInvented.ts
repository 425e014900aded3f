import { STRATPLOT_VERSION } from '../common/version';
import { designSettingsDefault } from '../design/designSettingsDefault';
import type { DesignSettings, Footprint, PlotCollection, PlotProperties } from '../model/designTypes';
import { M2_PER_HA } from '../common/units';

/** One stratum of an invented plot file. */
export interface InventedStratum {
  key: string;
  code: string;
  primaries: number;
  reserves: number;
  mappedM2: number;
  usableM2: number;
}

/**
 * A small plot file in the exact shape `stratplot plan` writes, for an invented site (positions are
 * placeholders on a line near an invented coastal spit; nothing here is real survey data).
 * Used by examples and tests of the results tools; ids follow the design engine's style "HEA-01",
 * reserves "HEA-R1".
 */
export function plotCollectionInvented(
  strata: readonly InventedStratum[],
  footprint: Footprint = { shape: 'square', sideM: 10, angleDeg: 0 },
  shareBasis: 'usable' | 'mapped' = 'usable',
): PlotCollection {
  const features: PlotCollection['features'] = [];
  let k = 0;
  for (const s of strata) {
    const basis = shareBasis === 'usable' ? s.usableM2 : s.mappedM2;
    const make = (role: 'primary' | 'reserve', rank: number): PlotProperties => {
      k += 1;
      const lon = 153.1 + k * 1e-4;
      const lat = -27.4;
      return {
        plot_id: role === 'primary' ? `${s.code}-${String(rank).padStart(2, '0')}` : `${s.code}-R${rank}`,
        stratum: s.key,
        role,
        rank,
        lon,
        lat,
        utm_zone: '56S',
        easting: 510000 + k * 10,
        northing: 6969000,
        mgrs: '56JNP1000069000',
        nearest_exclusion_m: null,
        nearest_exclusion_kind: null,
        design_density_per_ha: (s.primaries / basis) * M2_PER_HA,
      };
    };
    for (let i = 1; i <= s.primaries; i++) {
      const p = make('primary', i);
      features.push({ type: 'Feature', geometry: { type: 'Point', coordinates: [p.lon, p.lat] }, properties: p });
    }
    for (let i = 1; i <= s.reserves; i++) {
      const p = make('reserve', i);
      features.push({ type: 'Feature', geometry: { type: 'Point', coordinates: [p.lon, p.lat] }, properties: p });
    }
  }
  const total = strata.reduce((a, s) => a + (shareBasis === 'usable' ? s.usableM2 : s.mappedM2), 0);
  const settings: DesignSettings = designSettingsDefault({
    plots: strata.reduce((a, s) => a + s.primaries, 0),
    shareBasis,
    footprint,
    reservePerStratum: Math.max(0, ...strata.map((s) => s.reserves)),
  });
  return {
    type: 'FeatureCollection',
    features,
    design: {
      settings,
      seed: 1,
      crs: { utm_zone: '56S', epsg: 32756 },
      allocation: strata.map((s) => ({
        stratum: s.key,
        mapped_m2: s.mappedM2,
        usable_m2: s.usableM2,
        share: (shareBasis === 'usable' ? s.usableM2 : s.mappedM2) / total,
        plots: s.primaries,
        reserve: s.reserves,
        capacity: null,
      })),
      warnings: [],
      statements: ['Invented example: not a real site.'],
      software: { name: 'stratplot', version: STRATPLOT_VERSION },
    },
  };
}
