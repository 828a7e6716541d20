import { availableParallelism } from 'node:os';
import { Worker } from 'node:worker_threads';
import { runBatch, WICK_CORE_VERSION, type BatchComputeRequest, type BatchComputeResponse, type ComputeRequest, type ComputeResponse } from 'wick-core';

/** Below this many requests a batch runs inline: copying to threads would cost more than it saves. */
const INLINE_BELOW = 4;

interface Slot {
  readonly worker: Worker;
  readonly pending: Map<number, { resolve: (r: ComputeResponse[]) => void; reject: (e: Error) => void }>;
}

/**
 * Worker threads for batch computations, so that a batch of heavy variants (Monte Carlo bands, layered stacks)
 * uses every core and never blocks the event loop for other people's requests. Requests go out in small
 * slices to whichever thread is free, and the answers are put back in request order; each thread runs wick-core's
 * `runModel`, exactly as the inline route did. If the threads cannot start or one dies, batches run inline.
 * Size: `WICK_COMPUTE_WORKERS` (0 = always inline), default the machine's cores, at most 4.
 */
export class ComputePool {
  private slots: Slot[] | null = null;
  private broken = false;
  private nextId = 1;

  constructor(readonly size: number) {}

  /** Starts the threads ahead of the first batch (loading wick-core takes a moment in a fresh thread). */
  warm(): void {
    if (this.size > 0 && !this.broken) void this.dispatch(this.start()[0], []).catch(() => undefined);
  }

  async runBatch(batch: BatchComputeRequest): Promise<BatchComputeResponse> {
    const requests = batch.requests;
    if (this.size === 0 || this.broken || requests.length < INLINE_BELOW) return runBatch(batch);
    const slots = this.start();
    const n = requests.length;
    const k = Math.min(slots.length, n);
    // Small slices handed out as threads finish: variants differ a hundredfold in cost, so a fixed split
    // would leave one thread idle while another works through the heavy ones.
    const slice = Math.max(1, Math.ceil(n / (k * 8)));
    const results: ComputeResponse[] = new Array<ComputeResponse>(n);
    let next = 0;
    const drain = async (slot: Slot): Promise<void> => {
      while (next < n) {
        const start = next;
        next = Math.min(n, next + slice);
        const part = await this.dispatch(slot, requests.slice(start, next));
        for (let j = 0; j < part.length; j++) results[start + j] = part[j];
      }
    };
    try {
      await Promise.all(slots.slice(0, k).map(drain));
      return { coreVersion: WICK_CORE_VERSION, results };
    } catch (e) {
      if (this.broken) return runBatch(batch);
      throw e;
    }
  }

  /** Ends the threads (tests, shutdown). */
  async close(): Promise<void> {
    const slots = this.slots ?? [];
    this.slots = null;
    await Promise.all(slots.map((s) => s.worker.terminate()));
  }

  private start(): Slot[] {
    if (this.slots) return this.slots;
    this.slots = Array.from({ length: this.size }, () => {
      // The thread inherits the process's loader flags (tsx), so it imports wick-core as the server does.
      const worker = new Worker(new URL('./batch-worker.mjs', import.meta.url));
      const slot: Slot = { worker, pending: new Map() };
      worker.unref();
      worker.on('message', (m: { id: number; results?: ComputeResponse[]; error?: string }) => {
        const p = slot.pending.get(m.id);
        if (!p) return;
        slot.pending.delete(m.id);
        if (slot.pending.size === 0) worker.unref();
        if (m.error !== undefined) p.reject(new Error(m.error));
        else p.resolve(m.results ?? []);
      });
      const fail = (why: string) => {
        this.broken = true;
        for (const p of slot.pending.values()) p.reject(new Error(why));
        slot.pending.clear();
      };
      worker.on('error', (e) => fail(`a compute thread failed: ${e.message}`));
      worker.on('exit', (code) => {
        if (this.slots?.includes(slot)) fail(`a compute thread stopped (exit ${code})`);
      });
      return slot;
    });
    return this.slots;
  }

  private dispatch(slot: Slot, requests: readonly ComputeRequest[]): Promise<ComputeResponse[]> {
    const id = this.nextId++;
    return new Promise((resolve, reject) => {
      slot.pending.set(id, { resolve, reject });
      // Held while it works, so a waiting request keeps the process alive; idle threads never do.
      slot.worker.ref();
      slot.worker.postMessage({ id, requests });
    });
  }
}

function defaultSize(): number {
  const configured = process.env['WICK_COMPUTE_WORKERS'];
  if (configured !== undefined && /^\d+$/.test(configured.trim())) return Math.min(Number(configured), 16);
  return Math.max(1, Math.min(availableParallelism(), 4));
}

let shared: ComputePool | undefined;

/** The process's compute threads (one pool for every app in the process). */
export function computePool(): ComputePool {
  shared ??= new ComputePool(defaultSize());
  return shared;
}
