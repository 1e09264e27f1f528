// End-to-end test of the dashboard page in headless Chromium (Debian's chromium, driven by playwright-core).
// Usage: LOOPWRIGHT_URL=http://127.0.0.1:18080 node dashboard.test.mjs   (a running service; .ci/run starts it)
// Writes target/dashboard.png. Exits non-zero on the first failed check.
import { chromium } from 'playwright-core';
import { mkdirSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import assert from 'node:assert/strict';

const base = process.env.LOOPWRIGHT_URL ?? 'http://127.0.0.1:8080';
const executablePath = process.env.CHROMIUM ?? '/usr/bin/chromium';
const profile = mkdtempSync(join(tmpdir(), 'loopwright-e2e-'));
mkdirSync('target', { recursive: true });

const context = await chromium.launchPersistentContext(profile, {
  executablePath,
  headless: true,
  viewport: { width: 1280, height: 1500 },
  args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run',
    '--disable-background-networking', '--disable-component-update', '--disable-sync'],
});
let failed = false;
try {
  const page = context.pages()[0] ?? await context.newPage();
  const foreign = [];
  page.on('request', (request) => {
    if (!request.url().startsWith(base) && !request.url().startsWith('blob:') && !request.url().startsWith('data:')) {
      foreign.push(request.url());
    }
  });
  const errors = [];
  page.on('pageerror', (error) => errors.push(String(error)));

  // 1. A shared link: the form is filled from the URL and the design runs on load.
  const query = 'a0=0&a1=0.48&b=400&d=400&overshootPercent=1.5&timeKind=settlingTime&time=0.15&commandLimit=3';
  await page.goto(`${base}/?${query}`);
  await page.waitForFunction(() => document.getElementById('status').textContent.includes('figures ready'),
    null, { timeout: 20_000 });
  const cells = await page.$$eval('#results tbody tr', (rows) => rows.map((r) => [...r.cells].map((c) => c.textContent)));
  const byName = Object.fromEntries(cells.map(([name, value]) => [name, Number(value)]));
  // The README's indexing-axis gains (README "Example" section).
  assert.ok(Math.abs(byName['position gain k1'] - 1.57230) < 1e-4, `k1 ${byName['position gain k1']}`);
  assert.ok(Math.abs(byName['velocity gain k2'] - 0.0992069) < 1e-6, `k2 ${byName['velocity gain k2']}`);
  assert.ok(Math.abs(byName['simulated settling time'] - 0.15) < 1e-5);
  for (const id of ['fig-step-response', 'fig-control-effort', 'fig-bode']) {
    const width = await page.$eval('#' + id, (img) => (img.complete && !img.hidden ? img.naturalWidth : 0));
    assert.equal(width, 720, `${id} rendered`);
  }
  assert.match(await page.textContent('#cautions'), /commissioning/);
  await page.screenshot({ path: 'target/dashboard.png', fullPage: true });

  // 2. Editing and submitting updates the shareable URL.
  await page.fill('input[name=overshootPercent]', '1');
  await page.click('#run');
  await page.waitForFunction(() => window.location.search.includes('overshootPercent=1&'), null, { timeout: 10_000 });
  await page.waitForFunction(() => document.getElementById('status').textContent.includes('figures ready'),
    null, { timeout: 20_000 });

  // 3. An infeasible spec shows the problem in engineering words, not a broken page.
  await page.fill('input[name=overshootPercent]', '30');
  await page.click('#run');
  await page.waitForSelector('#status.problem', { timeout: 10_000 });
  assert.match(await page.textContent('#status'), /Infeasible spec/);
  assert.equal(await page.$eval('#results', (t) => t.hidden), true);

  assert.deepEqual(foreign, [], 'no requests outside the service');
  assert.deepEqual(errors, [], 'no script errors');
  console.log('e2e: dashboard 3 scenarios passed; screenshot target/dashboard.png');
} catch (error) {
  failed = true;
  console.error(error);
} finally {
  await context.close();
  rmSync(profile, { recursive: true, force: true });
}
process.exit(failed ? 1 : 0);
