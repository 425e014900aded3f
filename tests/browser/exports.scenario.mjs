import { execFileSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import geomagnetism from 'geomagnetism';
import { check, openPlanner, sourceData } from './helpers.mjs';

/** Every plot placemark of a KML document as { name: { property: value } }, read with a plain pattern (no app code). */
function kmlPlotData(kml) {
  const plots = {};
  for (const [, body] of kml.matchAll(/<Placemark>([\s\S]*?)<\/Placemark>/g)) {
    const data = Object.fromEntries([...body.matchAll(/<SimpleData name="([^"]+)">([^<]*)<\/SimpleData>/g)].map(([, k, v]) => [k, v]));
    if (data.plot_id) plots[data.plot_id] = data;
  }
  return plots;
}

async function exportAs(page, label) {
  await page.getByLabel('Export as').selectOption({ label });
  const download = page.waitForEvent('download', { timeout: 30_000 });
  await page.getByRole('button', { name: 'Export', exact: true }).click();
  const file = await download;
  return { name: file.suggestedFilename(), bytes: readFileSync(await file.path()) };
}

/**
 * Field exports from the planner match the command line's options: plain KML besides KMZ, the
 * survey date (sheets' date, declination for that day) and the access point distances and bearings
 * are measured from. Undo of a field decision made on another step shows that step and says what
 * it undid.
 */
export const EXPORTS_SCENARIO = {
  no: 'exports',
  name: 'exports take the survey date, the access point and plain KML; undo of a rejection from another step shows the Plots step',
  async run({ page, origin, shot }) {
    await openPlanner(page, origin);
    await page.getByRole('button', { name: /3\s*Design/ }).click();
    await page.getByRole('button', { name: 'Make the design' }).click();
    await page.waitForSelector('table[aria-label="Allocation of plots to strata"]', { timeout: 60_000 });
    const plots = (await sourceData(page, 'sp-plots')).features.map((f) => f.properties);
    const access = (await sourceData(page, 'sp-access')).features;
    const north = access.find((f) => f.properties.name === 'North car park');
    check(north, 'the demo site has no North car park');

    // A rejection made on step 4, undone from step 1: the planner goes to step 4 and says what it undid.
    await page.getByRole('button', { name: /4\s*Plots/ }).click();
    const first = plots.find((p) => p.role === 'primary');
    await page.getByRole('button', { name: `Reject plot ${first.plot_id}`, exact: true }).click();
    await page.getByRole('button', { name: 'Reject and promote reserve' }).click();
    await page.waitForSelector(`tr[data-plot="${first.plot_id}"][data-status="rejected"]`);
    await page.getByRole('button', { name: /1\s*Map strata/ }).click();
    await page.locator('body').click({ position: { x: 5, y: 5 } });
    await page.keyboard.press('Control+z');
    await page.waitForSelector(`tr[data-plot="${first.plot_id}"][data-status="planned"]`, { timeout: 5000 });
    const step = await page.locator('.step-on').textContent();
    check(/Plots/.test(step), `after undo the planner shows step "${step}", not the Plots step where the rejection was made`);
    const said = await page.locator('.notice').textContent();
    check(said.includes(`Undone in step 4, Plots: ${first.plot_id} rejected (Unsafe to reach)`), `undo says "${said}"`);
    await page.keyboard.press('Control+y');
    await page.waitForSelector(`tr[data-plot="${first.plot_id}"][data-status="rejected"]`, { timeout: 5000 });

    await page.getByLabel('Survey date').fill('2027-03-15');
    await page.getByLabel('Distances and bearings from').selectOption({ label: 'North car park' });
    await page.locator('.export-box').scrollIntoViewIfNeeded();
    await shot('exports-options');

    const kml = await exportAs(page, 'KML (plain, for desktop GIS and globes)');
    const text = kml.bytes.toString('utf8');
    check(kml.name.endsWith('-plots.kml') && text.startsWith('<?xml') && /<kml xmlns="http:\/\/www\.opengis\.net\/kml\/2\.2"/.test(text), `the KML export is not plain KML 2.2 (${kml.name})`);
    const placed = kmlPlotData(text);
    check(Object.keys(placed).length === plots.length, `KML holds ${Object.keys(placed).length} plots, the design ${plots.length}`);
    // Declination at the access point on the survey day from the geomagnetism package (WMM2025), a reference from the registry.
    const [lon, lat] = north.geometry.coordinates;
    const expected = Math.round(geomagnetism.model(new Date('2027-03-15T12:00:00Z')).point([lat, lon]).decl * 100) / 100;
    for (const [id, p] of Object.entries(placed)) {
      check(p.access_point === north.properties.id, `plot ${id} is measured from ${p.access_point}, not from North car park`);
      check(Number(p.declination_deg) === expected, `plot ${id} has declination ${p.declination_deg}°, WMM2025 gives ${expected}° on 2027-03-15`);
      // Decimal year by the package's rule: 2027 + (31 + 28 + 14.5) / 365 = 2027.20.
      check(p.mag_model.includes('for 2027.20'), `plot ${id}: magnetic model "${p.mag_model}" is not for the survey date`);
    }

    const kmz = await exportAs(page, 'KMZ for phones and globes');
    check(kmz.bytes.subarray(0, 2).toString('latin1') === 'PK', 'the KMZ export is not a zip');

    const sheets = await exportAs(page, 'Field sheets (PDF)');
    const pdfText = execFileSync('pdftotext', ['-layout', '-', '-'], { input: sheets.bytes }).toString('utf8');
    check(pdfText.includes('Survey date 2027-03-15'), 'the field sheets do not carry the survey date');
    check(/at North car park/.test(pdfText), 'the field sheets do not measure from North car park');
  },
};
