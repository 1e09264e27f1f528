// Designs the packaging-line indexing axis (README scenario) and fetches its step-response figure.
// Node 20 or later (global fetch), no packages. Usage: node design-indexing-axis.mjs [base-url]
// Exit status 0 only for a certified design and a well-formed SVG figure.
const base = process.argv[2] ?? process.env.LOOPWRIGHT_URL ?? 'http://localhost:8080';
const design = {
  plant: { a0: 0, a1: 0.48, b: 400, d: 400 },
  spec: { settlingTime: 0.15, overshootPercent: 1.5 },
};

async function post(path, body) {
  const response = await fetch(base + path, {
    method: 'POST',
    headers: { 'Content-Type': 'application/json' },
    body: JSON.stringify(body),
    signal: AbortSignal.timeout(10_000),
  });
  return { status: response.status, type: response.headers.get('content-type') ?? '', text: await response.text() };
}

const reply = await post('/v1/designs', design);
if (reply.status !== 200) {
  console.error(`HTTP ${reply.status}: ${reply.text}`);
  process.exit(1);
}
const result = JSON.parse(reply.text);
if (!result.verification.certified) {
  console.error('the design is not certified');
  process.exit(1);
}
const { k1, k2, referenceGain } = result.gain;
console.log(`u = ${referenceGain.toPrecision(6)}*r - (${k1.toPrecision(6)}*x1 + ${k2.toPrecision(6)}*x2),`
  + ` settling ${result.simulated.settlingTime.toPrecision(6)} s`);

const figure = await post('/v1/designs/plots/step-response', { design });
if (figure.status !== 200 || !figure.type.startsWith('image/svg+xml')
    || !figure.text.startsWith('<svg') || !figure.text.trimEnd().endsWith('</svg>')) {
  console.error(`figure failed: HTTP ${figure.status} ${figure.type}`);
  process.exit(1);
}
console.log(`step-response figure: ${figure.text.length} bytes of SVG`);
