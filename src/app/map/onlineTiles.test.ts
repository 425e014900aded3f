import { describe, expect, it, vi } from 'vitest';
import { isInputError } from '../../core/common/InputError';
import {
  ONLINE_TILES_DEFAULT,
  onlineTilesProbe,
  onlineTilesSource,
  onlineTilesTileAt,
  onlineTilesValidate,
} from './onlineTiles';

const on = { ...ONLINE_TILES_DEFAULT, enabled: true };

function fakeFetch(impl: (url: string) => Promise<Response>) {
  return vi.fn((input: RequestInfo | URL) => impl(String(input))) as unknown as typeof fetch;
}

describe('onlineTilesSource', () => {
  it('is off by default and credits OpenStreetMap as its tile policy asks', () => {
    expect(ONLINE_TILES_DEFAULT.enabled).toBe(false);
    const source = onlineTilesSource(on);
    expect(source.tiles).toEqual(['https://tile.openstreetmap.org/{z}/{x}/{y}.png']);
    expect(source.attribution).toBe('© OpenStreetMap contributors');
  });

  it('keeps a typed credit as plain text, since maplibre shows attribution as markup', () => {
    const source = onlineTilesSource({ ...on, attribution: '<img src=x onerror=alert(1)> Tiles & Co' });
    expect(source.attribution).toBe('&lt;img src=x onerror=alert(1)&gt; Tiles &amp; Co');
  });
});

describe('onlineTilesValidate', () => {
  const bad = (patch: Partial<typeof on>) => {
    try {
      onlineTilesValidate({ ...on, ...patch });
    } catch (e) {
      expect(isInputError(e)).toBe(true);
      return (e as Error).message;
    }
    return 'accepted';
  };

  it('says which placeholder a template lacks', () => {
    expect(bad({ urlTemplate: 'https://tiles.example/{z}/{x}.png' })).toMatch(/lacks \{y\}/);
  });

  it('wants https, except for a tile server on this computer', () => {
    expect(bad({ urlTemplate: 'http://tiles.example/{z}/{x}/{y}.png' })).toMatch(/must start with https:\/\//);
    expect(bad({ urlTemplate: 'http://localhost:8080/{z}/{x}/{y}.png' })).toBe('accepted');
  });

  it('refuses an empty credit and an impossible zoom', () => {
    expect(bad({ attribution: '  ' })).toMatch(/credit is empty/);
    expect(bad({ maxZoom: 30 })).toMatch(/maximum zoom 30/);
  });
});

describe('onlineTilesTileAt', () => {
  it('numbers tiles as the OpenStreetMap slippy-map scheme does', () => {
    // Berlin 52.52°N 13.4°E at zoom 10 is tile 550/335 (OSM wiki "Slippy map tilenames", from memory).
    expect(onlineTilesTileAt(13.4, 52.52, 10)).toEqual([550, 335]);
    expect(onlineTilesTileAt(-180, 85, 1)).toEqual([0, 0]);
    expect(onlineTilesTileAt(179.99, -85, 1)).toEqual([1, 1]);
  });
});

describe('onlineTilesProbe', () => {
  it('reports a reachable service when one tile image comes back', async () => {
    const fetchFn = fakeFetch(async () => new Response(new Uint8Array([137, 80]), { headers: { 'content-type': 'image/png' } }));
    const r = await onlineTilesProbe(on, { fetchFn, isOnline: () => true, at: { lon: 13.4, lat: 52.52, zoom: 10 } });
    expect(r).toEqual({ reachable: true, reason: 'ok', url: 'https://tile.openstreetmap.org/10/550/335.png' });
  });

  it('does not ask at all when the browser says it is offline', async () => {
    const fetchFn = fakeFetch(async () => new Response(''));
    const r = await onlineTilesProbe(on, { fetchFn, isOnline: () => false });
    expect(r.reason).toBe('offline');
    expect(fetchFn).not.toHaveBeenCalled();
  });

  it('reports a network failure, an HTTP error and a timeout quietly', async () => {
    const log = vi.spyOn(console, 'error');
    const warn = vi.spyOn(console, 'warn');
    const failing = fakeFetch(() => Promise.reject(new TypeError('Failed to fetch')));
    expect((await onlineTilesProbe(on, { fetchFn: failing, isOnline: () => true })).reason).toBe('unreachable');
    const refused = fakeFetch(async () => new Response('no', { status: 403 }));
    expect((await onlineTilesProbe(on, { fetchFn: refused, isOnline: () => true })).reason).toBe('http 403');
    const hanging = vi.fn(
      (_: RequestInfo | URL, init?: RequestInit) =>
        new Promise<Response>((_, reject) => init?.signal?.addEventListener('abort', () => reject(new Error('aborted')))),
    ) as unknown as typeof fetch;
    expect((await onlineTilesProbe(on, { fetchFn: hanging, isOnline: () => true, timeoutMs: 20 })).reason).toBe('timeout');
    expect(log).not.toHaveBeenCalled();
    expect(warn).not.toHaveBeenCalled();
    log.mockRestore();
    warn.mockRestore();
  });

  it('treats a page that is not an image (a captive portal) as unreachable', async () => {
    const portal = fakeFetch(async () => new Response('<html>', { headers: { 'content-type': 'text/html' } }));
    expect((await onlineTilesProbe(on, { fetchFn: portal, isOnline: () => true })).reason).toBe('not an image');
  });
});
