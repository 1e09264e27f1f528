// Designs the packaging-line indexing axis (README scenario) and fetches its step-response figure.
// Node 20 or later (global fetch), no packages. Usage: node design-indexing-axis.mjs [base-url]
// With LOOPWRIGHT_API_KEY set, the key is sent as "Authorization: Bearer <key>". A 503 is retried after its
// Retry-After (at most 3 attempts, at most 10 s each). A problem answer (RFC 9457) is printed with its field errors
// and proposals, and the exit status is non-zero.
// Exit status 0 only for a certified design and a well-formed SVG figure.
const base = process.argv[2] ?? process.env.LOOPWRIGHT_URL ?? 'http://localhost:8080';
const apiKey = (process.env.LOOPWRIGHT_API_KEY ?? '').trim();
const MAX_ATTEMPTS = 3;
const MAX_WAIT_SECONDS = 10;
const design = {
  plant: { form: 'canonical', a0: 0, a1: 0.48, b: 400, d: 400 },
  spec: { settlingTime: 0.15, overshootPercent: 1.5 },
};

/** Retry-After in seconds (RFC 9110), capped; an HTTP date or a missing header waits 1 s. */
function retryAfterSeconds(value) {
  return /^\s*\d+\s*$/.test(value ?? '') ? Math.min(Number(value), MAX_WAIT_SECONDS) : 1;
}

/** POST JSON with the key when set; a 503 is retried after Retry-After, at most MAX_ATTEMPTS times in all. */
async function post(path, body) {
  const headers = { 'Content-Type': 'application/json' };
  if (apiKey) headers.Authorization = `Bearer ${apiKey}`;
  for (let attempt = 1; ; attempt++) {
    const response = await fetch(base + path, {
      method: 'POST', headers, body: JSON.stringify(body), signal: AbortSignal.timeout(10_000),
    });
    const reply = { status: response.status, type: response.headers.get('content-type') ?? '', text: await response.text() };
    if (reply.status !== 503 || attempt >= MAX_ATTEMPTS) return reply;
    const seconds = retryAfterSeconds(response.headers.get('retry-after'));
    console.error(`HTTP 503 (overloaded): retrying in ${seconds} s (attempt ${attempt + 1} of ${MAX_ATTEMPTS})`);
    await new Promise((resolve) => setTimeout(resolve, seconds * 1000));
  }
}

/** Prints an RFC 9457 problem (status, title, detail, field errors, proposals) and exits non-zero. */
function failWithProblem(reply) {
  let problem = null;
  try { problem = JSON.parse(reply.text); } catch { /* not JSON: printed raw below */ }
  if (problem === null || typeof problem !== 'object' || !('title' in problem)) {
    console.error(`HTTP ${reply.status}: ${reply.text.slice(0, 2000)}`);
    process.exit(1);
  }
  console.error(`HTTP ${reply.status} ${problem.title}: ${problem.detail ?? ''}`);
  for (const error of problem.errors ?? []) console.error(`  field ${error.pointer}: ${error.detail}`);
  for (const proposal of problem.proposals ?? []) {
    console.error(`  proposal ${proposal.pointer} = ${proposal.value}${proposal.note ? ` (${proposal.note})` : ''}`);
  }
  process.exit(1);
}

const reply = await post('/v1/designs', design);
if (reply.status !== 200) failWithProblem(reply);
const result = JSON.parse(reply.text);
if (!result.verification.certified) {
  console.error('the design is not certified');
  process.exit(1);
}
const { k: [k1, k2], referenceGain } = result.gain;
console.log(`u = ${referenceGain.toPrecision(6)}*r - (${k1.toPrecision(6)}*x1 + ${k2.toPrecision(6)}*x2),`
  + ` settling ${result.simulated.settlingTime.toPrecision(6)} s`);

const figure = await post('/v1/designs/plots/step-response', { design });
if (figure.status !== 200) failWithProblem(figure);
if (!figure.type.startsWith('image/svg+xml')
    || !figure.text.startsWith('<svg') || !figure.text.trimEnd().endsWith('</svg>')) {
  console.error(`figure failed: HTTP ${figure.status} ${figure.type}`);
  process.exit(1);
}
console.log(`step-response figure: ${figure.text.length} bytes of SVG`);
