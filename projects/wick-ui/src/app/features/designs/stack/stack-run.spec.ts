import { TestBed } from '@angular/core/testing';
import { STACK_VARIANT_EXAMPLE } from 'wick-core';
import type { StackWorkerMessage, StackWorkerRequest } from './stack-protocol';
import { STACK_WORKER, StackRun } from './stack-run';

/** Resolves when `check` holds, polling (the worker answers on its own schedule). */
async function until(check: () => boolean, timeoutMs = 20000): Promise<void> {
  const t0 = performance.now();
  while (!check()) {
    if (performance.now() - t0 > timeoutMs) throw new Error('timed out');
    await new Promise((r) => setTimeout(r, 10));
  }
}

/** A worker stand-in that records requests and lets the test answer. */
class FakeWorker {
  onmessage: ((e: MessageEvent<StackWorkerMessage>) => void) | null = null;
  onerror: ((e: ErrorEvent) => void) | null = null;
  readonly sent: StackWorkerRequest[] = [];
  terminated = false;
  postMessage(m: StackWorkerRequest): void {
    this.sent.push(m);
  }
  terminate(): void {
    this.terminated = true;
  }
  answer(m: StackWorkerMessage): void {
    this.onmessage?.({ data: m } as MessageEvent<StackWorkerMessage>);
  }
}

function withFake() {
  const workers: FakeWorker[] = [];
  TestBed.configureTestingModule({
    providers: [StackRun, { provide: STACK_WORKER, useValue: () => (workers.push(new FakeWorker()), workers[workers.length - 1]) }],
  });
  return { run: TestBed.inject(StackRun), workers };
}

describe('StackRun', () => {
  it('runs the example stack in a real Web Worker: progress, then results that close the volume balance', async () => {
    TestBed.configureTestingModule({ providers: [StackRun] });
    const run = TestBed.inject(StackRun);
    const seen: number[] = [];
    run.run(STACK_VARIANT_EXAMPLE);
    expect(run.running()).toBeTrue();
    await until(() => {
      if (run.state().status === 'running') seen.push(run.progress());
      return !run.running();
    });
    const s = run.state();
    expect(s.status).toBe('done');
    if (s.status !== 'done') return;
    expect(s.results.run).toBe('completed');
    expect(s.results.insults.length).toBe(3);
    // Conservation at the inlet (target: mass-balance error below 1e-6 of the volume absorbed).
    expect(s.results.massBalance.relativeError).toBeLessThan(1e-6);
    expect(run.progress()).toBe(1);
    expect(s.computeMs).toBeGreaterThan(0);
  });

  it('ends the worker on cancel when the page is not cross-origin isolated, and shows no results', async () => {
    TestBed.configureTestingModule({ providers: [StackRun] });
    const run = TestBed.inject(StackRun);
    run.run({ ...STACK_VARIANT_EXAMPLE, cells: 2000 });
    await until(() => run.progress() > 0 || !run.running());
    run.cancel();
    expect(run.state().status).toBe('cancelled');
    expect(run.results()).toBeNull();
  });

  it('reports an invalid input with the field the evaluator names', async () => {
    TestBed.configureTestingModule({ providers: [StackRun] });
    const run = TestBed.inject(StackRun);
    run.run({ ...STACK_VARIANT_EXAMPLE, duration: -1 });
    await until(() => !run.running());
    const s = run.state();
    expect(s.status).toBe('invalid');
    if (s.status === 'invalid') expect(s.field).toBe('duration');
  });

  it('ignores answers to an earlier run and reuses one worker for successive runs', () => {
    const { run, workers } = withFake();
    run.run(STACK_VARIANT_EXAMPLE);
    const first = workers[0].sent[0].id;
    workers[0].answer({ id: first, kind: 'progress', fraction: 0.4 });
    expect(run.progress()).toBe(0.4);
    workers[0].answer({ id: first, kind: 'invalid', message: 'x', field: null, computeMs: 1 });
    run.run(STACK_VARIANT_EXAMPLE);
    expect(workers.length).toBe(1);
    workers[0].answer({ id: first, kind: 'progress', fraction: 0.9 });
    expect(run.progress()).toBe(0);
  });

  it('starts a fresh worker after one failed', () => {
    const { run, workers } = withFake();
    run.run(STACK_VARIANT_EXAMPLE);
    workers[0].onerror?.({ message: 'boom', preventDefault: () => undefined } as ErrorEvent);
    expect(run.state()).toEqual({ status: 'failed', message: 'boom' });
    expect(workers[0].terminated).toBeTrue();
    run.run(STACK_VARIANT_EXAMPLE);
    expect(workers.length).toBe(2);
  });

  it('ends its worker when its injector is destroyed', () => {
    const { run, workers } = withFake();
    run.run(STACK_VARIANT_EXAMPLE);
    TestBed.resetTestingModule();
    expect(workers[0].terminated).toBeTrue();
  });
});

