import type { Feature } from 'geojson';

/**
 * Each feature's own id (its GeoJSON `id`, else an `id` property) as text when no other feature of
 * the layer carries the same one, else '' (so the importer names it by position instead): an id
 * used twice cannot tell two features apart.
 */
export function featureIdsUnique(features: readonly Feature[]): string[] {
  const ids = features.map((f) => {
    const raw = f.id ?? f.properties?.id;
    return typeof raw === 'string' || typeof raw === 'number' ? String(raw) : '';
  });
  const counts = new Map<string, number>();
  for (const id of ids) if (id) counts.set(id, (counts.get(id) ?? 0) + 1);
  return ids.map((id) => (id && counts.get(id) === 1 ? id : ''));
}
