// stratplot offline cache: on install, fetch the list of built files the build wrote
// (offline-files.json) and keep them all, so the planner opens and works with no network.
// Only same-origin GET requests are handled.
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

// Pages: network first (so a new build is picked up), falling back to the cached copy when the
// network is slow or absent. Built files have hashed names and never change: cache first.
async function pageResponse(request, cache) {
  try {
    const response = await Promise.race([fetch(request), new Promise((_, reject) => setTimeout(() => reject(new Error('slow')), 3000))]);
    if (response.ok) cache.put('/', response.clone());
    return response;
  } catch {
    return (await cache.match('/')) ?? Response.error();
  }
}

self.addEventListener('fetch', (event) => {
  const request = event.request;
  if (request.method !== 'GET' || new URL(request.url).origin !== self.location.origin) return;
  event.respondWith(
    (async () => {
      const cache = await caches.open(CACHE);
      if (request.mode === 'navigate') return pageResponse(request, cache);
      const key = new URL(request.url).pathname;
      const hit = await cache.match(key);
      if (hit) return hit;
      try {
        const response = await fetch(request);
        if (response.ok) cache.put(key, response.clone());
        return response;
      } catch {
        return Response.error();
      }
    })(),
  );
});
