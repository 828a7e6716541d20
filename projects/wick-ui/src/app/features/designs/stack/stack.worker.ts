/// <reference lib="webworker" />
import { evaluateStackVariant, isDomainError } from 'wick-core';
import type { StackWorkerMessage, StackWorkerRequest } from './stack-protocol';

/*
 * Runs a stack variant off the page's thread with wick-core's evaluator (the code the server saves with), posting
 * progress about every 1 % of simulated time. With a shared cancel flag the run stops between two time steps and
 * returns what it reached; without one the page ends the worker instead.
 */
const post = (m: StackWorkerMessage) => postMessage(m);

addEventListener('message', ({ data }: MessageEvent<StackWorkerRequest>) => {
  const { id, inputs, options } = data;
  const flag = data.cancelFlag ? new Int32Array(data.cancelFlag) : null;
  const t0 = performance.now();
  try {
    const results = evaluateStackVariant(inputs, options, {
      onProgress: (fraction) => post({ id, kind: 'progress', fraction }),
      shouldCancel: () => flag !== null && Atomics.load(flag, 0) === 1,
    });
    post({ id, kind: 'done', results, computeMs: performance.now() - t0 });
  } catch (e) {
    if (isDomainError(e)) post({ id, kind: 'invalid', message: e.message, field: e.field ?? null, computeMs: performance.now() - t0 });
    else post({ id, kind: 'failed', message: e instanceof Error ? e.message : String(e) });
  }
});
