import type { Map as MapLibreMap } from 'maplibre-gl';
import { BASE_LAYERS, BASE_SOURCES } from './baseStyle';
import { ONLINE_TILES_DEFAULT, onlineTilesLayer, onlineTilesProbe, onlineTilesSource } from './onlineTiles';

/**
 * Turns the online tiles on or off under the plan. On: one tile is probed first and the answer
 * returned as a short status ('ok', 'offline', 'timeout'…); the offline land shows wherever tiles fail.
 */
export async function onlineTilesSwitch(map: MapLibreMap, on: boolean): Promise<string> {
  if (!on) {
    if (map.getLayer(BASE_LAYERS.onlineTiles)) map.removeLayer(BASE_LAYERS.onlineTiles);
    if (map.getSource(BASE_SOURCES.onlineTiles)) map.removeSource(BASE_SOURCES.onlineTiles);
    return 'off';
  }
  const config = { ...ONLINE_TILES_DEFAULT, enabled: true };
  const c = map.getCenter();
  const probe = await onlineTilesProbe(config, { at: { lon: c.lng, lat: c.lat, zoom: Math.min(12, Math.round(map.getZoom())) }, timeoutMs: 4000 });
  if (!map.getSource(BASE_SOURCES.onlineTiles)) map.addSource(BASE_SOURCES.onlineTiles, onlineTilesSource(config));
  if (!map.getLayer(BASE_LAYERS.onlineTiles)) map.addLayer(onlineTilesLayer(BASE_LAYERS.onlineTiles, BASE_SOURCES.onlineTiles), map.getLayer(BASE_LAYERS.graticule) ? BASE_LAYERS.graticule : undefined);
  return probe.reachable ? 'on' : `on, but not answering (${probe.reason}): the offline map shows instead`;
}
