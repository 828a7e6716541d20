import { DestroyRef, Injectable, InjectionToken, computed, inject, signal } from '@angular/core';
import { DEFAULT_STACK_OPTIONS, type EvaluateStackOptions, type StackVariantResults } from 'wick-core';
import type { StackWorkerMessage, StackWorkerRequest } from './stack-protocol';

/** Makes the worker a stack run talks to; tests swap in a fake. */
export const STACK_WORKER = new InjectionToken<() => Worker>('stack worker factory', {
  providedIn: 'root',
  factory: () => () => new Worker(new URL('./stack.worker', import.meta.url), { type: 'module' }),
});

export type StackRunState =
  | { readonly status: 'idle' }
  | { readonly status: 'running'; readonly fraction: number }
  /** `results.run` is 'cancelled' when a cancel stopped the solver and it returned what it reached. */
  | { readonly status: 'done'; readonly results: StackVariantResults; readonly computeMs: number }
  /** Cancelled by ending the worker: nothing to show. */
  | { readonly status: 'cancelled' }
  | { readonly status: 'invalid'; readonly message: string; readonly field: string | null }
  | { readonly status: 'failed'; readonly message: string };

/**
 * One stack simulation at a time in a Web Worker, with its progress and a cancel. Cancelling sets a shared flag
 * the solver checks between time steps (partial results come back) when the page is cross-origin isolated;
 * otherwise it ends the worker. Provide it per page: the worker ends with the page.
 */
@Injectable()
export class StackRun {
  private readonly createWorker = inject(STACK_WORKER);
  private readonly current = signal<StackRunState>({ status: 'idle' });
  readonly state = this.current.asReadonly();
  readonly running = computed(() => this.current().status === 'running');
  /** 0 … 1 while running, 1 when done. */
  readonly progress = computed(() => {
    const s = this.current();
    return s.status === 'running' ? s.fraction : s.status === 'done' ? 1 : 0;
  });
  readonly results = computed(() => {
    const s = this.current();
    return s.status === 'done' ? s.results : null;
  });

  private worker: Worker | null = null;
  private runId = 0;
  private cancelFlag: Int32Array | null = null;

  constructor() {
    inject(DestroyRef).onDestroy(() => this.endWorker());
  }

  /** Starts a run (ending any run still going). */
  run(inputs: unknown, options: EvaluateStackOptions = DEFAULT_STACK_OPTIONS): void {
    if (this.running()) this.endWorker();
    const id = ++this.runId;
    const worker = (this.worker ??= this.startWorker());
    const shared = globalThis.crossOriginIsolated === true ? new SharedArrayBuffer(4) : undefined;
    this.cancelFlag = shared ? new Int32Array(shared) : null;
    this.current.set({ status: 'running', fraction: 0 });
    const request: StackWorkerRequest = { id, inputs, options, ...(shared ? { cancelFlag: shared } : {}) };
    worker.postMessage(request);
  }

  /** Stops the run: partial results when the solver can be told, else no results. */
  cancel(): void {
    if (!this.running()) return;
    if (this.cancelFlag) {
      Atomics.store(this.cancelFlag, 0, 1);
      return;
    }
    this.endWorker();
    this.current.set({ status: 'cancelled' });
  }

  private startWorker(): Worker {
    const worker = this.createWorker();
    worker.onmessage = ({ data }: MessageEvent<StackWorkerMessage>) => this.receive(data);
    worker.onerror = (e) => {
      e.preventDefault();
      this.endWorker();
      this.current.set({ status: 'failed', message: e.message || 'The simulation stopped unexpectedly.' });
    };
    return worker;
  }

  private receive(m: StackWorkerMessage): void {
    if (m.id !== this.runId || !this.running()) return;
    switch (m.kind) {
      case 'progress':
        this.current.set({ status: 'running', fraction: m.fraction });
        break;
      case 'done':
        this.current.set({ status: 'done', results: m.results, computeMs: m.computeMs });
        break;
      case 'invalid':
        this.current.set({ status: 'invalid', message: m.message, field: m.field });
        break;
      case 'failed':
        this.current.set({ status: 'failed', message: m.message });
        break;
    }
  }

  private endWorker(): void {
    this.worker?.terminate();
    this.worker = null;
  }
}
