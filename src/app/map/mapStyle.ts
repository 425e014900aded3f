import type { GeoJSONSource, Map as MapLibreMap, StyleSpecification } from 'maplibre-gl';
import { graticuleLines, graticuleStepDeg } from '../../core/geo/graticule';
import { worldLandLoad } from '../../io/pdf/worldLand';
import { BASE_SOURCES, baseStyleBuild } from './baseStyle';

const EMPTY = { type: 'FeatureCollection' as const, features: [] };

/** The offline basemap with no land yet: the land arrives from its own chunk a moment later. */
export function mapStyleInitial(): StyleSpecification {
  return baseStyleBuild({ land: EMPTY, coast: EMPTY });
}

function graticuleUpdate(map: MapLibreMap): void {
  const b = map.getBounds();
  const bbox = [Math.max(-180, b.getWest()), Math.max(-85, b.getSouth()), Math.min(180, b.getEast()), Math.min(85, b.getNorth())] as const;
  const step = graticuleStepDeg(Math.max(bbox[2] - bbox[0], bbox[3] - bbox[1]));
  (map.getSource(BASE_SOURCES.graticule) as GeoJSONSource | undefined)?.setData(graticuleLines(bbox, step));
}

/**
 * Fills in the offline land and coastline (Natural Earth via worldLandLoad) and keeps the
 * graticule matched to the view. Land that fails to load leaves the plain sea-and-paper style.
 */
export function mapStyleLandInstall(map: MapLibreMap): void {
  graticuleUpdate(map);
  map.on('moveend', () => graticuleUpdate(map));
  worldLandLoad('50m')
    .then((land) => {
      (map.getSource(BASE_SOURCES.land) as GeoJSONSource | undefined)?.setData(land.land);
      (map.getSource(BASE_SOURCES.coast) as GeoJSONSource | undefined)?.setData(land.coast);
    })
    .catch(() => undefined);
}
