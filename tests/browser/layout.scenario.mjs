import { check, mapIdle, openPlanner, sourceData } from './helpers.mjs';
import { inventedResults } from './results.scenario.mjs';

/** Screen sizes a planner is used on: a desktop monitor, a tablet held landscape and a phone held upright. */
const DEVICES = [
  { id: 'desktop', width: 1440, height: 900, options: { deviceScaleFactor: 1 } },
  { id: 'tablet', width: 1024, height: 768, options: { deviceScaleFactor: 2, isMobile: true, hasTouch: true } },
  { id: 'phone', width: 390, height: 844, options: { deviceScaleFactor: 2, isMobile: true, hasTouch: true } },
];

const STEPS = [
  ['strata', /1\s*Map strata/],
  ['exclusions', /2\s*Mark exclusions/],
  ['design', /3\s*Design/],
  ['plots', /4\s*Plots/],
  ['results', /5\s*Results/],
];

/**
 * Measures the page against the device width: elements that stick out past it (outside any box
 * that scrolls or clips its own content), the document's scroll size, and every visible control
 * of the masthead and the current step, each brought into view the way a finger would (the panel
 * scrolls; only a table box may scroll sideways) and hit-tested at its centre.
 */
function layoutProblems(deviceWidth) {
  const problems = [];
  const W = deviceWidth;
  const H = window.innerHeight;
  const name = (el) => `${el.tagName.toLowerCase()}${el.className && typeof el.className === 'string' ? `.${el.className.split(' ')[0]}` : ''} "${(el.getAttribute('aria-label') || el.textContent || '').trim().slice(0, 40)}"`;
  if (window.innerWidth !== W) problems.push(`the layout viewport is ${window.innerWidth} px wide on a ${W} px screen (the page is too wide)`);
  if (document.documentElement.scrollWidth > W) problems.push(`the document is ${document.documentElement.scrollWidth} px wide on a ${W} px screen`);
  const walk = (el, clipped) => {
    const style = getComputedStyle(el);
    if (style.display === 'none') return;
    if (!clipped && style.position !== 'fixed') {
      const r = el.getBoundingClientRect();
      if (r.width > 0 && r.height > 0 && (r.right > W + 0.5 || r.left < -0.5) && style.visibility !== 'hidden') problems.push(`${name(el)} spans ${Math.round(r.left)}–${Math.round(r.right)} px`);
    }
    const clips = clipped || ['auto', 'scroll', 'hidden', 'clip'].includes(style.overflowX) || el.classList.contains('map-holder');
    for (const child of el.children) walk(child, clips);
  };
  walk(document.body, false);
  const controls = [...document.querySelectorAll('.masthead button, .masthead select, .masthead .file-label, .sheet-pane button, .sheet-pane input, .sheet-pane select, .sheet-pane .file-label, .sheet-pane summary')].filter(
    (el) => el.checkVisibility({ visibilityProperty: true }) && !el.classList.contains('file-input') && el.getBoundingClientRect().width > 1,
  );
  for (const el of controls) {
    const box = el.closest('.table-wrap');
    if (box) box.scrollLeft = 0;
    // Row actions (Zoom, Reject…, Restore) must be at hand without scrolling the table sideways.
    const action = !!el.closest('td.actions');
    // Inside a table box a finger scrolls until the control is clear of the columns that stay in view.
    el.scrollIntoView({ block: 'nearest', inline: box ? 'center' : 'nearest' });
    if (box && action) box.scrollLeft = 0;
    if (window.scrollX !== 0) problems.push(`bringing ${name(el)} into view scrolled the page sideways`);
    const r = el.getBoundingClientRect();
    const limit = box ? box.getBoundingClientRect() : { left: 0, right: W };
    if (r.left < Math.max(0, limit.left) - 0.5 || r.right > Math.min(W, limit.right) + 0.5 || r.top < -0.5 || r.bottom > H + 0.5) {
      problems.push(`${name(el)} is at ${Math.round(r.left)},${Math.round(r.top)}–${Math.round(r.right)},${Math.round(r.bottom)}, outside the ${W}×${H} screen${box ? ' or its table box' : ''}`);
      continue;
    }
    const hit = document.elementFromPoint(r.left + r.width / 2, r.top + r.height / 2);
    const label = el.id ? document.querySelector(`label[for="${el.id}"]`) : null;
    if (hit && hit !== el && !el.contains(hit) && !hit.contains(el) && hit !== label) problems.push(`${name(el)} is covered by ${name(hit)}`);
  }
  return { problems, controls: controls.length };
}

