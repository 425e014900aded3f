import { execFileSync } from 'node:child_process';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { check, openPlanner, sourceData, strataRows } from './helpers.mjs';

const here = dirname(fileURLToPath(import.meta.url));

/** Hostile files built by the project's own generator (tests/hostile/hostileFiles.ts), by name. */
function hostileFiles() {
  const tsx = join(here, '..', '..', 'node_modules', '.bin', 'tsx');
  const list = JSON.parse(execFileSync(tsx, [join(here, 'fixtures', 'hostileImports.ts')], { encoding: 'utf8', maxBuffer: 64 * 1024 * 1024 }));
  return Object.fromEntries(list.map((f) => [f.name, Buffer.from(f.base64, 'base64')]));
}

/** The planner's site as the map shows it: strata, exclusions and access points, for before/after comparison. */
async function siteOnMap(page) {
  const ids = ['sp-strata', 'sp-exclusions', 'sp-access'];
  const data = await Promise.all(ids.map((id) => sourceData(page, id)));
  return JSON.stringify(data);
}

/** Waits for the message beside the import control of `role` and returns it with the status line's. */
async function refusal(page, role) {
  const beside = page.locator(`[data-import-box="${role}"] .import-problem`);
  await beside.waitFor({ timeout: 20_000 });
  const status = await page.locator('.notice-error').textContent();
  return { beside: (await beside.textContent()) ?? '', status: status ?? '' };
}

/**
 * Hostile map files chosen (and one dropped) on the import controls: each is refused with its
 * reason beside the control used and in the status line, the plan on the map stays exactly as it
 * was, and the planner still imports a good file afterwards.
 */
export const HOSTILE_IMPORT_SCENARIO = {
  no: 'hostile-import',
  name: 'hostile files dropped or chosen are refused beside the control, the plan untouched, the planner still working',
  async run({ page, origin, shot }) {
    const files = hostileFiles();
    await openPlanner(page, origin);
    await strataRows(page, 6);
    const before = await siteOnMap(page);
    const cases = [
      ['nan-vertex.zip', /feature 0, vertex 7: the X coordinate is NaN, not a finite number/],
      ['bad-tuple.kml', /coordinate 3 "abc,def" is not longitude,latitude/],
      ['tampered.kmz', /doc\.kml inflates to more than the 100 bytes its header states/],
    ];
    for (const [name, pattern] of cases) {
      await page.setInputFiles('input[data-import="strata"]', { name, mimeType: 'application/octet-stream', buffer: files[name] });
      const r = await refusal(page, 'strata');
      check(r.beside.startsWith(name) && pattern.test(r.beside), `${name}: beside the control saw "${r.beside}"`);
      check(r.status.includes(r.beside), `${name}: the status line says "${r.status}"`);
      await page.locator('[data-import-box="strata"] .import-problem').waitFor({ state: 'attached' });
    }
    // The reason wraps inside the control's own box on a desktop, a tablet and a phone (how wide the
    // side panel itself may be on a phone is the layout's business, not this message's).
    for (const [width, height] of [[1440, 900], [1024, 768], [390, 844]]) {
      await page.setViewportSize({ width, height });
      const beside = page.locator('[data-import-box="strata"] .import-problem');
      await beside.scrollIntoViewIfNeeded();
      const [own, holder] = await Promise.all([beside.boundingBox(), page.locator('[data-import-box="strata"]').boundingBox()]);
      check(own && holder && own.x >= holder.x && own.x + own.width <= holder.x + holder.width + 1, `at ${width}×${height} the reason runs out of its control's box`);
      await shot(`hostile-import-beside-${width}x${height}`);
    }
    await page.setViewportSize({ width: 1400, height: 900 });
    // Dropped on the control rather than chosen: GeoJSON nested 100 000 GeometryCollections deep.
    await page.evaluate((b64) => {
      const bytes = Uint8Array.from(atob(b64), (c) => c.charCodeAt(0));
      const dt = new DataTransfer();
      dt.items.add(new File([bytes], 'deep.geojson', { type: 'application/geo+json' }));
      const target = document.querySelector('[data-import-box="strata"] label');
      target.dispatchEvent(new DragEvent('dragover', { dataTransfer: dt, bubbles: true, cancelable: true }));
      target.dispatchEvent(new DragEvent('drop', { dataTransfer: dt, bubbles: true, cancelable: true }));
    }, files['deep.geojson'].toString('base64'));
    await page.waitForFunction(() => /deep\.geojson/.test(document.querySelector('[data-import-box="strata"] .import-problem')?.textContent ?? ''), null, { timeout: 20_000 });
    const deep = await refusal(page, 'strata');
    check(/GeometryCollections are nested more than 32 deep; stratplot's limit is 32 levels/.test(deep.beside), `deep.geojson: saw "${deep.beside}"`);
    check((await siteOnMap(page)) === before, 'a refused strata file changed the plan');
    await strataRows(page, 6);

    await page.getByRole('button', { name: /Mark exclusions/ }).click();
    for (const [name, pattern] of [
      ['hex.gpx', /<wpt> 2 \("Gate 2"\): lat="0x10" is not a latitude/],
      ['no-access.geojson', /no access points \(the file has no features\)/],
    ]) {
      await page.setInputFiles('input[data-import="access"]', { name, mimeType: 'application/octet-stream', buffer: files[name] });
      await page.waitForFunction((n) => (document.querySelector('[data-import-box="access"] .import-problem')?.textContent ?? '').startsWith(n), name, { timeout: 20_000 });
      const r = await refusal(page, 'access');
      check(pattern.test(r.beside), `${name}: beside the access control saw "${r.beside}"`);
    }
    await shot('hostile-import-access');
    check((await siteOnMap(page)) === before, 'a refused access file changed the plan');

    // Still working: a good file is read, and the old message beside the control goes away.
    await page.getByRole('button', { name: /Map strata/ }).click();
    const ring = [[119.1235, -34.44], [119.1255, -34.44], [119.1255, -34.4385], [119.1235, -34.4385], [119.1235, -34.44]];
    const good = { type: 'FeatureCollection', features: [{ type: 'Feature', properties: { habitat: 'After the refusals (invented)' }, geometry: { type: 'Polygon', coordinates: [ring] } }] };
    await page.setInputFiles('input[data-import="strata"]', { name: 'good.geojson', mimeType: 'application/geo+json', buffer: Buffer.from(JSON.stringify(good)) });
    await page.waitForSelector('form.field-pick');
    check((await page.locator('[data-import-box="strata"] .import-problem').count()) === 0, 'the old refusal is still shown after a good file was chosen');
    await page.getByRole('button', { name: 'Add strata', exact: true }).click();
    await strataRows(page, 7);
    await shot('hostile-import-recovered');
  },
};
