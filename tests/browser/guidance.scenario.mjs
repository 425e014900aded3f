import { check, mapIdle, openPlanner, strataRows } from './helpers.mjs';
import { drawBoxWithEnter } from './nothingLost.scenario.mjs';

const sleep = (ms) => new Promise((r) => setTimeout(r, ms));

/** WCAG 2.1 contrast ratio (§1.4.3, relative luminance of sRGB) between two CSS rgb() colours. */
function contrastRatio(fg, bg) {
  const lum = (css) => {
    const [r, g, b] = css.match(/[\d.]+/g).slice(0, 3).map((v) => {
      const c = Number(v) / 255;
      return c <= 0.03928 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4;
    });
    return 0.2126 * r + 0.7152 * g + 0.0722 * b;
  };
  const [a, b] = [lum(fg), lum(bg)].sort((x, y) => y - x);
  return (a + 0.05) / (b + 0.05);
}

/** Screen boxes (relative to the map) of the labels and plots drawn now, one per feature and layer. */
function drawnMarks(page, layers) {
  return page.evaluate((ids) => {
    const map = window.__stratplotMap;
    const seen = new Map();
    for (const f of map.queryRenderedFeatures({ layers: ids.filter((l) => map.getLayer(l)) })) {
      const key = `${f.layer.id}:${f.properties.id ?? f.properties.plot_id}`;
      if (seen.has(key)) continue;
      const c = f.geometry.type === 'Point' ? f.geometry.coordinates : null;
      seen.set(key, { layer: f.layer.id, label: f.properties.label ?? f.properties.name ?? f.properties.plot_id, stratum: f.properties.stratum, at: c ? map.project(c) : null });
    }
    return [...seen.values()];
  }, layers);
}

/**
 * Where a newcomer gets stuck: an armed tool says how to add points, finish and cancel (and its
 * button stays legible); Enter finishes a shape and commits a text box; a drawn stratum is labelled
 * on the map like an imported one; the footprint is chosen as a shape with sizes; counts read as
 * English; the map key covers no label or plot and folds away.
 */
