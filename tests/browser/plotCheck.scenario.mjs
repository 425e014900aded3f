import { execFileSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import Papa from 'papaparse';
import { check, clickLngLat, mapIdle, openPlanner, sourceData } from './helpers.mjs';

const here = dirname(fileURLToPath(import.meta.url));
const SET = join(here, '..', '..', 'demo-maps', 'check-example', 'ochre-spit-plots-to-check.geojson');
const sleep = (ms) => new Promise((r) => setTimeout(r, ms));

/**
 * The answers the hand-made set is placed for (scripts/make-check-example.ts), with the demo design's
 * settings the Plots step starts from: 40 m spacing and a 20 m square footprint.
 */
const FAILING = ['HEA-07', 'EUC-12', 'HEA-09', 'BAN-03', 'BAN-04', 'BAN-05', 'BAN-05', 'EUC-20'];

async function download(page, name) {
  const got = page.waitForEvent('download', { timeout: 30_000 });
  await page.getByRole('button', { name, exact: true }).click();
  const d = await got;
  return { name: d.suggestedFilename(), path: await d.path() };
}

/**
 * On the Plots step the hand-made plot set is checked from a file beside the design: the table
 * lists the failing plots first, the map draws them in the warning symbol, a click opens a plot's
 * reasons, the design's own plots can be hidden, and the report downloads as PDF and CSV.
 */
export const PLOT_CHECK_SCENARIO = {
  no: 'check',
  name: 'a plot set from a file is checked on the Plots step: failing plots flagged on the map and in the table, reasons on click, report as PDF and CSV',
  async run({ page, origin, shot }) {
    await page.setViewportSize({ width: 1440, height: 900 });
    await openPlanner(page, origin);
    await page.getByRole('button', { name: /3\s*Design/ }).click();
    await page.getByRole('button', { name: 'Make the design' }).click();
    await page.waitForSelector('table[aria-label="Allocation of plots to strata"]', { timeout: 60_000 });
    await page.getByRole('button', { name: /4\s*Plots/ }).click();
    await page.waitForSelector('text=Check plots from a file');
    await page.setInputFiles('input[data-import="plot-check"]', SET);
    await page.waitForSelector('table[aria-label="Checked plots, most serious first"] tbody tr', { timeout: 30_000 });
    const rows = await page.$$eval('table[aria-label="Checked plots, most serious first"] tbody tr', (trs) => trs.map((tr) => [tr.getAttribute('data-check-plot'), tr.getAttribute('data-check')]));
    check(rows.length === 9, `expected 9 checked plots, saw ${rows.length}`);
    const failing = rows.filter(([, c]) => c === 'fail').map(([id]) => id);
    check(JSON.stringify([...failing].sort()) === JSON.stringify([...FAILING].sort()), `failing plots ${failing.join(', ')}`);
    check(rows[0][0] === 'HEA-07' && rows.at(-1)[0] === 'BAN-06', `not most serious first: ${rows.map((r) => r[0]).join(', ')}`);
    const summary = await page.locator('.check-summary').textContent();
    check(summary.includes('9 plots checked: 1 passes, 8 fail.'), `summary "${summary}"`);
    const why = await page.locator('tr[data-check-plot="EUC-12"] .check-why').textContent();
    check(why.includes('Plot EUC-12 lies inside private land "Freehold block"'), `EUC-12 reasons "${why}"`);

    await mapIdle(page);
    const source = await sourceData(page, 'sp-check-plots');
    check(source.features.filter((f) => f.properties.check === 'fail').length === 8, 'the map source does not mark 8 failing plots');
    const drawn = await page.evaluate(() => window.__stratplotMap.queryRenderedFeatures({ layers: ['sp-check-plots'] }).map((f) => f.properties.check));
    check(drawn.includes('fail') && drawn.includes('pass'), `the map draws checked plots as ${[...new Set(drawn)].join(', ')}`);
    check((await page.locator('.legend [data-check-symbol]').count()) === 2, 'the map key does not show the two checked-plot symbols');
    await shot('check-1-loaded-1440');

    // Show zooms to the plot and opens its reasons; a click on the map does the same.
    await page.getByRole('button', { name: 'Show checked plot HEA-07 (feature 0) on the map' }).click();
    await sleep(700);
    await mapIdle(page);
    const popup = page.locator('.check-popup[data-check="fail"]');
    await popup.waitFor({ timeout: 5000 });
    check((await popup.textContent()).includes('lies 6.0 m from cliff edge "Ochre Spit cliff edge", inside its 15 m buffer'), 'the popup does not give the cliff reason');
    await page.locator('.maplibregl-popup-close-button').click();
    const cliff = source.features.find((f) => f.properties.id === 'HEA-07').geometry.coordinates;
    await clickLngLat(page, cliff[0], cliff[1]);
    await popup.waitFor({ timeout: 5000 });
    await shot('check-2-reasons-1440');

    // Instead of the design: its plots are hidden while the check is shown.
    await page.getByLabel('Show the design’s own plots beside them').uncheck();
    const hidden = await page.evaluate(() => window.__stratplotMap.getLayoutProperty('sp-plots', 'visibility'));
    check(hidden === 'none', `the design's plots are still drawn (${hidden})`);
    await page.getByLabel('Show the design’s own plots beside them').check();

    const pdf = await download(page, 'Report (PDF)');
    check(pdf.name.endsWith('-plot-check.pdf') && readFileSync(pdf.path).subarray(0, 5).toString() === '%PDF-', `PDF download ${pdf.name}`);
    let text = null;
    try {
      // Poppler's pdftotext (Debian poppler-utils): an outside reader of the PDF.
      text = execFileSync('pdftotext', [pdf.path, '-'], { encoding: 'utf8', stdio: ['ignore', 'pipe', 'ignore'] }).replace(/\s+/g, ' ');
    } catch {
      text = null;
    }
    if (text !== null) {
      for (const want of ['Plot check', 'ochre-spit-plots-to-check.geojson', 'Caution', 'Checked and approved', '8 fail']) check(text.includes(want), `the PDF report lacks "${want}"`);
    }
    const csv = await download(page, 'Report (CSV)');
    const table = Papa.parse(readFileSync(csv.path, 'utf8'), { header: true, skipEmptyLines: true }).data;
    check(table.length === 9 && table.filter((r) => r.ok === 'FAIL').length === 8, `CSV rows ${table.length}`);
    check(table.every((r) => r.caution?.startsWith('Caution: plot positions and notes are a planning aid') && r.files_checked.includes('ochre-spit-plots-to-check.geojson')), 'a CSV row lacks the caution or the files checked');

    for (const [w, h] of [[1024, 768], [390, 844]]) {
      await page.setViewportSize({ width: w, height: h });
      await sleep(400);
      await page.locator('.plot-check').scrollIntoViewIfNeeded();
      await shot(`check-3-table-${w}`);
    }
  },
};
