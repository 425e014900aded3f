import geodesic from 'geographiclib-geodesic';

/** Opens the planner and waits until the map has its style, the site layers and the strata table. */
export async function openPlanner(page, origin) {
  await page.goto(`${origin}/`);
  await page.waitForFunction(() => {
    const m = window.__stratplotMap;
    return m?.isStyleLoaded() && m.getLayer('sp-strata-fill') && document.querySelector('table.ledger[data-measured="yes"]');
  }, null, { timeout: 30_000 });
  await mapIdle(page);
}

/** Waits until the map has drawn everything it was asked to. */
export async function mapIdle(page) {
  await page.waitForFunction(() => window.__stratplotMap.loaded() && !window.__stratplotMap.isMoving(), null, { timeout: 20_000 });
  await page.evaluate(() => new Promise((r) => requestAnimationFrame(() => requestAnimationFrame(r))));
}

/** Clicks the map at a longitude/latitude. */
export async function clickLngLat(page, lon, lat) {
  const box = await page.locator('.map-holder canvas').boundingBox();
  const p = await page.evaluate(([x, y]) => window.__stratplotMap.project([x, y]), [lon, lat]);
  await page.mouse.click(box.x + p.x, box.y + p.y);
}

/** The GeoJSON data currently in one of the planner's map sources. */
export function sourceData(page, id) {
  return page.evaluate((sid) => window.__stratplotMap.getSource(sid).getData(), id);
}

/**
 * Geodesic area on WGS84 of a polygon's outer ring, m², from GeographicLib's own JavaScript port
 * (geographiclib-geodesic 2.2, Karney 2013): the outside reference the panel's areas are checked against.
 */
export function geodesicAreaM2(ring) {
  const poly = geodesic.Geodesic.WGS84.Polygon(false);
  for (const [lon, lat] of ring.slice(0, -1)) poly.AddPoint(lat, lon);
  return Math.abs(poly.Compute(false, true).area);
}

/** Waits until the strata table lists `n` strata and their areas are measured for the current site. */
export async function strataRows(page, n) {
  await page.waitForFunction(
    (k) => document.querySelectorAll('table.ledger tbody tr[data-stratum]').length === k && document.querySelector('table.ledger[data-measured="yes"]'),
    n,
    { timeout: 20_000 },
  );
}

/** Text of the mapped-hectares cell of the strata table row whose name input holds `name`. */
export async function mappedHaOf(page, name) {
  return page.evaluate((n) => {
    for (const tr of document.querySelectorAll('table.ledger tbody tr[data-stratum]')) {
      const input = tr.querySelector('input.name-input');
      if (input && input.value === n) return tr.querySelector('td.area-ha')?.textContent ?? null;
    }
    return null;
  }, name);
}

/** Throws with `message` unless `ok`. */
export function check(ok, message) {
  if (!ok) throw new Error(message);
}

/**
 * Waits until the planner's browser copy (IndexedDB, idb-keyval's default store) holds a saved
 * plan containing every string in `needles`; returns false if it never does within ~10 s.
 */
export async function browserCopyWait(page, needles) {
  const stored = () =>
    page.evaluate(
      (want) =>
        new Promise((resolve) => {
          const open = indexedDB.open('keyval-store');
          open.onsuccess = () => {
            const req = open.result.transaction('keyval').objectStore('keyval').get('stratplot:working-plan');
            req.onsuccess = () => {
              open.result.close();
              resolve(typeof req.result === 'string' && want.every((w) => req.result.includes(w)));
            };
            req.onerror = () => resolve(false);
          };
          open.onerror = () => resolve(false);
        }),
      needles,
    );
  for (let i = 0; i < 40; i++) {
    if (await stored()) return true;
    await new Promise((r) => setTimeout(r, 250));
  }
  return stored();
}

/**
 * Draws a small square stratum with the "Draw stratum" tool (or the tool whose button name
 * matches `tool`), clear of the key, the zoom buttons, the scale and the credit.
 */
export async function drawSquare(page, tool = /^Draw stratum/) {
  const b = await page.evaluate(() => window.__stratplotMap.getBounds().toArray());
  const [w, s] = b[0];
  const [e, n] = b[1];
  // Lower right of the map: clear of the site's data, of the key and of the drawing hint, which
  // sits at the bottom centre while a tool is armed.
  const x0 = w + (e - w) * 0.84;
  const x1 = w + (e - w) * 0.92;
  const y0 = s + (n - s) * 0.12;
  const y1 = s + (n - s) * 0.2;
  await page.getByRole('button', { name: tool }).click();
  for (const [x, y] of [[x0, y0], [x1, y0], [x1, y1], [x0, y1], [x0, y0]]) {
    await clickLngLat(page, x, y);
    await new Promise((r) => setTimeout(r, 160));
  }
}