export const GUIDANCE_SCENARIO = {
  no: 'guidance',
  name: 'drawing says how to add, finish and cancel; Enter finishes and commits; drawn strata are labelled; footprint by shape; English counts; the key covers nothing',
  async run({ page, origin, shot }) {
    await openPlanner(page, origin);
    // The key covers no stratum label, access point or label start; access labels (drawn to the right of their point) end inside the map.
    const legend = await page.locator('.legend').boundingBox();
    const holder = await page.locator('.map-holder').boundingBox();
    const marks = await drawnMarks(page, ['sp-strata-label', 'sp-access', 'sp-access-label', 'sp-exclusions-point']);
    check(marks.length >= 8, `only ${marks.length} labels and points are drawn on the opened site`);
    for (const m of marks.filter((x) => x.at)) {
      const x = holder.x + m.at.x;
      const y = holder.y + m.at.y;
      const under = x >= legend.x && x <= legend.x + legend.width && y >= legend.y && y <= legend.y + legend.height;
      check(!under, `the map key covers ${m.layer} "${m.label}"`);
      if (m.layer === 'sp-access-label') check(m.at.x + 10 + 8 * m.label.length <= holder.width - 50, `the label of access point "${m.label}" runs off the map or under its buttons`);
    }
    await page.locator('.legend summary').click();
    const folded = await page.locator('.legend').boundingBox();
    check(folded.height < 40, `the key does not fold (${folded.height} px tall)`);
    await page.locator('.legend summary').click();

    // Armed tool: the hint names the ways to add, finish and cancel; the button stays legible under the pointer.
    await page.getByRole('button', { name: /^Draw stratum/ }).click();
    const hint = await page.locator('.draw-hint').textContent();
    check(/each corner/.test(hint) && /Enter/.test(hint) && /Esc/.test(hint) && /Finish/.test(hint), `the drawing hint says "${hint}"`);
    const armed = page.getByRole('button', { name: /^Draw stratum/ });
    await armed.hover();
    const colours = await armed.evaluate((el) => ({ fg: getComputedStyle(el).color, bg: getComputedStyle(el).backgroundColor }));
    const ratio = contrastRatio(colours.fg, colours.bg);
    check(ratio >= 7, `the armed tool's label has a contrast of ${ratio.toFixed(1)}:1 under the pointer (WCAG AAA asks 7:1)`);
    await shot('guidance-armed');
    await page.getByRole('button', { name: /^Cancel/ }).click();
    check((await page.locator('.draw-hint').count()) === 0, 'Cancel did not disarm the tool');

    // Four clicks and Enter make a stratum; it is labelled on the map like the imported ones.
    await drawBoxWithEnter(page);
    await strataRows(page, 7);
    await page.keyboard.press('Escape');
    await mapIdle(page);
    await sleep(300);
    const labelled = (await drawnMarks(page, ['sp-strata-label'])).filter((m) => m.stratum === 'Stratum 7');
    check(labelled.length > 0, 'the drawn stratum has no label on the map');
    await shot('guidance-drawn-label');

    // Enter in a name box commits it (no need to leave the box).
    const name = page.locator('input[aria-label="Name of stratum Stratum 7"]');
    await name.fill('Drawn heath (invented)');
    await name.press('Enter');
    await page.waitForFunction(() => document.querySelector('.legend')?.textContent?.includes('Drawn heath (invented)'), null, { timeout: 5000 });

    // English counts: a file of one polygon.
    const one = { type: 'FeatureCollection', features: [{ type: 'Feature', properties: { habitat: 'Lone patch (invented)' }, geometry: { type: 'Polygon', coordinates: [[[119.1235, -34.44], [119.1245, -34.44], [119.1245, -34.4392], [119.1235, -34.44]]] } }] };
    await page.setInputFiles('input[data-import="strata"]', { name: 'one-patch.geojson', mimeType: 'application/geo+json', buffer: Buffer.from(JSON.stringify(one)) });
    const pick = await page.locator('form.field-pick p').textContent();
    check(pick.startsWith('one-patch.geojson: 1 polygon.'), `the import says "${pick}"`);
    await page.getByRole('button', { name: 'Add strata', exact: true }).click();
    await strataRows(page, 8);
    const added = await page.locator('.notice').textContent();
    check(added.includes('one-patch.geojson: 1 feature in 1 stratum added'), `the import notice says "${added}"`);

    // The footprint as a shape with sizes; the command line's form is shown beneath.
    await page.getByRole('button', { name: /3\s*Design/ }).click();
    const cli = () => page.locator('.footprint code').textContent();
    check((await cli()) === '--footprint square:20', `the demo footprint reads "${await cli()}"`);
    await page.getByLabel('Plot footprint').selectOption({ label: 'a circle' });
    // Same area as the 20 m square by hand: r = √(400/π) = 11.28 m.
    check((await page.getByLabel('Radius').inputValue()) === '11.28', 'a square of 400 m² did not become a circle of radius 11.28 m');
    await page.getByLabel('Radius').fill('5.64');
    await page.getByLabel('Radius').press('Enter');
    await page.waitForFunction(() => document.querySelector('.footprint code')?.textContent === '--footprint circle:5.64', null, { timeout: 5000 });
    await page.getByLabel('Plot footprint').selectOption({ label: 'a rectangle' });
    await page.getByLabel('Width (east–west)').fill('20');
    await page.getByLabel('Width (east–west)').press('Enter');
    await page.getByLabel('Length (north–south)').fill('10');
    await page.getByLabel('Length (north–south)').press('Enter');
    await page.getByLabel('Rotation', { exact: true }).fill('30');
    await page.getByLabel('Rotation', { exact: true }).press('Enter');
    await page.waitForFunction(() => document.querySelector('.footprint code')?.textContent === '--footprint rect:20x10@30', null, { timeout: 5000 });
    await shot('guidance-footprint');
    await page.keyboard.press('Control+z');
    const undone = await page.locator('.notice').textContent();
    check(undone.startsWith('Undone in step 3, Design: plot footprint rect:20x10 → rect:20x10@30'), `undo of the angle says "${undone}"`);
  },
};
