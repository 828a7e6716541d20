import { DestroyRef, inject, Injectable, InjectionToken } from '@angular/core';
import {
  evaluateVariant,
  isDomainError,
  variantBandPart,
  variantField,
  type BandPart,
  type EvaluateVariantOptions,
  type VariantInputs,
  type VariantResults,
} from 'wick-core';
import type { BandWorkerMessage, BandWorkerRequest } from './band-protocol';

/** What the results panel shows after each recompute. */
export type LiveResult =
  | {
      readonly kind: 'results';
      readonly results: VariantResults;
      readonly computeMs: number;
      readonly source: 'browser' | 'server';
      /** Threads the band was shared across (1 when computed on the page's thread alone). */
      readonly threads?: number;
    }
  | { readonly kind: 'invalid'; readonly message: string; readonly field: string | null; readonly label: string | null; readonly computeMs: number };

type LiveOptions = Required<EvaluateVariantOptions>;

/**
 * Evaluates the variant in the browser with wick-core (the same code the server records with) and turns an
 * invalid input into a message naming the field, instead of a result.
 */
export function evaluateLive(inputs: VariantInputs, options: LiveOptions): LiveResult {
  const t0 = performance.now();
  return settle(() => evaluateVariant(inputs, options), t0, 1);
}

function settle(run: () => VariantResults, t0: number, threads: number): LiveResult {
  try {
    const results = run();
    return { kind: 'results', results, computeMs: performance.now() - t0, source: 'browser', threads };
  } catch (e) {
    if (!isDomainError(e)) throw e;
    const field = e.field ?? null;
    return { kind: 'invalid', message: e.message, field, label: field ? (variantField(field)?.label ?? null) : null, computeMs: performance.now() - t0 };
  }
}

/** Makes a band worker; null where the browser has no workers (the page then computes alone). Tests swap in a fake. */
export const BAND_WORKER = new InjectionToken<(() => Worker) | null>('band worker factory', {
  providedIn: 'root',
  factory: () => (typeof Worker === 'undefined' ? null : () => new Worker(new URL('./band.worker', import.meta.url), { type: 'module' })),
});

/**
 * Threads a band is shared across, the page's own included: one fewer than the machine's cores (at least one, at
 * most four). The browser composites and rasterises the redraw on threads of its own: on a 2-core machine a band
 * worker competed with them, and the page alone was measured faster (21–22 against 24–28 ms per recompute).
 */
export const BAND_THREADS = new InjectionToken<number>('band threads', {
  providedIn: 'root',
  factory: () => Math.min(4, Math.max(1, Math.floor(globalThis.navigator?.hardwareConcurrency ?? 1) - 1)),
});

/**
 * The live view's evaluator. A variant with tolerances has its Monte Carlo band (nearly all of the work) split
 * by samples: the page computes the first share while Web Workers compute the others, and wick-core merges the
 * shares into exactly the band of a single run (same draws, same order statistics), so the numbers equal the
 * server's. Without tolerances, without workers, or if a worker fails, it evaluates on the page's thread alone,
 * which also gives the message for invalid inputs. Provide it per page: the workers end with the page.
 */
@Injectable()
export class LiveEvaluator {
  private readonly createWorker = inject(BAND_WORKER);
  private readonly threads = inject(BAND_THREADS);
  private workers: Worker[] | null = null;
  private readonly waiting = new Map<number, (m: BandWorkerMessage) => void>();
  private nextId = 0;
  private broken = false;
  /** Fraction of the samples each thread computes (the page's first), balanced after every shared run. */
  private weights: number[] = [];

  constructor() {
    inject(DestroyRef).onDestroy(() => this.stop());
  }

  /** Results at once when computed on this thread alone, else a promise of them. */
  evaluate(inputs: VariantInputs, options: LiveOptions): LiveResult | Promise<LiveResult> {
    const hasBand = Object.values(inputs.tolerances ?? {}).some((t) => t !== undefined);
    const workers = hasBand ? this.pool() : [];
    return workers.length === 0 ? evaluateLive(inputs, options) : this.shared(inputs, options, workers);
  }

