import { booleanPointInPolygon } from '@turf/turf';
import { DESIGN_SIZING_SCENARIO } from './designSizing.scenario.mjs';
import { HOSTILE_IMPORT_SCENARIO } from './hostileImport.scenario.mjs';
import { IMPORT_CHOICE_SCENARIO } from './importChoice.scenario.mjs';
import { EXPORTS_SCENARIO } from './exports.scenario.mjs';
import { GUIDANCE_SCENARIO } from './guidance.scenario.mjs';
import { LAYOUT_SCENARIO } from './layout.scenario.mjs';
import { NOTHING_LOST_SCENARIO } from './nothingLost.scenario.mjs';
import { RESULTS_SCENARIO } from './results.scenario.mjs';
import { FIELD_STATE_SCENARIO } from './fieldState.scenario.mjs';
import { PLOT_CHECK_SCENARIO } from './plotCheck.scenario.mjs';
import { FIELD_VIEW_SCENARIO } from './fieldView.scenario.mjs';
import { browserCopyWait, check, clickLngLat, drawSquare, strataRows, geodesicAreaM2, mapIdle, mappedHaOf, openPlanner, sourceData } from './helpers.mjs';

const sleep = (ms) => new Promise((r) => setTimeout(r, ms));

/** A small GeoJSON file of two invented strata keyed by "habitat", next to the demo site. */
function importFile(nameA = 'Imported heath (invented)', nameB = 'Imported scrub (invented)') {
  const ringA = [[119.1235, -34.4400], [119.1255, -34.4400], [119.1255, -34.4385], [119.1235, -34.4385], [119.1235, -34.4400]];
  const ringB = [[119.1255, -34.4400], [119.1275, -34.4400], [119.1275, -34.4385], [119.1255, -34.4385], [119.1255, -34.4400]];
  return {
    rings: [ringA, ringB],
    file: {
      name: 'invented-extra-strata.geojson',
      mimeType: 'application/geo+json',
      buffer: Buffer.from(
        JSON.stringify({
          type: 'FeatureCollection',
          features: [
            { type: 'Feature', properties: { habitat: nameA, surveyor: 'invented' }, geometry: { type: 'Polygon', coordinates: [ringA] } },
            { type: 'Feature', properties: { habitat: nameB, surveyor: 'invented' }, geometry: { type: 'Polygon', coordinates: [ringB] } },
          ],
        }),
      ),
    },
  };
}

