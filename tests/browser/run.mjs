// Browser tests of the built planner: serves dist/ with `vite preview` in this process, drives
// Debian's Chromium through playwright-core, saves screenshots to test-artifacts/browser/, prints
// one line per scenario and a closing count, and exits non-zero on any failure.
import { mkdirSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { chromium } from 'playwright-core';
import { SCENARIOS } from './scenarios.mjs';

const root = join(dirname(fileURLToPath(import.meta.url)), '..', '..');
const shots = join(root, 'test-artifacts', 'browser');
mkdirSync(shots, { recursive: true });

// BROWSER_PORT lets several checkouts run their browser tests side by side.
const PORT = Number(process.env.BROWSER_PORT ?? 4173);
const ORIGIN = `http://127.0.0.1:${PORT}`;
const { preview } = await import('vite');
const server = await preview({ root, preview: { host: '127.0.0.1', port: PORT, strictPort: true }, logLevel: 'warn' });
let browser;
let passed = 0;
let failed = 0;
try {
  browser = await chromium.launch({
    executablePath: '/usr/bin/chromium',
    args: ['--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
  });
  const only = process.env.BROWSER_ONLY ? new Set(process.env.BROWSER_ONLY.split(',')) : null;
  for (const scenario of SCENARIOS) {
    if (only && !only.has(String(scenario.no))) continue;
    const started = Date.now();
    const context = await browser.newContext({ viewport: { width: 1400, height: 900 }, serviceWorkers: scenario.serviceWorkers ? 'allow' : 'block', acceptDownloads: true });
    const watch = { consoleErrors: [], offsite: [], dialogs: [] };
    await context.route('**/*', (route) => {
      const url = route.request().url();
      if (url.startsWith(ORIGIN)) return route.continue();
      watch.offsite.push(url);
      return route.abort();
    });
    const page = await context.newPage();
    page.on('console', (m) => {
      if (m.type() === 'error') watch.consoleErrors.push(m.text());
    });
    page.on('pageerror', (e) => watch.consoleErrors.push(`page error: ${e.message}`));
    page.on('dialog', (d) => {
      watch.dialogs.push(d.message());
      void d.dismiss();
    });
    try {
      await scenario.run({ page, context, watch, origin: ORIGIN, shot: (name) => page.screenshot({ path: join(shots, `${name}.png`) }), shotAt: (name, other) => other.screenshot({ path: join(shots, `${name}.png`) }) });
      if (watch.offsite.length) throw new Error(`requests left 127.0.0.1: ${watch.offsite.slice(0, 3).join(', ')}`);
      if (watch.consoleErrors.length) throw new Error(`console errors: ${watch.consoleErrors.slice(0, 3).join(' | ')}`);
      if (watch.dialogs.length) throw new Error(`unexpected dialog: ${watch.dialogs[0]}`);
      passed++;
      console.log(`ok   ${scenario.no} ${scenario.name} (${((Date.now() - started) / 1000).toFixed(1)} s)`);
    } catch (e) {
      failed++;
      console.log(`FAIL ${scenario.no} ${scenario.name}: ${e instanceof Error ? e.message : String(e)}`);
      await page.screenshot({ path: join(shots, `failed-${scenario.no}.png`) }).catch(() => undefined);
    } finally {
      await context.close();
    }
  }
} catch (e) {
  failed++;
  console.log(`FAIL setup: ${e instanceof Error ? e.message : String(e)}`);
} finally {
  await browser?.close();
  await server.close();
}
console.log(`Browser: ${passed} passed, ${failed} failed`);
process.exit(failed === 0 ? 0 : 1);