  private async shared(inputs: VariantInputs, options: LiveOptions, workers: readonly Worker[]): Promise<LiveResult> {
    const t0 = performance.now();
    const threads = workers.length + 1;
    const edges = this.split(options.samples, threads);
    const asked = workers.map((w, k) => this.ask(w, { inputs, options, from: edges[k + 1], to: edges[k + 2] }));
    let own: BandPart | null;
    try {
      own = variantBandPart(inputs, options, 0, edges[1]);
    } catch (e) {
      if (!isDomainError(e)) throw e;
      // Invalid inputs: the evaluator's own message (it may name an earlier problem than the band's).
      return evaluateLive(inputs, options);
    }
    const ownMs = performance.now() - t0;
    const answers = await Promise.all(asked);
    const parts = answers.map((a) => (a.kind === 'part' ? a.part : null));
    if (own === null || parts.some((p) => p === null)) return evaluateLive(inputs, options);
    this.balance(edges, [ownMs, ...answers.map((a) => (a.kind === 'part' ? a.ms : 0))]);
    return settle(() => evaluateVariant(inputs, options, [own, ...(parts as BandPart[])]), t0, threads);
  }

  /**
   * Each thread's share of the samples, in proportion to how fast it went last time: the page's thread also
   * renders and the workers compete with the browser's own threads, so equal shares leave one waiting. The
   * numbers do not depend on the split (the parts merge into the single-run band).
   */
  private split(samples: number, threads: number): number[] {
    if (this.weights.length !== threads) this.weights = Array.from({ length: threads }, () => 1 / threads);
    const edges = [0];
    let sum = 0;
    for (const w of this.weights) edges.push(Math.round(samples * (sum += w)));
    edges[threads] = samples;
    return edges;
  }

  private balance(edges: readonly number[], ms: readonly number[]): void {
    const rates = ms.map((t, k) => (edges[k + 1] - edges[k]) / Math.max(t, 0.1));
    const total = rates.reduce((s, r) => s + r, 0);
    if (!(total > 0)) return;
    // Smoothed (one slow frame should not swing the split), and no thread below a tenth of its equal share.
    const floor = 0.1 / rates.length;
    const next = this.weights.map((w, k) => Math.max(floor, 0.5 * w + (0.5 * rates[k]) / total));
    const norm = next.reduce((s, w) => s + w, 0);
    this.weights = next.map((w) => w / norm);
  }

  private pool(): readonly Worker[] {
    if (this.broken || this.createWorker === null || this.threads < 2) return [];
    if (this.workers === null) {
      try {
        this.workers = Array.from({ length: this.threads - 1 }, () => this.start(this.createWorker!));
      } catch {
        this.fail();
        return [];
      }
    }
    return this.workers;
  }

  private start(create: () => Worker): Worker {
    const worker = create();
    worker.onmessage = ({ data }: MessageEvent<BandWorkerMessage>) => {
      const done = this.waiting.get(data.id);
      this.waiting.delete(data.id);
      done?.(data);
    };
    worker.onerror = (e) => {
      e.preventDefault();
      this.fail();
    };
    return worker;
  }

  private ask(worker: Worker, request: Omit<BandWorkerRequest, 'id'>): Promise<BandWorkerMessage> {
    const id = ++this.nextId;
    return new Promise((resolve) => {
      this.waiting.set(id, resolve);
      worker.postMessage({ ...request, id });
    });
  }

  /** A worker broke: stop sharing for the rest of the page's life and let every waiting share fall back. */
  private fail(): void {
    this.broken = true;
    this.stop();
  }

  private stop(): void {
    for (const w of this.workers ?? []) w.terminate();
    this.workers = null;
    const waiting = [...this.waiting];
    this.waiting.clear();
    for (const [id, done] of waiting) done({ id, kind: 'failed', message: 'The band worker stopped.' });
  }
}
