/**
 * Batch compute route: 100 design variants in one POST /api/compute/batch, target under 1 s.
 *
 * Standalone (no database): the real compute router on a real HTTP port, with a stand-in for the session that
 * `npm start` provides (a signed-in engineer), so the time measured is JSON parsing, validation, wick-core's
 * runModel over `design-variant` requests on the server's compute threads (WICK_COMPUTE_WORKERS, default the
 * cores) and the JSON answer. The variants are the shared fixture's cases
 * (four of six with tolerance bands of 1,000 samples × 400 curve points), repeated to 100.
 * Run: `npm run bench -- batch` (or `node --import tsx server/bench/batch.bench.ts` with TSX_TSCONFIG_PATH=server/tsconfig.json).
 */
import express from 'express';
import type { AddressInfo } from 'node:net';
import type { BatchComputeResponse, VariantFixture } from 'wick-core';
import fixtureJson from '../../projects/wick-core/src/design/fixture/variants.json';
import type { AppDeps } from '../src/app';
import { errorHandler } from '../src/errors';
import { computeRouter } from '../src/routes/compute.router';

const fixture = fixtureJson as unknown as VariantFixture;
const COUNT = 100;
const TARGET_MS = 1000;

const app = express();
app.use(express.json({ limit: '1mb' }));
app.use((_req, res, next) => {
  res.locals['user'] = { id: 0, roles: ['engineer'] };
  next();
});
app.use('/api/compute', computeRouter({} as AppDeps));
app.use(errorHandler);
const server = app.listen(0, '127.0.0.1');
await new Promise((r) => server.once('listening', r));
const url = `http://127.0.0.1:${(server.address() as AddressInfo).port}/api/compute/batch`;

const requests = Array.from({ length: COUNT }, (_, i) => {
  const c = fixture.cases[i % fixture.cases.length];
  return { model: 'design-variant', inputs: { variant: c.inputs, ...c.options } };
});
const body = JSON.stringify({ requests });

async function once(): Promise<{ ms: number; ok: number; bytes: number }> {
  const t0 = performance.now();
  const res = await fetch(url, { method: 'POST', headers: { 'content-type': 'application/json' }, body });
  const text = await res.text();
  const ms = performance.now() - t0;
  const parsed = JSON.parse(text) as BatchComputeResponse;
  return { ms, ok: parsed.results.filter((r) => r.ok).length, bytes: text.length };
}

await once(); // warm-up (JIT, first table build)
const runs: number[] = [];
let last = { ms: 0, ok: 0, bytes: 0 };
for (let i = 0; i < 5; i++) {
  last = await once();
  runs.push(last.ms);
}
server.close();
runs.sort((a, b) => a - b);
const median = runs[Math.floor(runs.length / 2)];
console.log(`batch of ${COUNT} variants: median ${median.toFixed(0)} ms (runs ${runs.map((r) => r.toFixed(0)).join(', ')} ms), ${last.ok}/${COUNT} ok, ${(last.bytes / 1e6).toFixed(1)} MB of JSON`);
console.log(`TARGET batch route, ${COUNT} design variants < ${TARGET_MS} ms: ${median.toFixed(0)} ms ${median < TARGET_MS && last.ok === COUNT ? 'PASS' : 'FAIL'}`);
