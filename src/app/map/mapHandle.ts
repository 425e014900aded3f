import type { Map as MapLibreMap } from 'maplibre-gl';

let current: MapLibreMap | null = null;
const waiting = new Set<(map: MapLibreMap) => void>();

/** Records the page's map once its style and layers are ready, and tells everyone waiting. */
export function mapHandleSet(map: MapLibreMap | null): void {
  current = map;
  if (map) for (const cb of waiting) cb(map);
}

/** The page's map when ready, else null. */
export function mapHandle(): MapLibreMap | null {
  return current;
}

/** Calls `cb` with the map now if ready, else when it becomes ready; returns an unsubscribe. */
export function mapWhenReady(cb: (map: MapLibreMap) => void): () => void {
  if (current) cb(current);
  waiting.add(cb);
  return () => waiting.delete(cb);
}
