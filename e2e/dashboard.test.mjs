// End-to-end test of the dashboard page in headless Chromium (Debian's chromium, driven by playwright-core).
// Usage: LOOPWRIGHT_URL=http://127.0.0.1:18080 node dashboard.test.mjs   (a running service; .ci/run starts it)
// Against a service started with API keys, set LOOPWRIGHT_API_KEY to one of them: the test then first sees the
// plain 401 and 403 messages, then enters the key in the page's key field.
// Writes target/dashboard.png. Exits non-zero on the first failed check.
import { chromium } from 'playwright-core';
import { mkdirSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import assert from 'node:assert/strict';

const base = process.env.LOOPWRIGHT_URL ?? 'http://127.0.0.1:8080';
const apiKey = process.env.LOOPWRIGHT_API_KEY ?? '';
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
  // Every /v1 call after the key is entered carries it as a bearer token; the key is never in a URL or the console.
  const v1Calls = [];
  const leaks = [];
  page.on('request', (request) => {
    if (apiKey && request.url().includes(apiKey)) leaks.push(`url ${request.url()}`);
    if (request.url().startsWith(`${base}/v1/`)) v1Calls.push(request.allHeaders().then((h) => h.authorization ?? ''));
  });
  page.on('console', (message) => { if (apiKey && message.text().includes(apiKey)) leaks.push('console'); });
  const figuresReady = () => page.waitForFunction(
    () => document.getElementById('status').textContent.includes('figures ready'), null, { timeout: 20_000 });

  // 1. A shared link: the form is filled from the URL and the design runs on load.
  const query = 'a0=0&a1=0.48&b=400&d=400&overshootPercent=1.5&timeKind=settlingTime&time=0.15&actuatorLimit=3';
  await page.goto(`${base}/?${query}`);
  let scenarios = 3;
  if (apiKey) {
    // 1a. Keys on and no key entered: the 401 is explained in plain words, the key field has the focus.
    await page.waitForSelector('#status.access', { timeout: 10_000 });
    assert.match(await page.textContent('#status'), /needs an API key \(HTTP 401\).*API key field/);
    assert.equal(await page.evaluate(() => document.activeElement.id), 'api-key');
    assert.equal(await page.$eval('#results', (t) => t.hidden), true);
    // 1b. A wrong key: the 403 says the key was refused and what to check.
    await page.fill('#api-key', 'not-the-configured-key-0000');
    await page.click('#run');
    await page.waitForFunction(() => document.getElementById('status').textContent.includes('HTTP 403'), null,
      { timeout: 10_000 });
    assert.match(await page.textContent('#status'), /API key was refused.*operator/);
    // 1c. The right key: the design runs; the key stays out of the address and lives in session storage.
    await page.fill('#api-key', apiKey);
    v1Calls.length = 0;
    await page.click('#run');
    scenarios += 1;
  }
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
  if (apiKey) {
    assert.equal(await page.evaluate(() => sessionStorage.getItem('loopwright.apiKey')), apiKey);
    assert.ok(!page.url().includes(apiKey), 'the key is kept out of the URL');
    assert.equal(await page.getAttribute('#api-key', 'type'), 'password');
    assert.ok(v1Calls.length >= 4, `design and figure calls: ${v1Calls.length}`);
    assert.ok((await Promise.all(v1Calls)).every((h) => h === `Bearer ${apiKey}`),
      'every /v1 call sends Authorization: Bearer <key>');
    // 1d. A reload of the shared link keeps the key for this tab and designs at once.
    await page.reload();
    await figuresReady();
    assert.equal(await page.inputValue('#api-key'), apiKey);
  } else {
    assert.ok(v1Calls.length >= 4 && (await Promise.all(v1Calls)).every((h) => h === ''),
      'no Authorization header without a key');
  }

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
  assert.deepEqual(leaks, [], 'the key never appears in a URL or on the console');
  console.log(`e2e: dashboard ${scenarios} scenarios passed (API key ${apiKey ? 'entered' : 'not needed'});`
    + ' screenshot target/dashboard.png');
} catch (error) {
  failed = true;
  console.error(error);
} finally {
  await context.close();
  rmSync(profile, { recursive: true, force: true });
}
process.exit(failed ? 1 : 0);
