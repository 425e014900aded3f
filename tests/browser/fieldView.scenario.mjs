import { execFileSync } from 'node:child_process';
import { readFileSync, writeFileSync, mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import geodesic from 'geographiclib-geodesic';
import geomagnetism from 'geomagnetism';
import { browserCopyWait, check, openPlanner, sourceData } from './helpers.mjs';

const root = join(dirname(fileURLToPath(import.meta.url)), '..', '..');
const WGS84 = geodesic.Geodesic.WGS84;
const sleep = (ms) => new Promise((r) => setTimeout(r, ms));

/** The point `m` metres from a plot along azimuth `azi` (GeographicLib direct problem). */
function offset(p, m, azi) {
  const r = WGS84.Direct(p.lat, p.lon, azi, m);
  return { lat: r.lat2, lon: r.lon2 };
}

async function walkTo(context, page, at, accuracy = 3) {
  await context.setGeolocation({ latitude: at.lat, longitude: at.lon, accuracy });
  await page.waitForFunction(
    ([lat, lon]) => document.querySelector('[data-figure="position"]')?.textContent === `${lat.toFixed(6)}, ${lon.toFixed(6)}`,
    [at.lat, at.lon],
    { timeout: 10_000 },
  );
}

const nextId = (page) => page.locator('.fv-guide .fv-plot-id').textContent();
const figure = async (page, name) => Number((await page.locator(`[data-figure="${name}"]`).textContent()).replace(/[^0-9.]/g, ''));

/** Every control of the field view lies within the screen's width, and the page does not scroll sideways. */
async function reachableAcross(page, width) {
  await page.evaluate(() => {
    for (const d of document.querySelectorAll('.field-view details')) d.open = true;
  });
  const out = await page.evaluate((w) => {
    const doc = document.documentElement;
    const controls = [...document.querySelectorAll('.field-view button, .field-view input:not(.file-input), .field-view select, .field-view textarea, .field-view a, .field-view summary, .field-view label.file-label')];
    const outside = controls.filter((c) => {
      const r = c.getBoundingClientRect();
      return r.width > 0 && (r.left < -0.5 || r.right > w + 0.5);
    });
    return { scroll: doc.scrollWidth - doc.clientWidth, count: controls.length, outside: outside.slice(0, 5).map((c) => `${c.tagName} ${c.textContent?.slice(0, 30) || c.getAttribute('aria-label') || ''}`) };
  }, width);
  check(out.scroll <= 0, `the field view scrolls sideways by ${out.scroll} px at ${width} px`);
  check(out.outside.length === 0, `controls beyond the screen's edge at ${width} px: ${out.outside.join('; ')}`);
  check(out.count > 20, `only ${out.count} controls found`);
}

/**
 * The field view at 390×844 with a mocked geolocation walking over the invented demo site: the
 * distance and bearings to the next plot against GeographicLib (geographiclib-geodesic 2.2, Karney
 * 2013) and the magnetic bearing against the WMM2025 of the geomagnetism package; arrival at the
 * radius; the warning inside the cliff buffer; a rejection promoting the first reserve of the
 * stratum; a reload in the middle of typing; and the results CSV giving the same estimate in
 * `stratplot estimate` as in the Results step.
 */
export const FIELD_VIEW_SCENARIO = {
  no: 'walk',
  name: 'field view on a phone: live distance and bearings, arrival, cliff warning, rejection, reload mid-form, results CSV estimated alike by the CLI and the Results step',
  async run({ page, context, origin, shot }) {
    await context.grantPermissions(['geolocation'], { origin });
    await context.setGeolocation({ latitude: -34.4405, longitude: 119.119, accuracy: 5 });
    await openPlanner(page, origin);
    await page.getByRole('button', { name: /3\s*Design/ }).click();
    for (const [name, kind] of [
      ['grass_cover', 'percent'],
      ['shrub_height_cm', 'number'],
    ]) {
      await page.getByLabel('Measurement', { exact: true }).fill(name);
      await page.getByLabel('Kind', { exact: true }).selectOption(kind);
      await page.getByRole('button', { name: 'Add measurement' }).click();
    }
    await page.getByRole('button', { name: 'Make the design' }).click();
    await page.waitForSelector('table[aria-label="Allocation of plots to strata"]', { timeout: 60_000 });
    const plots = (await sourceData(page, 'sp-plots')).features.map((f) => ({ ...f.properties, lon: f.geometry.coordinates[0], lat: f.geometry.coordinates[1] }));
    const byId = new Map(plots.map((p) => [p.plot_id, p]));

    await page.setViewportSize({ width: 390, height: 844 });
    await page.getByRole('link', { name: 'Field view' }).click();
    await page.waitForSelector('.fv-guide', { timeout: 10_000 });
    await page.getByLabel('Crew name (recorded with every visit)').fill('Crew Banksia (invented)');
    await page.getByLabel('Crew name (recorded with every visit)').blur();

    // Distance and bearings from 143.7 m south-west of the next plot.
    const first = byId.get(await nextId(page));
    const start = offset(first, 143.7, 222.5);
    await walkTo(context, page, start);
    const ref = WGS84.Inverse(start.lat, start.lon, first.lat, first.lon);
    const azi = (ref.azi1 + 360) % 360;
    const shownM = await figure(page, 'distance');
    const shownTrue = await figure(page, 'bearing-true');
    const shownMag = await figure(page, 'bearing-mag');
    const decl = geomagnetism.model(new Date()).point([start.lat, start.lon]).decl;
    const mag = (azi - decl + 360) % 360;
    check(Math.abs(shownM - ref.s12) <= 0.5, `distance shown ${shownM} m, GeographicLib ${ref.s12.toFixed(2)} m`);
    check(Math.abs(shownTrue - azi) <= 0.1, `true bearing shown ${shownTrue}°, GeographicLib ${azi.toFixed(3)}°`);
    check(Math.abs(shownMag - mag) <= 0.1, `magnetic bearing shown ${shownMag}°, WMM2025 gives ${mag.toFixed(3)}° (declination ${decl.toFixed(3)}°)`);
    await page.evaluate(() => window.scrollTo(0, 0));
    await shot('field-phone-guide');
    // A compass facing magnetic east (absolute alpha 270°, counted anticlockwise): the arrow turns by the heading from true north.
    await page.evaluate(() => window.dispatchEvent(new DeviceOrientationEvent('deviceorientationabsolute', { alpha: 270, beta: 0, gamma: 0, absolute: true })));
    await page.waitForSelector('svg.fv-arrow[aria-label="Turn to the arrow"]', { timeout: 5000 });
    const turned = Number((await page.locator('svg.fv-arrow g').getAttribute('transform')).match(/rotate\(([-\d.]+)\)/)[1]);
    const wanted = (((azi - (90 + decl)) % 360) + 360) % 360;
    check(Math.abs(turned - wanted) <= 0.1, `the arrow turns to ${turned}° with the device facing magnetic east, expected ${wanted.toFixed(2)}°`);

    // Arrival at the radius (5 m): not at 7 m, yes at 4 m; with ±12 m the radius widens to 12 m.
    await walkTo(context, page, offset(first, 7, 40), 3);
    check((await page.locator('.fv-guide').getAttribute('data-arrived')) === 'no', 'arrived 7 m from the plot with a 5 m radius');
    await walkTo(context, page, offset(first, 4, 40), 3);
    await page.waitForSelector('.fv-guide[data-arrived="yes"]', { timeout: 5000 });
    await walkTo(context, page, offset(first, 10, 40), 12);
    check((await page.locator('.fv-guide').getAttribute('data-arrived')) === 'yes', 'no arrival 10 m away with ±12 m accuracy (the radius widens to the accuracy)');
    check(/widened/.test(await page.locator('.fv-guide').textContent()), 'the widened radius is not explained');
    await walkTo(context, page, offset(first, 2, 40), 3);
    await page.getByRole('button', { name: `Mark ${first.plot_id} visited` }).click();
    await page.waitForSelector(`li[data-plot="${first.plot_id}"][data-state="visited"]`, { timeout: 5000 });
    check((await nextId(page)) !== first.plot_id, 'the next plot did not move on after the visit');

    // Within the cliff's 15 m buffer (invented demo exclusion): the warning names it.
    const cliff = JSON.parse(readFileSync(join(root, 'demo-maps', 'ochre-spit-exclusions.geojson'), 'utf8')).features.find((f) => f.properties.kind === 'cliff');
    const [clon, clat] = cliff.geometry.coordinates[3];
    await walkTo(context, page, offset({ lon: clon, lat: clat }, 6, 0));
    const alert = page.getByRole('alert', { name: 'Safety warning' });
    await alert.waitFor({ timeout: 5000 });
    check((await alert.textContent()).includes(cliff.properties.name), 'the safety warning does not name the cliff');
    check(/employer's safety plan/.test(await alert.textContent()), 'the safety warning lacks the standing caution');
    await page.evaluate(() => window.scrollTo(0, 0));
    await shot('field-phone-cliff');
    await walkTo(context, page, start);
    check((await page.getByRole('alert', { name: 'Safety warning' }).count()) === 0, 'the warning stays after leaving the buffer');

    // A rejection promotes the first waiting reserve of the stratum, in rank order.
    const rejected = byId.get(await nextId(page));
    const reserve = plots.filter((p) => p.stratum === rejected.stratum && p.role === 'reserve').sort((a, b) => a.rank - b.rank)[0];
    await page.getByRole('button', { name: 'Cannot sample it…' }).click();
    await page.getByRole('button', { name: 'Reject and promote reserve' }).click();
    await page.waitForSelector(`.fv-list li[data-plot="${reserve.plot_id}"][data-state="promoted"]`, { timeout: 5000 });
    await page.waitForSelector(`li[data-plot="${rejected.plot_id}"][data-state="rejected"]`, { state: "attached", timeout: 5000 });

    // A reload in the middle of typing keeps what was typed (the rejection is in the browser copy at once).
    check(await browserCopyWait(page, [`"reject_reason"`]), 'the rejection never reached the browser copy');
    const typing = await nextId(page);
    await page.getByLabel(/^grass_cover/).fill('37.5');
    await page.reload();
    await page.waitForSelector('.fv-guide', { timeout: 30_000 });
    check((await nextId(page)) === typing, `after the reload the next plot is ${await nextId(page)}, not ${typing}`);
    const kept = await page.getByLabel(/^grass_cover/).inputValue();
    check(kept === '37.5', `after a reload mid-form grass_cover holds "${kept}", not "37.5"`);
    await page.getByLabel(/^grass_cover/).fill('');

    // Walk the rest: every plot to visit is recorded with invented values (not measurements).
    const order = await page.locator('ol.fv-list > li').evaluateAll((lis) => lis.map((li) => li.getAttribute('data-plot')));
    let k = 0;
    for (const id of order) {
      const p = byId.get(id);
      const h = [...new Set(plots.map((q) => q.stratum))].indexOf(p.stratum);
      await page.locator(`ol.fv-list li[data-plot="${id}"] button`).click();
      await page.waitForFunction((pid) => document.querySelector('.fv-guide .fv-plot-id')?.textContent === pid, id);
      if ((await page.getByRole('button', { name: `Mark ${id} visited` }).count()) === 1) await page.getByRole('button', { name: `Mark ${id} visited` }).click();
      await page.getByLabel(/^grass_cover/).fill(String(12 + 9 * h + ((k * 7) % 5)));
      await page.getByLabel(/^shrub_height_cm/).fill(String(40 + 3 * h + (k % 4) * 2.5));
      await page.getByLabel('Note', { exact: true }).fill(k === 0 ? '=1+1 looks like a formula, kept as text' : '');
      await page.getByRole('button', { name: 'Keep entries' }).click();
      k++;
    }
    await page.waitForSelector(`ol.fv-list li[data-plot="${order.at(-1)}"][data-state="visited"]`, { timeout: 5000 });
    await reachableAcross(page, 390);
    await page.evaluate(() => window.scrollTo(0, 0));
    await shot('field-phone-list');

    // The results CSV and the plot file, handed to `stratplot estimate`.
    const dir = mkdtempSync(join(tmpdir(), 'stratplot-field-'));
    const save = async (label, name) => {
      const download = page.waitForEvent('download', { timeout: 30_000 });
      await page.getByRole('button', { name: label }).click();
      const path = join(dir, name);
      writeFileSync(path, readFileSync(await (await download).path()));
      return path;
    };
    const csvPath = await save('Results CSV', 'results.csv');
    const plotsPath = await save('Plot file (GeoJSON)', 'plots.geojson');
    const csv = readFileSync(csvPath, 'utf8');
    check(csv.includes("'=1+1"), 'the note that looks like a formula is not guarded in the CSV');
    check(csv.includes(`${rejected.plot_id},`) && csv.includes(`rejected,${reserve.plot_id}`), 'the CSV does not show the rejection and its reserve');
    const cli = JSON.parse(execFileSync(process.execPath, [join(root, 'bin', 'stratplot.mjs'), 'estimate', plotsPath, csvPath, '--value', 'grass_cover', '--kind', 'cover', '--json'], { encoding: 'utf8' }));
    check(Number.isFinite(cli.mean), `stratplot estimate gave no mean: ${JSON.stringify(cli).slice(0, 200)}`);

    await page.getByRole('button', { name: 'Open in the Results step' }).click();
    await page.waitForSelector('table[aria-label="Estimate of grass_cover by stratum"]', { timeout: 20_000 });
    const shown = Number((await page.locator('td[data-cell="mean"]').textContent()).replace(/,/g, ''));
    check(Math.abs(shown - cli.mean) < 0.006, `the Results step shows a mean of ${shown}, stratplot estimate ${cli.mean}`);
    check((await page.locator('.results-clean').count()) === 1, 'the Results step finds problems in the field results');
    await sleep(100);
    await shot('field-results-step');

    // The planner's Plots step shows which plots were done, when and by whom.
    await page.getByRole('button', { name: /4\s*Plots/ }).click();
    const row = await page.locator(`tr[data-plot="${first.plot_id}"] .plot-status`).textContent();
    check(/visited .* by Crew Banksia \(invented\)/.test(row), `the Plots step says "${row}" for ${first.plot_id}`);

    // With no position (location refused), the plots are listed with coordinates and still recorded.
    await context.clearPermissions();
    await page.goto(`${origin}/#field`);
    await page.reload();
    await page.waitForSelector('.fv-position', { timeout: 30_000 });
    await page.waitForFunction(() => /No position/.test(document.querySelector(".fv-position")?.textContent ?? ''), null, { timeout: 10_000 });
    check((await page.locator('.fv-row-coords').count()) >= order.length, 'without a position the plots are not listed with their coordinates');
    await page.locator(`ol.fv-list li[data-plot="${first.plot_id}"] button`).click();
    await page.getByRole('button', { name: 'Take back the visit' }).click();
    await page.getByRole('button', { name: /^Mark .* visited$/ }).click();
    await page.waitForFunction(() => /no position/.test(document.querySelector('.fv-record .fv-state')?.textContent ?? ''), null, { timeout: 5000 });
    await page.evaluate(() => window.scrollTo(0, 0));
    await shot('field-phone-no-position');
  },
};
