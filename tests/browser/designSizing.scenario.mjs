import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { check, mapIdle, openPlanner } from './helpers.mjs';

const sleep = (ms) => new Promise((r) => setTimeout(r, ms));
const strataFile = JSON.parse(readFileSync(resolve(import.meta.dirname, '../../demo-maps/ochre-spit-strata.geojson'), 'utf8'));

/** A plan as saved before random generator versions were recorded: the demo strata, no version in the design. */
function oldPlan() {
  const strata = strataFile.features.map((f) => ({ key: f.properties.stratum, label: f.properties.label, code: f.properties.code, colour: f.properties.colour }));
  const parts = strataFile.features.map((f, i) => ({ id: `p${i}`, stratum: f.properties.stratum, geometry: f.geometry }));
  const plan = {
    format: 'stratplot-plan',
    version: 1,
    savedAt: '2026-06-01T00:00:00Z',
    site: { name: 'Ochre Spit, an older plan (invented)', strata, parts, exclusions: [], access: [], boundary: null },
    design: { plots: 30, seed: 11 },
    result: null,
    rejections: [],
  };
  return { name: 'older.stratplot.json', mimeType: 'application/json', buffer: Buffer.from(JSON.stringify(plan)) };
}

/** Design step: an older plan keeps generator version 1 until moved on; a budget sizes the design and the expected half-width is shown. */
export const DESIGN_SIZING_SCENARIO = {
  no: 'design-sizing',
  name: 'an older plan keeps its random generator; a budget sizes the design and its expected precision is shown before the run',
  async run({ page, origin, shot }) {
    await openPlanner(page, origin);
    await page.setInputFiles('input[data-open-plan]', oldPlan());
    await page.waitForSelector('text=Opened “older.stratplot.json”', { timeout: 10_000 });
    await page.getByRole('button', { name: /3\s*Design/ }).click();
    const generator = page.locator('[data-fact="generator"]');
    check(/saved when generator version 1 was current and still uses random generator version 1/.test((await generator.textContent()) ?? ''), `generator note reads "${await generator.textContent()}"`);
    await page.getByRole('button', { name: 'Use version 3 for the next design' }).click();
    await page.waitForFunction(() => /Made with random generator version 3 \(.*grid of cells/.test(document.querySelector('[data-fact="generator"]')?.textContent ?? ''));

    // Size by a budget of 60 at the default cost 1 per plot (no overhead): proportional, 60 plots.
    await page.getByLabel('Size from').selectOption('budget');
    const budget = page.getByLabel('Budget');
    await budget.fill('60');
    await budget.press('Enter');
    const note = page.locator('[data-fact="precision"]');
    await page.waitForFunction(() => /^Expected: 60 plots; costing 60 of the 60/.test(document.querySelector('[data-fact="precision"]')?.textContent ?? ''));
    check(/give every stratum a pilot SD/.test((await note.textContent()) ?? ''), `precision note reads "${await note.textContent()}"`);
    // Pilot SDs for every stratum, a fixed overhead and dearer plots in the wet meadow: Neyman with costs.
    const labels = strataFile.features.map((f) => f.properties.label);
    for (const [i, label] of labels.entries()) {
      const sdInput = page.getByLabel(`Pilot SD of ${label}`);
      await sdInput.fill(String(8 + 2 * i));
      await sdInput.blur();
    }
    const wet = page.getByLabel('Relative cost of Wet meadow');
    await wet.fill('4');
    await wet.blur();
    const overhead = page.getByLabel('Fixed overhead');
    await overhead.fill('12');
    await overhead.press('Enter');
    await page.getByLabel('Allocation').selectOption('neyman');
    await page.waitForFunction(() => /expected 95 % CI half-width ±[\d.]+ from the pilot SDs \(t on [\d.]+ Satterthwaite df/.test(document.querySelector('[data-fact="precision"]')?.textContent ?? ''));
    const text = (await note.textContent()) ?? '';
    const n = Number(text.match(/^Expected: (\d+) plots/)?.[1]);
    const cost = Number(text.match(/costing ([\d.]+) of the 48/)?.[1]);
    check(n > 0 && cost <= 48, `precision note reads "${text}"`);
    await page.locator('[data-box="budget"]').scrollIntoViewIfNeeded();
    for (const [w, h] of [[1440, 900], [1024, 768], [390, 844]]) {
      await page.setViewportSize({ width: w, height: h });
      await sleep(250);
      await note.scrollIntoViewIfNeeded();
      await shot(`design-sizing-${w}`);
    }
    await page.setViewportSize({ width: 1400, height: 900 });

    // The design made from these settings has the n the step announced, and says so in its statements.
    await page.getByRole('button', { name: 'Make the design' }).click();
    await page.waitForSelector('table[aria-label="Allocation of plots to strata"]', { timeout: 60_000 });
    await mapIdle(page);
    const total = await page.evaluate(() => Number([...document.querySelectorAll('table[aria-label="Allocation of plots to strata"] tfoot td.num')][3].textContent));
    check(total === n, `the design has ${total} plots, the step announced ${n}`);
    const statements = (await page.locator('ul.statements').textContent()) ?? '';
    check(statements.includes('Budget: 60 less a fixed overhead of 12 leaves 48 for plots'), 'the budget statement is missing');
    check(statements.includes(`Expected precision at n = ${n} from the pilot SDs`), 'the expected precision statement is missing');
    check(/Seed 11, random generator version 3/.test(statements), 'the seed line does not name generator version 3');
    const seedLine = (await page.locator('.allocation p.fine').first().textContent()) ?? '';
    check(seedLine.includes('Seed 11, random generator version 3'), `the seed line reads "${seedLine}"`);
    await page.locator('ul.statements').scrollIntoViewIfNeeded();
    await shot('design-sizing-result');
  },
};
