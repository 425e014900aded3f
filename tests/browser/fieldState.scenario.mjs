import { readFileSync } from 'node:fs';
import Papa from 'papaparse';
import { check, clickLngLat, drawSquare, mapIdle, openPlanner, sourceData, strataRows } from './helpers.mjs';

const sleep = (ms) => new Promise((r) => setTimeout(r, ms));

/** Downloads the plots in one of the Plots step's export formats and returns the file's text. */
async function exportText(page, format) {
  await page.getByLabel('Export as').selectOption(format);
  const download = page.waitForEvent('download', { timeout: 30_000 });
  await page.locator('.export-box').getByRole('button', { name: 'Export' }).click();
  return readFileSync(await (await download).path(), 'utf8');
}

async function renderedState(page, id) {
  return page.evaluate((pid) => window.__stratplotMap.queryRenderedFeatures({ layers: ['sp-plots'] }).find((f) => f.properties.plot_id === pid)?.properties.state, id);
}

/**
 * A drawn stratum renamed "Farm paddock" with the code FAR: its plots take the code and every
 * file says its name. One of its plots is rejected on the Plots step: the row, the open popup, the
 * map symbol and the exported CSV and GPX all say so, and the first reserve stands in; Restore
 * puts everything back.
 */
export const FIELD_STATE_SCENARIO = {
  no: 'field',
  name: 'a renamed stratum follows into plots and files; a rejected plot is struck out in the row, popup, map and exports, and Restore puts it back',
  async run({ page, origin, shot }) {
    await page.setViewportSize({ width: 1440, height: 900 });
    await openPlanner(page, origin);
    // Drawn beside its neighbours, so it shares edges with them instead of overlapping.
    await drawSquare(page, /^Draw beside neighbours/);
    await strataRows(page, 7);
    await page.keyboard.press('Escape');
    const problems = await page.evaluate(() => document.querySelector('.problems')?.textContent ?? '');
    check(!/overlap/i.test(problems), `the drawn stratum overlaps its neighbours: ${problems}`);
    await page.locator('input[aria-label="Name of stratum Stratum 7"]').fill('Farm paddock');
    await page.keyboard.press('Tab');
    const code = page.locator('input[aria-label="Code of Farm paddock"]');
    await code.waitFor({ timeout: 5000 });
    await code.fill('FAR');
    await page.keyboard.press('Tab');
    await page.waitForFunction(() => document.querySelector('.legend')?.textContent?.includes('FAR Farm paddock'), null, { timeout: 5000 });

    await page.getByRole('button', { name: /3\s*Design/ }).click();
    await page.getByRole('button', { name: 'Make the design' }).click();
    await page.waitForSelector('table[aria-label="Allocation of plots to strata"]', { timeout: 60_000 });
    const allocated = await page.locator('table[aria-label="Allocation of plots to strata"] tbody').textContent();
    check(allocated.includes('Farm paddock') && !allocated.includes('Stratum 7'), `the allocation table names the stratum "${allocated}"`);
    await mapIdle(page);
    const plots = (await sourceData(page, 'sp-plots')).features;
    const farm = plots.filter((f) => f.properties.plot_id.startsWith('FAR-'));
    const victim = farm.filter((f) => f.properties.role === 'primary').sort((a, b) => a.properties.rank - b.properties.rank)[0];
    check(victim && farm.some((f) => f.properties.plot_id === 'FAR-R1'), `the renamed stratum's plots do not use its code: ${farm.map((f) => f.properties.plot_id).join(', ')}`);
    const id = victim.properties.plot_id;

    await page.getByRole('button', { name: /4\s*Plots/ }).click();
    await page.getByRole('button', { name: `Zoom to plot ${id}`, exact: true }).click();
    await sleep(700);
    await mapIdle(page);
    // The popup is opened before the rejection and must follow it.
    await clickLngLat(page, victim.geometry.coordinates[0], victim.geometry.coordinates[1]);
    await page.waitForSelector('.plot-popup[data-state="primary"]', { timeout: 5000 });
    await page.getByRole('button', { name: `Reject plot ${id}`, exact: true }).click();
    await page.getByRole('button', { name: 'Reject and promote reserve' }).click();
    await page.waitForSelector(`tr[data-plot="${id}"][data-state="rejected"]`, { timeout: 5000 });
    await page.waitForSelector('tr[data-plot="FAR-R1"][data-state="promoted"]', { timeout: 5000 });
    const status = await page.locator(`tr[data-plot="${id}"] td.plot-status`).textContent();
    check(status === 'rejected: Unsafe to reach', `the rejected row says "${status}"`);
    const popup = await page.locator('.plot-popup').textContent();
    check(popup.includes(`${id} (rejected)`) && popup.includes('Unsafe to reach') && popup.includes('replaced by FAR-R1'), `the open popup did not follow the rejection: "${popup}"`);
    await mapIdle(page);
    check((await renderedState(page, id)) === 'rejected', `the map draws ${id} as ${await renderedState(page, id)}`);
    check((await renderedState(page, 'FAR-R1')) === 'promoted', 'the map does not draw FAR-R1 as promoted');
    const key = await page.locator('.legend [data-symbol]').count();
    check(key === 4, `the map key shows ${key} plot symbols, not 4`);
    await shot('field-1-rejected-1440');

    const csv = await exportText(page, 'csv');
    check(!csv.includes('Stratum 7'), 'the CSV still names the stratum "Stratum 7"');
    const rows = Papa.parse(csv, { header: true, skipEmptyLines: true }).data;
    const row = rows.find((r) => r.plot_id === id);
    check(row?.stratum === 'Farm paddock' && row?.stratum_code === 'FAR', `the CSV names the stratum ${row?.stratum} (${row?.stratum_code})`);
    check(row?.field_state === 'rejected' && row?.reject_reason === 'Unsafe to reach', `the CSV row of ${id} says ${row?.field_state} (${row?.reject_reason})`);
    check(rows.find((r) => r.plot_id === 'FAR-R1')?.field_state === 'promoted', 'the CSV does not show FAR-R1 as promoted');
    check(rows.every((r) => r.caution?.startsWith('Caution: plot positions and notes are a planning aid')), 'a CSV row lacks the caution');
    const gpx = await exportText(page, 'gpx');
    check(!gpx.includes(`<name>${id}</name>`), 'the GPX still leads to the rejected plot');
    check(gpx.includes(`${id} rejected`) && gpx.includes('Unsafe to reach'), 'the GPX does not list the rejected plot and its reason');
    check(gpx.includes('<name>FAR-R1</name>') && gpx.includes('<type>promoted</type>'), 'the GPX does not show FAR-R1 as promoted');

    for (const [w, h] of [[1024, 768], [390, 844]]) {
      await page.setViewportSize({ width: w, height: h });
      await sleep(400);
      await shot(`field-2-rejected-${w}`);
    }
    await page.setViewportSize({ width: 1440, height: 900 });
    await page.getByRole('button', { name: `Restore plot ${id}`, exact: true }).click();
    await page.waitForSelector(`tr[data-plot="${id}"][data-state="primary"]`, { timeout: 5000 });
    await page.waitForSelector('tr[data-plot="FAR-R1"][data-state="reserve"]', { timeout: 5000 });
    const back = await page.locator('.plot-popup').textContent().catch(() => '');
    check(back === '' || back.includes('Primary plot'), `after Restore the popup says "${back}"`);
    const csvBack = Papa.parse(await exportText(page, 'csv'), { header: true, skipEmptyLines: true }).data;
    check(csvBack.find((r) => r.plot_id === id)?.field_state === 'primary' && csvBack.find((r) => r.plot_id === 'FAR-R1')?.field_state === 'reserve', 'after Restore the CSV does not show the plot and its reserve as before');
    await mapIdle(page);
    await shot('field-3-restored');
  },
};
