import { check, clickLngLat, openPlanner, strataRows } from './helpers.mjs';

const sleep = (ms) => new Promise((r) => setTimeout(r, ms));

/** Draws a small square stratum in the map's lower middle (clear of the key and the controls), finishing with Enter. */
export async function drawBoxWithEnter(page) {
  const [[w, s], [e, n]] = await page.evaluate(() => window.__stratplotMap.getBounds().toArray());
  const x0 = w + (e - w) * 0.55;
  const x1 = w + (e - w) * 0.63;
  const y0 = s + (n - s) * 0.12;
  const y1 = s + (n - s) * 0.2;
  await page.getByRole('button', { name: /^Draw stratum/ }).click();
  for (const [x, y] of [[x0, y0], [x1, y0], [x1, y1], [x0, y1]]) {
    await clickLngLat(page, x, y);
    await sleep(160);
  }
  await page.keyboard.press('Enter');
}

/** A value kept in the planner's IndexedDB store (idb-keyval's default database), or undefined. */
export function storedValue(page, key) {
  return page.evaluate(
    (k) =>
      new Promise((resolve) => {
        const open = indexedDB.open('keyval-store');
        open.onsuccess = () => {
          const req = open.result.transaction('keyval').objectStore('keyval').get(k);
          req.onsuccess = () => {
            open.result.close();
            resolve(req.result);
          };
          req.onerror = () => resolve(undefined);
        };
        open.onerror = () => resolve(undefined);
      }),
    key,
  );
}

async function waitFor(what, test, tries = 40) {
  for (let i = 0; i < tries; i++) {
    if (await test()) return;
    await sleep(250);
  }
  throw new Error(`timed out waiting until ${what}`);
}

const notice = (page) => page.locator('.notice').textContent();

/**
 * Nothing the user made is lost: Demo site over unsaved work asks first (keeping the work when
 * told to), replacing is undone by Undo, the earlier work survives a reload in the "Earlier work"
 * list and comes back from it, and a damaged or newer plan file changes neither the plan on screen
 * nor its browser copy.
 */
export const NOTHING_LOST_SCENARIO = {
  no: 'nothing-lost',
  name: 'replacing the plan asks first, is undone by Undo, and the earlier work is kept across a reload; a bad plan file changes nothing',
  async run({ page, origin, shot }) {
    await openPlanner(page, origin);
    await drawBoxWithEnter(page);
    await strataRows(page, 7);
    await page.keyboard.press('Escape');
    await waitFor('the drawn stratum reached the browser copy', async () => String(await storedValue(page, 'stratplot:working-plan')).includes('Stratum 7'));

    await page.getByRole('button', { name: 'Demo site' }).click();
    await page.waitForSelector('[role="alertdialog"]');
    await shot('nothing-lost-ask');
    await page.getByRole('button', { name: 'Keep my work' }).click();
    await strataRows(page, 7);

    await page.getByRole('button', { name: 'Demo site' }).click();
    await page.getByRole('button', { name: 'Replace it' }).click();
    await strataRows(page, 6);
    check(/Opened the invented demo site/.test(await notice(page)), `after replacing, the notice says "${await notice(page)}"`);
    await page.getByRole('button', { name: /Undo/ }).click();
    await strataRows(page, 7);
    const undone = await notice(page);
    check(undone.includes('Undone: opened the invented demo site. The plan you had before is back.'), `Undo says "${undone}"`);
    await shot('nothing-lost-undone');
    await page.getByRole('button', { name: /Redo/ }).click();
    await strataRows(page, 6);

    // Both the edited work and the demo are kept as versions before the reload.
    await waitFor('two versions were kept', async () => {
      const index = await storedValue(page, 'stratplot:earlier-work');
      return typeof index === 'string' && JSON.parse(index).length >= 2 && !String(await storedValue(page, 'stratplot:working-plan')).includes('Stratum 7');
    });
    await page.reload();
    await openPlanner(page, origin);
    await strataRows(page, 6);
    await page.getByRole('button', { name: 'Earlier work…' }).click();
    await page.waitForSelector('ol.versions li');
    const rows = await page.locator('ol.versions li').allTextContents();
    const earlier = rows.findIndex((t) => t.includes('7 strata'));
    check(earlier >= 0, `the list of earlier work does not hold the edited plan of 7 strata: ${rows.join(' | ')}`);
    check(rows.some((t) => t.includes('6 strata') && t.includes('on screen now')), `the plan on screen is not marked in the list: ${rows.join(' | ')}`);
    check(/today \d\d:\d\d/.test(rows[earlier]), `the earlier version has no time: ${rows[earlier]}`);
    await shot('nothing-lost-earlier-work');
    await page.locator('ol.versions li').nth(earlier).getByRole('button', { name: /^Bring back the work of / }).click();
    await strataRows(page, 7);
    check(/^Opened your work of today/.test(await notice(page)), `bringing work back says "${await notice(page)}"`);

    // A damaged file and a file from a newer version: one line each, and nothing changes.
    await waitFor('the brought-back work reached the browser copy', async () => String(await storedValue(page, 'stratplot:working-plan')).includes('Stratum 7'));
    await sleep(400);
    const kept = await storedValue(page, 'stratplot:working-plan');
    const newer = { format: 'stratplot-plan', version: 99, savedAt: '2030-01-01T00:00:00Z', site: { name: 'Future site (invented)', strata: [], parts: [], exclusions: [], access: [], boundary: null }, design: {} };
    for (const [name, text, reason] of [
      ['damaged.stratplot.json', '{"format": "stratplot-plan", "version": 1, "site": {', /damaged\.stratplot\.json: not valid JSON/],
      ['newer.stratplot.json', JSON.stringify(newer), /newer\.stratplot\.json: plan version 99 is not one this program reads/],
    ]) {
      await page.setInputFiles('input[data-open-plan]', { name, mimeType: 'application/json', buffer: Buffer.from(text) });
      await page.waitForFunction((n) => document.querySelector('.notice-error')?.textContent?.includes(n), name, { timeout: 5000 });
      const message = await page.locator('.notice-error').textContent();
      check(reason.test(message) && message.includes('your current plan is unchanged') && !message.includes('\n'), `opening ${name} says "${message}"`);
      await sleep(400);
      await strataRows(page, 7);
      check((await storedValue(page, 'stratplot:working-plan')) === kept, `opening ${name} changed the browser copy`);
      check((await page.locator('[role="alertdialog"]').count()) === 0, `opening ${name} asked to replace the plan`);
    }
    await shot('nothing-lost-bad-file');
  },
};
