import type { RasterLayerSpecification, RasterSourceSpecification } from 'maplibre-gl';
import { InputError } from '../../core/common/InputError';

/** Online raster tiles under the plan (off unless the user turns them on). */
export interface OnlineTilesConfig {
  enabled: boolean;
  /** XYZ template with {z}, {x} and {y}; https, or http only for a server on this computer. */
  urlTemplate: string;
  /** Credit the tile provider requires, shown on the map as plain text. */
  attribution: string;
  /** Highest zoom the provider serves. */
  maxZoom: number;
  tileSizePx: 256 | 512;
}

/**
 * OpenStreetMap's standard tiles. Their tile usage policy asks for the credit
 * "© OpenStreetMap contributors" and light, interactive use only; heavy users should point the
 * template at their own or a commercial tile service.
 */
export const ONLINE_TILES_DEFAULT: Readonly<OnlineTilesConfig> = {
  enabled: false,
  urlTemplate: 'https://tile.openstreetmap.org/{z}/{x}/{y}.png',
  attribution: '© OpenStreetMap contributors',
  maxZoom: 19,
  tileSizePx: 256,
};

const LOCAL_HOST = /^http:\/\/(localhost|127\.0\.0\.1|\[::1\])(:\d+)?\//i;

/**
 * Checks a tile configuration a user typed.
 * @returns the same configuration
 * @throws InputError naming the field: a template without {z}/{x}/{y}, not https (plain http is
 *   allowed only for this computer), an empty credit, or a zoom outside 0–24
 */
export function onlineTilesValidate(config: OnlineTilesConfig): OnlineTilesConfig {
  const t = config.urlTemplate.trim();
  for (const key of ['{z}', '{x}', '{y}']) {
    if (!t.includes(key)) throw new InputError(`tile address "${t}" lacks ${key}; it needs {z}, {x} and {y}`);
  }
  if (!t.toLowerCase().startsWith('https://') && !LOCAL_HOST.test(t)) {
    throw new InputError(`tile address "${t}" must start with https:// (plain http only for localhost)`);
  }
  if (config.attribution.trim() === '') {
    throw new InputError('tile credit is empty: tile providers require their attribution to be shown');
  }
  if (!(Number.isInteger(config.maxZoom) && config.maxZoom >= 0 && config.maxZoom <= 24)) {
    throw new InputError(`tile maximum zoom ${config.maxZoom} must be a whole number from 0 to 24`);
  }
  return config;
}

/** maplibre sets attribution as markup: escape it so a typed credit stays plain text. */
function escapeText(text: string): string {
  return text.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');
}

/** The maplibre raster source of a (validated) configuration. */
export function onlineTilesSource(config: OnlineTilesConfig): RasterSourceSpecification {
  onlineTilesValidate(config);
  return {
    type: 'raster',
    tiles: [config.urlTemplate.trim()],
    tileSize: config.tileSizePx,
    maxzoom: config.maxZoom,
    attribution: escapeText(config.attribution.trim()),
  };
}

/** The raster layer that shows the tiles, with a short fade so panning stays calm. */
export function onlineTilesLayer(id: string, sourceId: string): RasterLayerSpecification {
  return { id, type: 'raster', source: sourceId, paint: { 'raster-fade-duration': 150 } };
}

/**
 * Tile x, y at a zoom for a position (OSM "Slippy map tilenames" formula).
 * @returns [x, y] tile indices
 */
export function onlineTilesTileAt(lon: number, lat: number, zoom: number): [number, number] {
  const n = 2 ** zoom;
  const latR = (Math.max(-85.05, Math.min(85.05, lat)) * Math.PI) / 180;
  const x = Math.floor(((lon + 180) / 360) * n);
  const y = Math.floor(((1 - Math.log(Math.tan(latR) + 1 / Math.cos(latR)) / Math.PI) / 2) * n);
  return [Math.min(n - 1, Math.max(0, x)), Math.min(n - 1, Math.max(0, y))];
}

export interface OnlineTilesProbeResult {
  reachable: boolean;
  /** 'ok', 'offline' (the browser says so), 'timeout', 'http <status>', 'not an image' or 'unreachable'. */
  reason: string;
  url: string;
}

export interface OnlineTilesProbeOptions {
  /** Tile to ask for (default the whole-world tile 0/0/0). */
  at?: { lon: number; lat: number; zoom: number };
  timeoutMs?: number;
  fetchFn?: typeof fetch;
  /** Whether the browser believes it is online (default navigator.onLine, or true). */
  isOnline?: () => boolean;
}

/**
 * Asks for one tile to learn whether the tile service answers. Never throws and logs nothing:
 * offline is an ordinary state for a field tool. (A browser may still list the failed request in
 * its own network log.)
 * @returns reachable and a short reason
 */
export async function onlineTilesProbe(
  config: OnlineTilesConfig,
  options: OnlineTilesProbeOptions = {},
): Promise<OnlineTilesProbeResult> {
  const at = options.at ?? { lon: 0, lat: 0, zoom: 0 };
  const z = Math.max(0, Math.min(config.maxZoom, Math.round(at.zoom)));
  const [x, y] = z === 0 ? [0, 0] : onlineTilesTileAt(at.lon, at.lat, z);
  const url = config.urlTemplate.trim().replace('{z}', String(z)).replace('{x}', String(x)).replace('{y}', String(y));
  const isOnline = options.isOnline ?? (() => (typeof navigator === 'undefined' ? true : navigator.onLine !== false));
  if (!isOnline()) return { reachable: false, reason: 'offline', url };
  const fetchFn = options.fetchFn ?? globalThis.fetch;
  if (typeof fetchFn !== 'function') return { reachable: false, reason: 'unreachable', url };
  const controller = new AbortController();
  let timedOut = false;
  const timer = setTimeout(() => {
    timedOut = true;
    controller.abort();
  }, options.timeoutMs ?? 5000);
  try {
    const response = await fetchFn(url, { signal: controller.signal, cache: 'no-store', credentials: 'omit', mode: 'cors' });
    if (!response.ok) return { reachable: false, reason: `http ${response.status}`, url };
    response.body?.cancel().catch(() => undefined);
    const type = response.headers.get('content-type') ?? '';
    if (type && !type.startsWith('image/')) return { reachable: false, reason: 'not an image', url };
    return { reachable: true, reason: 'ok', url };
  } catch {
    return { reachable: false, reason: timedOut ? 'timeout' : 'unreachable', url };
  } finally {
    clearTimeout(timer);
  }
}