export const SCENARIOS = [
  {
    no: 1,
    name: 'the demo site opens offline with strata, exclusions, buffers, access points and the areas table',
    async run({ page, origin, shot }) {
      await openPlanner(page, origin);
      const rows = await page.locator('table.ledger tbody tr[data-stratum]').count();
      check(rows === 6, `expected 6 demo strata in the table, saw ${rows}`);
      const heath = await mappedHaOf(page, 'Coastal heath');
      check(heath && Number(heath.replace(/,/g, '')) > 1, `Coastal heath area missing (${heath})`);
      const strata = await sourceData(page, 'sp-strata');
      const buffers = await sourceData(page, 'sp-buffers');
      const excl = await sourceData(page, 'sp-exclusions');
      const access = await sourceData(page, 'sp-access');
      check(strata.features.length >= 6, 'strata not on the map');
      check(excl.features.length >= 5 && buffers.features.length >= 4, `exclusions/buffers not on the map (${excl.features.length}/${buffers.features.length})`);
      check(access.features.length === 2, 'access points not on the map');
      const drawn = await page.evaluate(() => window.__stratplotMap.queryRenderedFeatures({ layers: ['sp-strata-fill'] }).length);
      check(drawn > 0, 'no stratum rendered');
      check(await page.getByText('Map strata').first().isVisible(), 'step path missing');
      check(await page.locator('.maplibregl-ctrl-scale').isVisible(), 'scale bar missing');
      await shot('1-demo-site');
      await page.getByRole('button', { name: /Mark exclusions/ }).click();
      await page.waitForSelector('text=Buffers here are planning distances');
      await shot('1-exclusions-sheet');
      // Delete removes the selected feature; Ctrl+Z brings it back.
      const exclusionRows = () => page.locator('table[aria-label="Exclusions"] tbody tr').count();
      const before = await exclusionRows();
      await page.getByRole('button', { name: 'Show Old mine shaft on the map' }).click();
      await page.keyboard.press('Delete');
      await page.waitForFunction((n) => document.querySelectorAll('table[aria-label="Exclusions"] tbody tr').length === n - 1, before, { timeout: 5000 });
      await page.keyboard.press('Control+z');
      await page.waitForFunction((n) => document.querySelectorAll('table[aria-label="Exclusions"] tbody tr').length === n, before, { timeout: 5000 });
      check((await exclusionRows()) === before, 'undo did not restore the deleted exclusion');
      // Tablet, portrait: the map on top, the sheet below it.
      await page.setViewportSize({ width: 820, height: 1180 });
      await page.getByRole('button', { name: /Map strata/ }).click();
      await mapIdle(page);
      await shot('1-tablet');
      const unnamed = await page.evaluate(() =>
        [...document.querySelectorAll('button, input, select')].filter((el) => {
          const named = el.getAttribute('aria-label') || el.textContent?.trim() || el.getAttribute('title') || (el.id && document.querySelector(`label[for="${el.id}"]`));
          return !named && el.getAttribute('type') !== 'file';
        }).length,
      );
      check(unnamed === 0, `${unnamed} controls have no accessible name`);
    },
  },
  {
    no: 2,
    name: 'a stratum drawn by clicks appears in the table with its ellipsoidal area; vertex moves undo',
    async run({ page, origin, shot }) {
      await openPlanner(page, origin);
      await drawSquare(page);
      await strataRows(page, 7);
      const data = await sourceData(page, 'sp-strata');
      const drawn = data.features.find((f) => f.properties.stratum === 'Stratum 7');
      check(drawn, 'the drawn stratum is not on the map');
      const expected = (geodesicAreaM2(drawn.geometry.coordinates[0]) / 10_000).toFixed(2);
      const shown = (await mappedHaOf(page, 'Stratum 7'))?.replace(/,/g, '');
      // Reference: GeographicLib (geographiclib-geodesic 2.2) geodesic polygon area on WGS84.
      check(shown === expected, `panel shows ${shown} ha, GeographicLib gives ${expected} ha`);
      await mapIdle(page);
      await shot('2-drawn-stratum');
      await page.keyboard.press('Control+z');
      await strataRows(page, 6);
      // Vertex editing: select a stratum from its row, arm "Move vertices", drag one vertex; undo puts it back.
      await page.keyboard.press('Escape');
      const wet = (await sourceData(page, 'sp-strata')).features.find((f) => f.properties.stratum === 'Wet meadow');
      const v = wet.geometry.coordinates[0][5];
      await page.getByRole('button', { name: 'Show Wet meadow on the map and select it' }).click();
      await sleep(700);
      await mapIdle(page);
      await page.keyboard.press('e');
      await sleep(300);
      const box = await page.locator('.map-holder canvas').boundingBox();
      const p = await page.evaluate(([x, y]) => window.__stratplotMap.project([x, y]), v);
      await page.mouse.move(box.x + p.x, box.y + p.y);
      await page.mouse.down();
      await page.mouse.move(box.x + p.x + 15, box.y + p.y + 15, { steps: 5 });
      await page.mouse.move(box.x + p.x + 30, box.y + p.y + 30, { steps: 5 });
      await page.mouse.up();
      await sleep(400);
      const moved = (await sourceData(page, 'sp-strata')).features.find((f) => f.properties.stratum === 'Wet meadow').geometry.coordinates[0][5];
      check(moved[0] !== v[0] || moved[1] !== v[1], 'dragging a vertex did not move it');
      await shot('2-vertex-moved');
      await page.keyboard.press('Escape');
      await page.keyboard.press('Control+z');
      await sleep(300);
      const back = (await sourceData(page, 'sp-strata')).features.find((f) => f.properties.stratum === 'Wet meadow').geometry.coordinates[0][5];
      check(back[0] === v[0] && back[1] === v[1], 'undo did not put the vertex back');
      // Drawing beside neighbours: a square over the southern tip of the heath is clipped to the open ground.
      const heath = (await sourceData(page, 'sp-strata')).features.find((f) => f.properties.stratum === 'Coastal heath');
      const tip = heath.geometry.coordinates[0].reduce((m, c) => (c[1] < m[1] ? c : m));
      const d = 0.0005;
      await page.evaluate((b) => window.__stratplotMap.fitBounds(b, { duration: 0, padding: 120 }), [tip[0] - 2 * d, tip[1] - 2 * d, tip[0] + 2 * d, tip[1] + 2 * d]);
      await mapIdle(page);
      await page.keyboard.press('b');
      for (const [x, y] of [[tip[0] - d, tip[1] - d], [tip[0] + d, tip[1] - d], [tip[0] + d, tip[1] + d], [tip[0] - d, tip[1] + d], [tip[0] - d, tip[1] - d]]) {
        await clickLngLat(page, x, y);
        await sleep(160);
      }
      await strataRows(page, 7);
      const problems = await page.evaluate(() => document.querySelector('.problems')?.textContent ?? '');
      check(!/overlap/i.test(problems), `the stratum drawn beside its neighbours overlaps them: ${problems}`);
      await shot('2-beside');
    },
  },
  {
    no: 3,
    name: 'a GeoJSON file imported through the file input adds strata by the chosen attribute',
    async run({ page, origin, shot }) {
      await openPlanner(page, origin);
      const { rings, file } = importFile();
      await page.setInputFiles('input[data-import="strata"]', file);
      await page.waitForSelector('form.field-pick');
      const chosen = await page.locator('form.field-pick select').inputValue();
      check(chosen === 'habitat', `expected the attribute "habitat" to be offered first, saw "${chosen}"`);
      await page.getByRole('button', { name: 'Add strata', exact: true }).click();
      await strataRows(page, 8);
      // Reference: GeographicLib (geographiclib-geodesic 2.2) geodesic polygon area on WGS84.
      const expected = (geodesicAreaM2(rings[0]) / 10_000).toFixed(2);
      const shown = (await mappedHaOf(page, 'Imported heath (invented)'))?.replace(/,/g, '');
      check(shown === expected, `imported stratum shows ${shown} ha, GeographicLib gives ${expected} ha`);
      await page.setInputFiles('input[data-import="strata"]', { name: 'broken.geojson', mimeType: 'application/json', buffer: Buffer.from('{"type": "FeatureCollection", "features": [') });
      await page.waitForSelector('.notice-error');
      const msg = await page.locator('.notice-error').textContent();
      check(/broken\.geojson/.test(msg ?? ''), `a broken file should be named in the message, saw "${msg}"`);
      await shot('3-imported');
      // Opening a plan over unsaved work asks first; keeping the work leaves it as it was.
      const plan = { format: 'stratplot-plan', version: 1, savedAt: '2026-12-01T00:00:00Z', site: { name: 'Other site (invented)', strata: [], parts: [], exclusions: [], access: [], boundary: null }, design: {}, result: null, rejections: [] };
      await page.setInputFiles('input[data-open-plan]', { name: 'other.stratplot.json', mimeType: 'application/json', buffer: Buffer.from(JSON.stringify(plan)) });
      await page.waitForSelector('[role="alertdialog"]');
      await shot('3-confirm');
      await page.getByRole('button', { name: 'Keep my work' }).click();
      await strataRows(page, 8);
    },
  },
  {
    no: 4,
    name: 'a design runs in the worker (and can be cancelled), its plots are read back from the map, and a rejected plot promotes the next reserve',
    async run({ page, origin, shot }) {
      await openPlanner(page, origin);
      await page.getByRole('button', { name: /3\s*Design/ }).click();
      // A large design (within the 100,000-plot limit, a few seconds of work) is cancelled while it
      // runs: the page stays responsive and nothing is kept.
      const totalInput = page.getByLabel('Total primary plots');
      const spacing = page.getByLabel('Minimum spacing');
      await totalInput.fill('90000');
      await totalInput.press('Enter');
      await spacing.fill('1');
      await spacing.press('Enter');
      await page.getByRole('button', { name: 'Make the design' }).click();
      await page.getByRole('button', { name: 'Cancel' }).click({ timeout: 3000 });
      await page.waitForSelector('text=Design cancelled', { timeout: 5000 });
      check((await page.locator('table[aria-label="Allocation of plots to strata"]').count()) === 0, 'a cancelled design left plots behind');
      await totalInput.fill('36');
      await totalInput.press('Enter');
      await spacing.fill('40');
      await spacing.press('Enter');
      await page.getByRole('button', { name: 'Make the design' }).click();
      await page.waitForSelector('table[aria-label="Allocation of plots to strata"]', { timeout: 60_000 });
      await mapIdle(page);
      const total = await page.evaluate(() => {
        const cells = [...document.querySelectorAll('table[aria-label="Allocation of plots to strata"] tfoot td.num')].map((c) => Number(c.textContent));
        return cells[3] + cells[4];
      });
      const rendered = await page.evaluate(() => {
        const seen = new Map();
        // A feature comes back once per tile it crosses: keep one per plot id.
        for (const f of window.__stratplotMap.queryRenderedFeatures({ layers: ['sp-plots'] })) seen.set(f.properties.plot_id, f.properties);
        return [...seen.values()];
      });
      check(rendered.length === total && total > 0, `map shows ${rendered.length} plots, allocation lists ${total}`);
      // Every plot lies in a feature of its own stratum (checked with turf's point-in-polygon, not the app's code).
      const strata = await sourceData(page, 'sp-strata');
      const plots = await sourceData(page, 'sp-plots');
      for (const f of plots.features) {
        const inside = strata.features.some((s) => s.properties.stratum === f.properties.stratum && booleanPointInPolygon(f.geometry.coordinates, s.geometry));
        check(inside, `plot ${f.properties.plot_id} is not inside stratum ${f.properties.stratum}`);
      }
      await shot('4-design');
      // Clicking a plot opens its popup, built from DOM text: id, UTM and MGRS as in the plot file.
      const one = plots.features[0];
      await clickLngLat(page, one.geometry.coordinates[0], one.geometry.coordinates[1]);
      await page.waitForSelector('.plot-popup', { timeout: 5000 });
      const popup = await page.locator('.plot-popup').textContent();
      check(popup.includes(one.properties.plot_id) && popup.includes('MGRS'), `popup shows "${popup}"`);
      await shot('4-popup');
      const fromFile = await page.evaluate((id) => {
        const p = window.__stratplotMap.queryRenderedFeatures({ layers: ['sp-plots'] }).find((f) => f.properties.plot_id === id);
        return p?.properties.plot_id;
      }, one.properties.plot_id);
      check(fromFile === one.properties.plot_id, 'the clicked plot is not on the map');
      await page.getByRole('button', { name: /4\s*Plots/ }).click();
      const first = plots.features.find((f) => f.properties.role === 'primary');
      const stratum = first.properties.stratum;
      const reserve = plots.features.filter((f) => f.properties.stratum === stratum && f.properties.role === 'reserve').sort((a, b) => a.properties.rank - b.properties.rank)[0];
      check(reserve, `stratum ${stratum} has no reserve to promote`);
      await page.getByRole('button', { name: `Reject plot ${first.properties.plot_id}`, exact: true }).click();
      await page.getByRole('button', { name: 'Reject and promote reserve' }).click();
      await page.waitForSelector(`tr[data-plot="${reserve.properties.plot_id}"][data-status="promoted"]`, { timeout: 5000 });
      check((await page.locator(`tr[data-plot="${first.properties.plot_id}"]`).getAttribute('data-status')) === 'rejected', 'the plot is not marked rejected');
      await mapIdle(page);
      const promoted = await page.evaluate((id) => window.__stratplotMap.queryRenderedFeatures({ layers: ['sp-plots'] }).find((f) => f.properties.plot_id === id)?.properties.state, reserve.properties.plot_id);
      check(promoted === 'promoted', `the map shows reserve ${reserve.properties.plot_id} as ${promoted}`);
      await page.getByRole('button', { name: `Zoom to plot ${reserve.properties.plot_id}` }).click();
      await sleep(700);
      await mapIdle(page);
      await shot('4-plots-rejected');
    },
  },
  {
    no: 5,
    name: 'after a reload the drawn work is restored from the browser copy, also with the network off',
    serviceWorkers: true,
    async run({ page, context, origin, shot }) {
      await openPlanner(page, origin);
      await drawSquare(page);
      await strataRows(page, 7);
      await page.locator('input[aria-label="Name of stratum Stratum 7"]').fill('Restored stratum');
      await page.keyboard.press('Tab');
      await page.waitForFunction(() => document.querySelector('.legend')?.textContent?.includes('Restored stratum'), null, { timeout: 5000 }).catch(async () => {
        throw new Error(`rename not applied; notice: ${await page.locator('.notice').textContent()}; tool: ${await page.locator('.tool-on').count()}`);
      });
      // Wait until the browser copy (IndexedDB) holds the rename.
      check(await browserCopyWait(page, ['Restored stratum']), 'the rename never reached the browser copy');
      await page.reload();
      await openPlanner(page, origin);
      const rows = await page.locator('table.ledger tbody tr[data-stratum]').count();
      check(rows === 7, `expected 7 strata after reload, saw ${rows}`);
      check((await mappedHaOf(page, 'Restored stratum')) !== null, 'the renamed stratum was not restored');
      await shot('5-restored');
      // Offline: the service worker has cached the built files; the planner must open without a network.
      await page.evaluate(async () => {
        await navigator.serviceWorker.ready;
        if (!navigator.serviceWorker.controller) await new Promise((r) => navigator.serviceWorker.addEventListener('controllerchange', r, { once: true }));
      });
      await context.setOffline(true);
      await page.reload();
      await openPlanner(page, origin);
      check((await mappedHaOf(page, 'Restored stratum')) !== null, 'offline, the planner did not open with the work restored');
      await shot('5-offline');
      // The field view's own address (#field, for a phone's home screen) opens offline too.
      await page.goto(`${origin}/#field`);
      await page.reload();
      await page.waitForSelector('.field-view', { timeout: 20_000 });
      check((await page.locator('.fv-title').textContent()) === 'In the field', 'offline, the field view did not open at #field');
      await context.setOffline(false);
    },
  },
  {
    no: 6,
    name: 'a name carrying markup is shown as text, never run',
    async run({ page, origin, shot, watch }) {
      await openPlanner(page, origin);
      const payload = '<img src=x onerror=alert(1)>';
      const { file } = importFile(payload, 'Plain <b>bold</b> scrub');
      await page.setInputFiles('input[data-import="strata"]', file);
      await page.getByRole('button', { name: 'Add strata', exact: true }).click();
      await strataRows(page, 8);
      check((await mappedHaOf(page, payload)) !== null, 'the stratum with markup in its name is not listed by that name');
      const injected = await page.evaluate(() => document.querySelectorAll('img[src="x"], b').length);
      check(injected === 0, 'markup from a file became page elements');
      await page.getByRole('button', { name: 'New outlines go into' }).count();
      const options = await page.locator('option', { hasText: payload }).count();
      check(options > 0, 'the name is not offered as text in the stratum picker');
      await mapIdle(page);
      await sleep(300);
      check(watch.dialogs.length === 0, 'a script from the file ran');
      await shot('6-markup-as-text');
    },
  },
  {
    no: 7,
    name: 'when the browser-copy worker cannot start, the planner opens and keeps its copy from the page',
    async run({ page, origin, watch }) {
      let refused = 0;
      await page.route('**/assets/browserCopyWorker-*', (route) => {
        refused++;
        return route.abort();
      });
      await openPlanner(page, origin);
      await page.locator('input[aria-label="Name of stratum Coastal heath"]').fill('Heath kept without its worker');
      await page.keyboard.press('Tab');
      check(await browserCopyWait(page, ['Heath kept without its worker']), 'the rename never reached the browser copy');
      await page.reload();
      await openPlanner(page, origin);
      check((await mappedHaOf(page, 'Heath kept without its worker')) !== null, 'the renamed stratum was not restored');
      const errors = await page.locator('.notice-error').allTextContents();
      check(errors.length === 0, `an error was shown: ${errors.join(' | ')}`);
      check(refused > 0, 'the worker script was never asked for, so the page path was not tried');
      // The refused worker script is logged by the browser; nothing else may be.
      watch.consoleErrors = watch.consoleErrors.filter((e) => !/Failed to load resource|browserCopyWorker/.test(e));
    },
  },
  RESULTS_SCENARIO,
  IMPORT_CHOICE_SCENARIO,
  FIELD_STATE_SCENARIO,
  DESIGN_SIZING_SCENARIO,
  LAYOUT_SCENARIO,
  NOTHING_LOST_SCENARIO,
  EXPORTS_SCENARIO,
  GUIDANCE_SCENARIO,
  PLOT_CHECK_SCENARIO,
  HOSTILE_IMPORT_SCENARIO,
  FIELD_VIEW_SCENARIO,
];
