import { execFileSync } from 'node:child_process';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { check, geodesicAreaM2, mappedHaOf, openPlanner, strataRows } from './helpers.mjs';

const here = dirname(fileURLToPath(import.meta.url));

/** The invented zipped shapefile without a .prj, written by the project's own shapefile writer. */
function shapefileWithoutPrj() {
  const tsx = join(here, '..', '..', 'node_modules', '.bin', 'tsx');
  const out = execFileSync(tsx, [join(here, 'fixtures', 'shapefileWithoutPrj.ts')], { encoding: 'utf8' });
  return JSON.parse(out);
}

/**
 * A zipped shapefile in UTM eastings/northings with no .prj: the planner asks for its EPSG code,
 * offers the site's zone, names the code typed, and then adds the stratum with its ellipsoidal area.
 */
export const IMPORT_CHOICE_SCENARIO = {
  no: 'import-choice',
  name: 'a zipped shapefile without a .prj asks for its EPSG code and then adds its stratum with the right area',
  async run({ page, origin, shot }) {
    const { ring, zipBase64, entries } = shapefileWithoutPrj();
    check(!entries.some((e) => e.endsWith('.prj')), 'the fixture zip should carry no .prj');
    await openPlanner(page, origin);
    await page.setInputFiles('input[data-import="strata"]', { name: 'invented-swale.zip', mimeType: 'application/zip', buffer: Buffer.from(zipBase64, 'base64') });
    const form = page.getByRole('form', { name: 'How to read invented-swale.zip' });
    await form.waitFor({ timeout: 10_000 });
    const epsg = form.getByLabel('Coordinate system (EPSG code)');
    // The demo site lies at about 119.1°E 34.4°S: UTM zone 50 south, EPSG:32750 (EPSG dataset, epsg.org).
    const offered = await page.evaluate(() => [...document.querySelectorAll('form.import-choice datalist option')].map((o) => o.getAttribute('value')));
    check(offered[0] === '4326' && offered[1] === '32750', `expected 4326 then the site's zone 32750 offered, saw ${offered.slice(0, 3).join(', ')}`);
    check(await form.getByRole('button', { name: 'Read the file' }).isDisabled(), 'the file could be read before a code was given');
    await epsg.fill('32761');
    check((await form.locator('output').textContent()) === 'not a code stratplot can read coordinates in', 'an unknown code was not flagged');
    await epsg.fill('32750');
    const named = await form.locator('output').textContent();
    check(named === 'WGS 84 / UTM zone 50S', `the code's name is not shown once typed (saw "${named}")`);
    await shot('import-choice-epsg');
    await form.getByRole('button', { name: 'Read the file' }).click();
    await page.waitForSelector('form.field-pick');
    await page.getByRole('button', { name: 'Add strata', exact: true }).click();
    await strataRows(page, 7);
    // Reference: GeographicLib (geographiclib-geodesic 2.2) geodesic polygon area on WGS84 of the ring
    // before it was written in UTM 50S; the planner shows hectares to 2 decimals.
    const expected = (geodesicAreaM2(ring) / 10_000).toFixed(2);
    const shown = (await mappedHaOf(page, 'Swale sedgeland (invented)'))?.replace(/,/g, '');
    check(shown === expected, `imported stratum shows ${shown} ha, GeographicLib gives ${expected} ha`);
    await shot('import-choice-added');
  },
};
