/// <reference lib="webworker" />
import { VARIANT_EXAMPLE, variantBandPart } from 'wick-core';
import type { BandWorkerMessage, BandWorkerRequest } from './band-protocol';

/*
 * Computes one share of a variant's Monte Carlo band with wick-core (the code the server records with) while the
 * page computes another; the sorted values travel back without a copy (transferred buffers).
 */
// Warm up before the first request arrives: a fresh worker runs the band several times slower until the engine
// has optimised it, which would otherwise be felt on the first keystrokes after a tolerance is added.
for (let k = 0; k < 3; k++) variantBandPart(VARIANT_EXAMPLE, { curvePoints: 1000, samples: 1000, seed: k + 1 }, 0, 500);

addEventListener('message', ({ data }: MessageEvent<BandWorkerRequest>) => {
  const { id, inputs, options, from, to } = data;
  const t0 = performance.now();
  let reply: BandWorkerMessage;
  try {
    const part = variantBandPart(inputs, options, from, to);
    reply = { id, kind: 'part', part, ms: performance.now() - t0 };
  } catch (e) {
    reply = { id, kind: 'failed', message: e instanceof Error ? e.message : String(e) };
  }
  const transfer = reply.kind === 'part' && reply.part ? [reply.part.sorted.buffer, reply.part.scalarValues.buffer] : [];
  postMessage(reply, transfer as Transferable[]);
});
