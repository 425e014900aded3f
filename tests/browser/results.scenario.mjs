import { readFileSync } from 'node:fs';
import { browserCopyWait, check, mapIdle, openPlanner, sourceData } from './helpers.mjs';

const sleep = (ms) => new Promise((r) => setTimeout(r, ms));

/** Invented cover values for the plots of the design on screen (not measurements), one rejection replaced by its first reserve. */
export function inventedResults(plots) {
  const strata = [...new Set(plots.map((p) => p.stratum))];
  const rows = ['plot_id;status;replaced_by;cover_pct;orchid'];
  const values = new Map();
  const primaries = plots.filter((p) => p.role === 'primary');
  const swapped = strata.map((s) => plots.find((p) => p.stratum === s && p.role === 'reserve' && p.rank === 1)).find(Boolean);
  const rejected = swapped ? primaries.find((p) => p.stratum === swapped.stratum) : null;
  const measured = [...primaries.filter((p) => p !== rejected), ...(swapped ? [swapped] : [])];
  measured.forEach((p, k) => {
    const h = strata.indexOf(p.stratum);
    const v = 20 + 8 * h + ((k * 37) % 11) + 0.5;
    values.set(p.plot_id, v);
    rows.push(`${p.plot_id};done;;${String(v).replace('.', ',')};${k % 3 === 0 ? 'yes' : 'no'}`);
  });
  if (rejected) rows.push(`${rejected.plot_id};rejected;${swapped.plot_id};;`);
  return { csv: `\uFEFF${rows.join('\r\n')}\r\n`, values, rejected, swapped };
}

/**
 * The Results step: a design is made, an invented results CSV (semicolons, decimal commas, BOM)
 * for its plots is loaded, and the stratified mean, its return after a reload, the CSV download, the charts, the map
 * colouring, next season's "Use in design" and a recapture grid are checked.
 */
