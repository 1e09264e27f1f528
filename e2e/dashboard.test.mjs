// End-to-end test of the workbench page in headless Chromium (Debian's chromium, driven by playwright-core).
// Usage: LOOPWRIGHT_URL=http://127.0.0.1:18080 node dashboard.test.mjs   (a running service; .ci/run starts it)
// Against a service started with API keys, set LOOPWRIGHT_API_KEY to one of them: the test then first sees the
// plain 401 and 403 messages, then enters the key in the page's key field.
// Writes target/dashboard-1400.png and target/dashboard-390.png. Exits non-zero on the first failed check.
import { chromium } from 'playwright-core';
import { mkdirSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import assert from 'node:assert/strict';

const base = process.env.LOOPWRIGHT_URL ?? 'http://127.0.0.1:8080';
const apiKey = process.env.LOOPWRIGHT_API_KEY ?? '';
const executablePath = process.env.CHROMIUM ?? '/usr/bin/chromium';
const profile = mkdtempSync(join(tmpdir(), 'loopwright-e2e-'));
mkdirSync('target', { recursive: true });
const TIMEOUT_MS = 20_000;

const context = await chromium.launchPersistentContext(profile, {
  executablePath,
  headless: true,
  acceptDownloads: true,
  viewport: { width: 1400, height: 1500 },
  args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run',
    '--disable-background-networking', '--disable-component-update', '--disable-sync'],
});
let failed = false;
const passed = [];
try {
  const page = context.pages()[0] ?? await context.newPage();
  page.setDefaultTimeout(TIMEOUT_MS);
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

  /** Waits until the run started by the last action has finished (the status leaves 'busy'). */
  const settle = () => page.waitForFunction(
    () => ['done', 'error'].includes(document.getElementById('status').dataset.state));
  const design = async () => { await page.click('#run'); await settle(); };
  const statusText = () => page.textContent('#status');
  /** The results table as name -> value text. */
  const results = async () => Object.fromEntries((await page.$$eval('#results tbody tr',
    (rows) => rows.map((r) => [...r.cells].map((c) => c.textContent)))).map(([n, v, u]) => [n, { v, u }]));
  const num = (cell) => Number(cell.v);
  const near = (actual, expected, relative, what) => assert.ok(Math.abs(actual - expected) <= relative * Math.abs(expected),
    `${what}: ${actual}, expected ${expected}`);
  /** Every image on the page has loaded (no broken placeholder). */
  const brokenImages = () => page.$$eval('img', (imgs) => imgs.filter((i) => !i.complete || i.naturalWidth === 0)
    .map((i) => i.id || i.alt));
  /** Elements whose box sticks out of the viewport on the right or is wider than it. */
  const overflowing = () => page.evaluate(() => {
    const width = document.documentElement.clientWidth;
    const out = [];
    for (const el of document.body.querySelectorAll('*')) {
      const r = el.getBoundingClientRect();
      if (r.width === 0 && r.height === 0) continue;
      if (r.right > width + 0.5 || r.width > width + 0.5) out.push(`${el.tagName}#${el.id}.${el.className} ${r.right}`);
    }
    if (document.documentElement.scrollWidth > width) out.push(`page scrollWidth ${document.documentElement.scrollWidth}`);
    return out;
  });
  const download = async (selector) => {
    const [file] = await Promise.all([page.waitForEvent('download'), page.click(selector)]);
    return { name: file.suggestedFilename(), text: readFileSync(await file.path(), 'utf8') };
  };

  // 0. The empty page: no image at all before the first design, a polite live status, nothing wider than 390 px.
  await page.setViewportSize({ width: 390, height: 900 });
  await page.goto(`${base}/`);
  assert.equal(await page.$$eval('img', (imgs) => imgs.length), 0, 'no image before the first design');
  assert.equal(await page.getAttribute('#status', 'aria-live'), 'polite');
  assert.deepEqual(await overflowing(), [], 'empty page at 390 px');
  // Keyboard: the first Tab shows the skip link, the second lands on the plant description with a visible focus ring.
  await page.keyboard.press('Tab');
  assert.equal(await page.evaluate(() => document.activeElement.className), 'skip');
  assert.ok(await page.$eval('.skip', (a) => a.getBoundingClientRect().top >= 0), 'the skip link shows on focus');
  await page.keyboard.press('Tab');
  assert.equal(await page.evaluate(() => document.activeElement.id), 'plant-form');
  assert.notEqual(await page.evaluate(() => getComputedStyle(document.activeElement).outlineStyle), 'none',
    'visible focus');
  await page.setViewportSize({ width: 1400, height: 1500 });
  passed.push('empty page');

  // 1. A shared link: the form is filled from the URL and the design runs on load.
  const query = 'form=canonical&a0=0&a1=0.48&b=400&d=400&overshootPercent=1.5&timeKind=settlingTime&time=0.15'
    + '&actuatorLimit=3&timeSeriesPoints=200';
  await page.goto(`${base}/?${query}`);
  if (apiKey) {
    // 1a. Keys on and no key entered: the 401 is explained in plain words, the key field has the focus.
    await page.waitForSelector('#status.access');
    assert.match(await statusText(), /needs an API key \(HTTP 401\).*API key field/);
    assert.equal(await page.evaluate(() => document.activeElement.id), 'api-key');
    assert.equal(await page.$eval('#result-area', (t) => t.hidden), true);
    // 1b. A wrong key: the 403 says the key was refused and what to check.
    await page.fill('#api-key', 'not-the-configured-key-0000');
    await design();
    assert.match(await statusText(), /API key was refused \(HTTP 403\).*operator/);
    // 1c. The right key: the design runs; the key stays out of the address and lives in session storage.
    await page.fill('#api-key', apiKey);
    v1Calls.length = 0;
    await page.click('#run');
    passed.push('401 and 403 messages');
  }
  await page.waitForFunction(() => document.getElementById('status').textContent.includes('figures ready'));
  let table = await results();
  // The README's indexing-axis gains (README "Example" section).
  near(num(table['position gain k1']), 1.57230, 1e-5, 'k1');
  near(num(table['velocity gain k2']), 0.0992069, 1e-6, 'k2');
  near(num(table['simulated settling time']), 0.15, 1e-5, 'settling time');
  for (const id of ['fig-step-response', 'fig-control-effort', 'fig-bode', 'fig-design-space']) {
    assert.equal(await page.$eval('#' + id, (img) => img.naturalWidth), 720, `${id} rendered`);
  }
  assert.equal(await page.$('#fig-uncertainty-band'), null, 'no uncertainty band without an uncertainty box');
  assert.match(await page.textContent('#cautions'), /commissioning/);
  assert.match(await page.textContent('#checks'), /overshootPercent\s*pass/);
  if (apiKey) {
    assert.equal(await page.evaluate(() => sessionStorage.getItem('loopwright.apiKey')), apiKey);
    assert.ok(!page.url().includes(apiKey), 'the key is kept out of the URL');
    assert.equal(await page.getAttribute('#api-key', 'type'), 'password');
    assert.ok(v1Calls.length >= 4, `design and figure calls: ${v1Calls.length}`);
    // 1d. A reload of the shared link keeps the key for this tab and designs at once.
    await page.reload();
    await page.waitForFunction(() => document.getElementById('status').textContent.includes('figures ready'));
    assert.equal(await page.inputValue('#api-key'), apiKey);
  }
  passed.push('shared link');

  // 2. Downloads: the figures' SVG, every controller export, the JSON request and the curl line.
  const svg = await download('#dl-step-response');
  // The design-space map of the same plant marks the README spec feasible (POST /v1/design-spaces/figure).
  const map = await download('#dl-design-space');
  assert.match(map.text, /^<svg[^>]*xmlns="http:\/\/www.w3.org\/2000\/svg"/);
  assert.match(map.text, /spec 0\.15 s, 1\.5 %: feasible/);
  assert.match(map.text, /settling time \[s\]/);
  assert.equal(svg.name, 'step-response.svg');
  assert.match(svg.text, /<svg[\s>]/);
  const st = await download('#dl-export-structured-text');
  assert.equal(st.name, 'LW_Controller.st');
  assert.match(st.text, /FUNCTION_BLOCK LW_Controller/);
  const header = await download('#dl-export-c-header');
  assert.equal(header.name, 'LW.h');
  assert.match(header.text, /#define LW_KY_1 \(1\.5722/);
  const source = await download('#dl-export-c-source');
  assert.match(source.text, /#include "LW\.h"/);
  const project = await download('#dl-export-plcopen-xml');
  assert.equal(project.name, 'LW_Controller.xml');
  assert.match(project.text, /pouType="functionBlock"/);
  const parameters = JSON.parse((await download('#dl-export-parameters')).text);
  near(parameters.positionGain, 1.57230, 1e-5, 'exported position gain');
  assert.equal(parameters.samplePeriod, 0.001);
  // A task period too long for the loop: the export's 422 names the period field.
  await page.fill('input[name=exportSamplePeriod]', '1');
  await page.click('#dl-export-c-source');
  await settle();
  assert.match(await statusText(), /the export was not made/);
  assert.equal(await page.getAttribute('input[name=exportSamplePeriod]', 'aria-invalid'), 'true');
  assert.match(await page.textContent('#problem'), /field \/samplePeriod/);
  await page.fill('input[name=exportSamplePeriod]', '0.001');
  const request = JSON.parse((await download('#dl-request')).text);
  assert.deepEqual(request.plant, { form: 'canonical', a0: 0, a1: 0.48, b: 400, d: 400 });
  assert.deepEqual(request.spec, { overshootPercent: 1.5, settlingTime: 0.15 });
  assert.equal(request.verify.actuatorLimit, 3);
  const curl = (await download('#dl-curl')).text;
  assert.match(curl, new RegExp(`curl -s .*${base.replaceAll('.', '\\.')}/v1/designs -d '\\{"plant":\\{"form":"canonical"`));
  if (apiKey) {
    assert.ok(!curl.includes(apiKey) && curl.includes('$LOOPWRIGHT_API_KEY'), 'the curl line names the key variable');
  }
  passed.push('downloads');

  // 3. Pin two designs and overlay them; Back and Forward step through the designs.
  await page.click('#pin');
  await page.fill('input[name=overshootPercent]', '1');
  await design();
  assert.ok(page.url().includes('overshootPercent=1&'), page.url());
  await page.click('#pin');
  const k1Pinned = await page.$$eval('#compare-table tbody tr', (rows) => rows.find((r) => r.cells[0].textContent
    .startsWith('position gain k1')).cells.length);
  assert.equal(k1Pinned, 3, 'a column per pinned design');
  for (const id of ['overlay-step', 'overlay-effort']) {
    const lines = await page.$$eval(`#${id} polyline`, (ls) => ls.map((l) => l.getAttribute('points').split(' ').length));
    assert.deepEqual(lines, [200, 200], `${id}: two curves of 200 points`);
  }
  const x1Ends = await page.$$eval('#overlay-step polyline', (ls) => ls.map((l) => l.getAttribute('points')));
  assert.notEqual(x1Ends[0], x1Ends[1], 'the two designs differ');
  passed.push('pin and overlay');
  await page.goBack();
  await page.waitForFunction(() => document.querySelector('input[name=overshootPercent]').value === '1.5');
  await settle();
  table = await results();
  near(num(table['simulated overshoot']), 1.5, 1e-4, 'overshoot after Back');
  await page.goForward();
  await page.waitForFunction(() => document.querySelector('input[name=overshootPercent]').value === '1');
  await settle();
  table = await results();
  near(num(table['simulated overshoot']), 1, 1e-4, 'overshoot after Forward');
  passed.push('Back and Forward');

  // 4. A peak command above the actuator limit is warned about.
  await page.fill('input[name=actuatorLimit]', '0.5');
  await design();
  assert.match(await page.textContent('#saturation-warning'), /peak command [\d.]+ .*exceeds the actuator limit 0\.5/);
  await page.fill('input[name=actuatorLimit]', '3');
  passed.push('actuator limit warning');

  // 4b. The loop as it runs: integral action with position-only sensing keeps the step of the specs (the reference
  // drives plant and observer alike) and leaves no steady offset after a load step (final-value theorem).
  await page.check('input[name=integralAction]');
  await page.selectOption('select[name=measurement]', 'position');
  await design();
  table = await results();
  assert.ok(Number.isFinite(num(table['integral gain ki'])), 'the integral gain is shown');
  assert.ok(Math.abs(num(table['load step steady offset'])) < 1e-9, 'no steady offset with integral action');
  assert.ok(['yes', 'no'].includes(table['observer loop exceeds gamma'].v), 'the observer loop is judged against gamma');
  assert.ok(num(table['sensor noise to command gain']) > 0, 'the noise-to-command gain is shown');
  await page.uncheck('input[name=integralAction]');
  await page.selectOption('select[name=measurement]', '');
  passed.push('integral action and position-only sensing');

  // 5. An infeasible spec: one message, the field highlighted, the proposal as a button that applies it.
  await page.fill('input[name=overshootPercent]', '30');
  await design();
  assert.match(await page.textContent('#problem'), /Infeasible spec/);
  const problemText = await page.textContent('#problem');
  const sentence = 'the velocity weight rho2 is imaginary for every gamma';
  assert.equal(problemText.split(sentence).length - 1, 1, 'the detail is printed once');
  assert.equal(await page.getAttribute('input[name=overshootPercent]', 'aria-invalid'), 'true');
  assert.equal(await page.$eval('#result-area', (t) => t.hidden), true);
  assert.deepEqual(await brokenImages(), [], 'no broken image after an error');
  const proposal = await page.textContent('button.proposal');
  assert.match(proposal, /overshootPercent = 4\.24397/);
  await page.click('button.proposal');
  await settle();
  near(Number(await page.inputValue('input[name=overshootPercent]')), 4.24397, 1e-5, 'the proposal applied');
  assert.match(await statusText(), /design verified/);
  passed.push('proposal button');

  // 6. A network failure clears "designing..." and says so.
  await page.route('**/v1/designs', (route) => route.abort('connectionrefused'));
  await design();
  assert.match(await statusText(), /^Network failure/);
  await page.unroute('**/v1/designs');
  // A field left empty is named before anything is sent.
  await page.fill('input[name=a1]', '');
  await design();
  assert.match(await statusText(), /^Check the field "a1 \[1\/s\]": it needs a number\.$/);
  assert.equal(await page.evaluate(() => document.activeElement.name), 'a1');
  await page.fill('input[name=a1]', '0.48');
  passed.push('network failure and an empty field');

  // 7. Every plant description. The derived canonical coefficients are checked against the conversions of the
  // plant equations written out here (rotary axis J q'' + c q' = N kt i + w: a1 = c/J, b = N kt/J, d = 1/J;
  // mass-spring-damper: a0 = k/m, a1 = c/m, b = d = 1/m; transfer function n/(c2 s^2 + c1 s + c0): a0 = c0/c2,
  // a1 = c1/c2, b = n/c2).
  const plants = [
    { form: 'rotaryAxis', spec: { overshootPercent: '1', time: '0.25' }, derived: { a0: 0, a1: 0.002 / 0.004,
      b: 10 * 0.12 / 0.004, d: 1 / 0.004 }, units: { k1: 'A per rad' } },
    { form: 'massSpringDamper', spec: { overshootPercent: '1', time: '0.4' }, derived: { a0: 150 / 2.5,
      a1: 4 / 2.5, b: 1 / 2.5, d: 1 / 2.5 }, units: { k1: 'N per m' } },
    { form: 'secondOrderTransferFunction', spec: { overshootPercent: '2', time: '2', timeKind: 'riseTime',
      settlingBandPercent: '5' }, derived: { a0: 0.5 / 2, a1: 1.8 / 2, b: 0.4 / 2 } },
    { form: 'stateSpace', spec: { overshootPercent: '1', time: '0.3' } },
  ];
  for (const plant of plants) {
    await page.selectOption('#plant-form', plant.form);
    await page.fill('input[name=overshootPercent]', plant.spec.overshootPercent);
    await page.fill('input[name=time]', plant.spec.time);
    await page.selectOption('select[name=timeKind]', plant.spec.timeKind ?? 'settlingTime');
    await page.fill('input[name=settlingBandPercent]', plant.spec.settlingBandPercent ?? '');
    await design();
    assert.match(await statusText(), /design verified - figures ready$/, `${plant.form}: ${await statusText()}`);
    table = await results();
    assert.equal(table['plant description'].v, plant.form);
    for (const [name, value] of Object.entries(plant.derived ?? {})) {
      near(num(table['derived ' + name]), value, 1e-9, `${plant.form} ${name}`);
    }
    for (const [name, unit] of Object.entries(plant.units ?? {})) {
      assert.equal(table['position gain ' + name].u, unit, `${plant.form} unit of ${name}`);
    }
    assert.deepEqual(await brokenImages(), []);
    assert.equal(JSON.parse((await download('#dl-request')).text).plant.form, plant.form);
  }
  await page.fill('input[name=settlingBandPercent]', '');
  await page.selectOption('select[name=timeKind]', 'settlingTime');
  // Order n: the pick-and-place axis of the contract's example (order 3, one auxiliary pole at -250 1/s).
  await page.selectOption('#plant-form', 'highOrder');
  await page.fill('input[name=overshootPercent]', '1.5');
  await page.fill('input[name=time]', '0.3');
  await design();
  assert.match(await statusText(), /design verified \(order 3\)/);
  table = await results();
  assert.equal(table.order.v, '3');
  assert.ok(table['gain k3'] && !table['gain k4'], 'three gains');
  near(num(table['simulated settling time']), 0.3, 2e-3, 'order-n settling time with spec matching');
  passed.push('every plant form');

  // 8. Fit from a pasted CSV, then design from the fit. The samples are the textbook step response of
  // K wn^2/(s^2 + 2 zeta wn s + wn^2): y = K (1 - e^(-zeta wn t) (cos wd t + zeta/sqrt(1 - zeta^2) sin wd t)).
  const [K, wn, zeta] = [2, 4, 0.4];
  const wd = wn * Math.sqrt(1 - zeta * zeta);
  const rows = ['time,output'];
  for (let i = 0; i <= 200; i++) {
    const t = i * 0.02;
    const y = K * (1 - Math.exp(-zeta * wn * t) * (Math.cos(wd * t) + zeta / Math.sqrt(1 - zeta * zeta) * Math.sin(wd * t)));
    rows.push(`${t.toFixed(2)},${y.toPrecision(12)}`);
  }
  // Dropped as a file on the samples box, then pasted over it (the textarea takes either).
  await page.evaluate((text) => {
    const transfer = new DataTransfer();
    transfer.items.add(new File([text], 'step-test.csv', { type: 'text/csv' }));
    document.getElementById('drop-zone').dispatchEvent(new DragEvent('drop', { dataTransfer: transfer, bubbles: true,
      cancelable: true }));
  }, rows.slice(0, 20).join('\n'));
  await page.waitForFunction(() => document.getElementById('csv').value.startsWith('time,output\n0.00,0'));
  await page.fill('#csv', rows.join('\n'));
  await page.click('#fit');
  await settle();
  assert.match(await statusText(), /^fitted: gain 2, natural frequency 4 rad\/s, damping ratio 0\.4 /, await statusText());
  const fitted = Object.fromEntries(await page.$$eval('#fit-table tbody tr',
    (trs) => trs.map((r) => [r.cells[0].textContent, Number(r.cells[1].textContent)])));
  near(fitted.gain, K, 1e-4, 'fitted gain');
  near(fitted.naturalFrequency, wn, 1e-4, 'fitted natural frequency');
  near(fitted.dampingRatio, zeta, 1e-4, 'fitted damping ratio');
  await page.selectOption('#plant-form', 'canonical');
  await page.fill('input[name=overshootPercent]', '1');
  await page.fill('input[name=time]', '0.5');
  await page.click('#use-fit');
  await settle();
  assert.match(await statusText(), /design verified/);
  table = await results();
  assert.equal(table['plant description'].v, 'secondOrderTransferFunction');
  near(num(table['derived a0']), wn * wn, 1e-4, 'a0 = wn^2 from the fit');
  near(num(table['derived a1']), 2 * zeta * wn, 1e-4, 'a1 = 2 zeta wn from the fit');
  near(num(table['derived b']), K * wn * wn, 1e-4, 'b = K wn^2 from the fit');
  passed.push('fit from a dropped and a pasted CSV');

  // 9. The uncertainty band appears with an uncertainty box; screenshots at 1400 and 390 px with nothing wider
  // than the viewport and no broken image.
  await page.fill('input[name=spreadB]', '20');
  await design();
  assert.equal(await page.$eval('#fig-uncertainty-band', (img) => img.naturalWidth > 0), true, 'uncertainty band');
  for (const width of [1920, 1400, 390, 360]) {
    await page.setViewportSize({ width, height: 1200 });
    assert.deepEqual(await overflowing(), [], `nothing wider than ${width} px`);
    assert.deepEqual(await brokenImages(), [], `no broken image at ${width} px`);
    if (width === 1400 || width === 390) await page.screenshot({ path: `target/dashboard-${width}.png`, fullPage: true });
  }
  passed.push('layout at 1920, 1400, 390 and 360 px, screenshots at 1400 and 390 px');

  if (apiKey) {
    const sent = await Promise.all(v1Calls);
    assert.ok(sent.length >= 20 && sent.every((h) => h === `Bearer ${apiKey}`),
      'every /v1 call sends Authorization: Bearer <key>');
  } else {
    assert.ok((await Promise.all(v1Calls)).every((h) => h === ''), 'no Authorization header without a key');
  }
  assert.deepEqual(foreign, [], 'no requests outside the service');
  assert.deepEqual(errors, [], 'no script errors');
  assert.deepEqual(leaks, [], 'the key never appears in a URL or on the console');
  console.log(`e2e: dashboard ${passed.length} scenarios passed (API key ${apiKey ? 'entered' : 'not needed'}):`
    + ` ${passed.join(', ')}; screenshots target/dashboard-1400.png, target/dashboard-390.png`);
} catch (error) {
  failed = true;
  console.error(`passed before the failure: ${passed.join(', ')}`);
  console.error(error);
} finally {
  await context.close();
  rmSync(profile, { recursive: true, force: true });
}
process.exit(failed ? 1 : 0);