async function stepCheck(page, device, step, check) {
  const { problems, controls } = await page.evaluate(layoutProblems, device.width);
  check(controls > 3, `${device.id}/${step}: only ${controls} controls found`);
  check(problems.length === 0, `${device.id}/${step}: ${problems.length} layout problems: ${problems.slice(0, 6).join('; ')}`);
  const page_ = await page.evaluate(() => ({ scrollH: document.documentElement.scrollHeight, innerH: window.innerHeight, y: window.scrollY }));
  if (device.id !== 'phone') check(page_.scrollH <= page_.innerH, `${device.id}/${step}: the page is ${page_.scrollH} px tall in a ${page_.innerH} px window (only the panel may scroll)`);
  // Back at the top before the picture, as a person arriving on the step sees it.
  await page.evaluate(() => {
    window.scrollTo(0, 0);
    const pane = document.querySelector('.sheet-pane');
    if (pane) pane.scrollTop = 0;
    for (const b of document.querySelectorAll('.table-wrap')) b.scrollLeft = 0;
  });
}

async function deviceRun(browser, origin, watchRoutes, device, shot, check) {
  const context = await browser.newContext({ viewport: { width: device.width, height: device.height }, serviceWorkers: 'block', ...device.options });
  const errors = [];
  await watchRoutes(context);
  const page = await context.newPage();
  page.on('console', (m) => m.type() === 'error' && errors.push(m.text()));
  page.on('pageerror', (e) => errors.push(`page error: ${e.message}`));
  try {
    await openPlanner(page, origin);
    const gotIt = page.getByRole('button', { name: 'Got it' });
    if (await gotIt.count()) await gotIt.click();
    const go = async (label) => {
      await page.getByRole('button', { name: label }).click();
      await page.waitForTimeout(120);
    };
    // Results need a design: make one, load invented results for it, then walk the steps in order.
    await go(STEPS[2][1]);
    await page.getByRole('button', { name: 'Make the design' }).click();
    await page.waitForSelector('table[aria-label="Allocation of plots to strata"]', { timeout: 60_000 });
    const plots = (await sourceData(page, 'sp-plots')).features.map((f) => f.properties);
    await go(STEPS[4][1]);
    await page.setInputFiles('input[data-import="results"]', { name: 'invented-results.csv', mimeType: 'text/csv', buffer: Buffer.from(inventedResults(plots).csv) });
    await page.waitForSelector('table[aria-label="Estimate of cover_pct by stratum"]', { timeout: 10_000 });
    const map = await page.locator('.map-holder').boundingBox();
    if (device.id === 'tablet') check((map.width * map.height) / (device.width * device.height) >= 0.5, `tablet: the map has ${Math.round((100 * map.width * map.height) / (device.width * device.height))} % of the screen, less than half`);
    check(map.width > 0.9 * device.width || device.id !== 'phone', 'phone: the map does not span the screen');
    for (const [step, label] of STEPS) {
      // Leave the panel scrolled down: the next step must still start at its top.
      await page.evaluate(() => {
        const pane = document.querySelector('.sheet-pane');
        if (pane) pane.scrollTop = pane.scrollHeight;
      });
      await go(label);
      const top = await page.evaluate(() => {
        const pane = document.querySelector('.sheet-pane');
        return { scroll: pane.scrollTop, heading: pane.querySelector('h2')?.getBoundingClientRect().top ?? -1, pane: pane.getBoundingClientRect().top };
      });
      check(top.scroll === 0 && top.heading >= top.pane && top.heading < device.height, `${device.id}/${step}: the panel does not start at the top of the step (scrolled ${top.scroll} px, heading at ${Math.round(top.heading)} px)`);
      if (step === 'plots') {
        const first = plots.find((p) => p.role === 'primary');
        await page.getByRole('button', { name: `Reject plot ${first.plot_id}`, exact: true }).click();
        await page.getByRole('button', { name: 'Reject and promote reserve' }).click();
        await page.waitForSelector(`tr[data-plot="${first.plot_id}"][data-status="rejected"]`);
        const second = plots.filter((p) => p.role === 'primary')[1];
        await page.getByRole('button', { name: `Reject plot ${second.plot_id}`, exact: true }).click();
        await page.waitForSelector('form.reject-form');
      }
      if (step === 'results') {
        // A wheel over the panel scrolls the panel, never the whole planner off the screen.
        const pane = await page.locator('.sheet-pane').boundingBox();
        await page.mouse.move(pane.x + pane.width / 2, pane.y + Math.min(pane.height / 2, 200));
        for (let i = 0; i < 8; i++) await page.mouse.wheel(0, 1200);
        await page.waitForTimeout(200);
        const y = await page.evaluate(() => ({ page: window.scrollY, h: document.documentElement.scrollHeight }));
        if (device.id !== 'phone') check(y.page === 0, `${device.id}/results: wheeling over the panel scrolled the page by ${y.page} px`);
        const masthead = await page.locator('.masthead').boundingBox();
        check(masthead.y + masthead.height > 0 || device.id === 'phone', `${device.id}/results: the masthead left the screen`);
      }
      if (step === 'strata' && device.id === 'phone') {
        // The plan's file actions fold into a menu: open it, every action is on screen and free to touch.
        await page.getByRole('button', { name: /^Plan/ }).click();
        const items = await page.evaluate((W) => {
          const out = [];
          for (const el of document.querySelectorAll('.file-actions button, .file-actions .file-label')) {
            const r = el.getBoundingClientRect();
            const hit = document.elementFromPoint(r.left + r.width / 2, r.top + r.height / 2);
            out.push({ text: el.textContent.trim(), inside: r.left >= 0 && r.right <= W && r.top >= 0 && r.bottom <= window.innerHeight && r.height >= 36, free: hit === el || el.contains(hit) });
          }
          return out;
        }, device.width);
        check(items.length === 4 && items.every((i) => i.inside && i.free), `phone: the plan menu's actions are not all on screen and free to touch: ${JSON.stringify(items)}`);
        await shot('layout-phone-plan-menu', page);
        await page.keyboard.press('Escape');
      }
      await stepCheck(page, device, step, check);
      await mapIdle(page);
      await shot(`layout-${device.id}-${step}`, page);
    }
    check(errors.length === 0, `${device.id}: console errors: ${errors.slice(0, 3).join(' | ')}`);
  } catch (e) {
    await shot(`failed-layout-${device.id}`, page).catch(() => undefined);
    throw e;
  } finally {
    await context.close();
  }
}

/**
 * Every step at 1440×900, 1024×768 and 390×844 (the last two as touch devices whose browser widens
 * its layout viewport for a page that is too wide): nothing sticks out sideways, every control is
 * reachable, the page itself does not scroll on desktop and tablet, and each step starts at the top.
 */
export const LAYOUT_SCENARIO = {
  no: 'layout',
  name: 'every step fits a desktop, a tablet and a phone: no sideways scrolling, every control reachable, the panel starts at the top',
  async run({ context, origin, shotAt }) {
    const browser = context.browser();
    const offsite = [];
    const watchRoutes = (ctx) =>
      ctx.route('**/*', (route) => {
        if (route.request().url().startsWith(origin)) return route.continue();
        offsite.push(route.request().url());
        return route.abort();
      });
    // Every finding of every size and step is reported together.
    const found = [];
    const note = (ok, message) => ok || found.push(message);
    for (const device of DEVICES) await deviceRun(browser, origin, watchRoutes, device, shotAt, note);
    check(found.length === 0, `${found.length} findings:\n  ${found.join('\n  ')}`);
    check(offsite.length === 0, `requests left 127.0.0.1: ${offsite.slice(0, 3).join(', ')}`);
  },
};
