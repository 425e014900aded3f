// stratplot offline cache: on install, fetch the list of built files the build wrote
// (offline-files.json) and keep them all; afterwards answer from the cache first, so the planner
// opens and works with no network. Only same-origin GET requests are handled.
const CACHE = 'stratplot-v1';

self.addEventListener('install', (event) => {
  event.waitUntil(
    (async () => {
      const cache = await caches.open(CACHE);
      const list = await fetch('/offline-files.json', { cache: 'no-store' }).then((r) => (r.ok ? r.json() : ['/']));
      await cache.addAll(list);
      await self.skipWaiting();
    })(),
  );
});

self.addEventListener('activate', (event) => {
  event.waitUntil(
    (async () => {
      for (const key of await caches.keys()) if (key !== CACHE) await caches.delete(key);
      await self.clients.claim();
    })(),
  );
});

self.addEventListener('fetch', (event) => {
  const request = event.request;
  if (request.method !== 'GET' || new URL(request.url).origin !== self.location.origin) return;
  event.respondWith(
    (async () => {
      const cache = await caches.open(CACHE);
      const url = new URL(request.url);
      const key = request.mode === 'navigate' ? '/' : url.pathname;
      const hit = await cache.match(key);
      if (hit) return hit;
      try {
        const response = await fetch(request);
        if (response.ok) cache.put(key, response.clone());
        return response;
      } catch {
        return (await cache.match('/')) ?? Response.error();
      }
    })(),
  );
});
