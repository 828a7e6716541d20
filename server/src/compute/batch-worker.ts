/**
 * A compute thread's work: slices of a batch run with wick-core's runModel, the same function the route runs
 * inline. Messages in: `{ id, requests }`; out: `{ id, results }` in request order, or `{ id, error }` when a
 * request failed in a way runModel does not report itself (a bug, not a refused input).
 */
import { parentPort } from 'node:worker_threads';
import { runModel, type ComputeRequest } from 'wick-core';

parentPort?.on('message', (job: { id: number; requests: readonly ComputeRequest[] }) => {
  try {
    parentPort!.postMessage({ id: job.id, results: job.requests.map(runModel) });
  } catch (e) {
    parentPort!.postMessage({ id: job.id, error: e instanceof Error ? e.message : String(e) });
  }
});