export const RESULTS_SCENARIO = {
  no: 'results',
  name: 'results loaded for the design give the stratified mean, charts, map colours, next season and a recapture estimate',
  async run({ page, origin, shot }) {
    await openPlanner(page, origin);
    await page.getByRole('button', { name: /3\s*Design/ }).click();
    await page.getByRole('button', { name: 'Make the design' }).click();
    await page.waitForSelector('table[aria-label="Allocation of plots to strata"]', { timeout: 60_000 });
    const usableHa = await page.evaluate(() =>
      Object.fromEntries(
        [...document.querySelectorAll('table[aria-label="Allocation of plots to strata"] tbody tr')].map((tr) => {
          const td = tr.querySelectorAll('td');
          return [td[0].textContent, Number(td[2].textContent.replace(/,/g, ''))];
        }),
      ),
    );
    const plots = (await sourceData(page, 'sp-plots')).features.map((f) => f.properties);
    const { csv, values, swapped } = inventedResults(plots);

    await page.getByRole('button', { name: /5\s*Results/ }).click();
    await page.setInputFiles('input[data-import="results"]', { name: 'invented-results.csv', mimeType: 'text/csv', buffer: Buffer.from(csv) });
    await page.waitForSelector('table[aria-label="Estimate of cover_pct by stratum"]', { timeout: 10_000 });
    // Stratified mean by hand (Cochran 1977 ch. 5): Σ W_h ȳ_h with W_h from the usable hectares the allocation table shows.
    const byStratum = new Map();
    for (const p of plots) {
      const v = values.get(p.plot_id);
      if (v === undefined) continue;
      byStratum.set(p.stratum, [...(byStratum.get(p.stratum) ?? []), v]);
    }
    const total = [...byStratum.keys()].reduce((a, s) => a + usableHa[s], 0);
    const expected = [...byStratum].reduce((a, [s, vs]) => a + (usableHa[s] / total) * (vs.reduce((x, y) => x + y, 0) / vs.length), 0);
    const shown = Number((await page.locator('td[data-cell="mean"]').textContent()).replace(/,/g, ''));
    check(Math.abs(shown - expected) < 0.011, `panel shows a stratified mean of ${shown}, by hand ${expected.toFixed(3)}`);
    const clean = await page.locator('.results-clean').count();
    check(clean === 1, `expected no problems for a complete file${swapped ? ` (with ${swapped.plot_id} replacing a rejected plot)` : ''}`);
    check(await page.getByRole('img', { name: 'Mean cover_pct by stratum with 95 % intervals' }).isVisible(), 'means chart has no accessible name');
    check(await page.getByRole('img', { name: 'Share of plots against share of area, by stratum' }).isVisible(), 'share chart has no accessible name');
    await shot('results-estimate');

    // The browser copy keeps the Results step: after a reload the same file, mapping and estimate are back.
    const shownText = await page.locator('td[data-cell="mean"]').textContent();
    // Reload only once the browser copy (IndexedDB) holds the results.
    check(await browserCopyWait(page, ['"results"', 'cover_pct']), 'the results never reached the browser copy');
    await page.reload();
    await page.waitForFunction(() => window.__stratplotMap?.isStyleLoaded() && document.querySelector('table.ledger[data-measured="yes"]'), null, { timeout: 30_000 });
    await page.getByRole('button', { name: /5\s*Results/ }).click();
    await page.waitForSelector('table[aria-label="Estimate of cover_pct by stratum"]', { timeout: 10_000 });
    const again = await page.locator('td[data-cell="mean"]').textContent();
    check(again === shownText, `after a reload the mean shows ${again}, before it showed ${shownText}`);

    const download = page.waitForEvent('download');
    await page.getByRole('button', { name: 'Download estimate (CSV)' }).click();
    const file = await (await download).path();
    const all = readFileSync(file, 'utf8').split('\r\n').find((l) => l.startsWith('all;'));
    const csvMean = Number(all.split(';')[3].replace(',', '.'));
    check(Math.abs(csvMean - expected) < 1e-6 * Math.max(1, expected) + 0.011, `CSV mean ${csvMean} vs ${expected}`);

    await page.getByLabel('Colour the measured plots on the map by cover_pct').check();
    await mapIdle(page);
    const coloured = await sourceData(page, 'sp-results-colour');
    check(coloured.features.length === values.size, `map colours ${coloured.features.length} plots, ${values.size} were measured`);
    const top = [...values].sort((a, b) => b[1] - a[1])[0][0];
    // viridis' brightest stop (viridisLite viridis(10) → "#FDE725") marks the largest value.
    check(coloured.features.find((f) => f.properties.plot_id === top)?.properties.colour === '#fde725', 'the largest value is not the ramp’s top colour');
    await page.getByRole('img', { name: /^Map colours for cover_pct/ }).scrollIntoViewIfNeeded();
    await shot('results-charts');

    const pdfDownload = page.waitForEvent('download', { timeout: 30_000 });
    await page.getByRole('button', { name: 'Design report with estimates (PDF)' }).click();
    const pdf = readFileSync(await (await pdfDownload).path());
    check(pdf.subarray(0, 5).toString('latin1') === '%PDF-', 'the design report is not a PDF');

    const neyman = Number(await page.locator('td[data-allocation="neyman"]').textContent());
    await page.getByRole('button', { name: /neyman allocation, in the design$/ }).click();
    await page.waitForSelector('text=Design settings updated');
    await page.getByRole('button', { name: /3\s*Design/ }).click();
    const plotsField = await page.getByLabel('Total primary plots').inputValue();
    check(Number(plotsField) === neyman, `design asks for ${plotsField} plots after "Use in design", next season's Neyman size is ${neyman}`);
    await page.getByRole('button', { name: /5\s*Results/ }).click();

    await page.getByLabel('Marked M for Grid 1').fill('948');
    await page.getByLabel('Caught n for Grid 1').fill('421');
    await page.getByLabel('Recaptured m for Grid 1').fill('167');
    // Krebs 1989 Box 2.1 (docs/references.md §4): Chapman 2382.80, SE 129.06.
    const chapman = await page.locator('dd[data-fact="chapman"]').textContent();
    check(chapman === '2,383', `Chapman shows ${chapman}, Krebs gives 2382.80`);
    await page.locator('dd[data-fact="chapman"]').scrollIntoViewIfNeeded();
    await sleep(100);
    await shot('results-recapture');

    // One stratum left with a single plot: no SE until strata are collapsed, and the rule is shown.
    const lone = plots.filter((p) => p.role === 'primary' && p.stratum === plots.find((q) => q.role === 'primary' && plots.filter((r) => r.role === 'primary' && r.stratum === q.stratum).length === 2)?.stratum);
    if (lone.length === 2) {
      const shortCsv = csv.split('\r\n').filter((line) => !line.startsWith(`${lone[1].plot_id};`)).join('\r\n');
      await page.setInputFiles('input[data-import="results"]', { name: 'invented-results-short.csv', mimeType: 'text/csv', buffer: Buffer.from(shortCsv) });
      await page.waitForSelector(`tr[data-stratum="${lone[0].stratum}"] .results-flag`);
      check((await page.locator('td[data-cell="se"]').textContent()) === '–', 'an SE is shown although a stratum has one plot');
      const meanBefore = await page.locator('td[data-cell="mean"]').textContent();
      await page.getByLabel('Collapse strata with one plot for the variance (the mean keeps every stratum)').check();
      await page.waitForFunction(() => document.querySelector('td[data-cell="se"]')?.textContent !== '–');
      // Collapsing replaces only the variance (Cochran 1977 §5A.12): the mean stays, the groups are named.
      check((await page.locator('td[data-cell="mean"]').textContent()) === meanBefore, 'collapsing changed the stratified mean');
      const note = (await page.locator('[data-fact="collapsed"]').textContent()) ?? '';
      check(note.includes(lone[0].stratum) && note.includes('conservative'), `the collapsed-strata note reads "${note}"`);
      await page.locator('[data-fact="collapsed"]').scrollIntoViewIfNeeded();
      await shot('results-collapsed');
    }
  },
};
