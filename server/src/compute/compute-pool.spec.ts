import { runBatch, STACK_VARIANT_EXAMPLE, type ComputeRequest, type VariantFixture } from 'wick-core';
import fixtureJson from '../../../projects/wick-core/src/design/fixture/variants.json';
import { ComputePool } from './compute-pool';

const fixture = fixtureJson as unknown as VariantFixture;

/** The shared fixture's variants, a stack, a refused input and an unknown model: every kind of answer. */
function mixedBatch(): ComputeRequest[] {
  const variants = fixture.cases.map((c) => ({ model: 'design-variant', inputs: { variant: c.inputs, ...c.options } }));
  return [
    ...variants,
    { model: 'stack-variant', inputs: { variant: STACK_VARIANT_EXAMPLE } },
    { model: 'design-variant', inputs: { variant: { ...fixture.cases[0].inputs, liquid: { ref: 'water', temperature: -5 } } } },
    { model: 'no-such-model', inputs: {} },
    ...variants,
  ];
}

describe('compute threads for batches', () => {
  let pool: ComputePool | undefined;
  afterEach(async () => pool?.close());

  it('when a batch runs on two threads, then every answer equals the inline run, in request order (refusals included)', async () => {
    pool = new ComputePool(2);
    const requests = mixedBatch();
    const threaded = await pool.runBatch({ requests });
    const inline = JSON.parse(JSON.stringify(runBatch({ requests })));
    expect(threaded.results.length).toBe(requests.length);
    expect(JSON.parse(JSON.stringify(threaded))).toEqual(inline);
    expect(threaded.results.some((r) => !r.ok && r.model === 'no-such-model')).toBeTrue();
    expect(threaded.results.filter((r) => !r.ok).length).toBeGreaterThanOrEqual(2);
  });

  it('when several batches arrive at once, then each gets its own answers', async () => {
    pool = new ComputePool(2);
    const a = mixedBatch();
    const b = [...mixedBatch()].reverse();
    const [ra, rb] = await Promise.all([pool.runBatch({ requests: a }), pool.runBatch({ requests: b })]);
    expect(ra.results.map((r) => r.model)).toEqual(a.map((r) => r.model));
    expect(rb.results.map((r) => r.model)).toEqual(b.map((r) => r.model));
  });

  it('when a thread dies, then batches still get answered, inline', async () => {
    pool = new ComputePool(2);
    const requests = mixedBatch();
    await pool.runBatch({ requests });
    const first = (pool as unknown as { slots: { worker: { terminate(): Promise<number> } }[] }).slots[0];
    await first.worker.terminate();
    const again = await pool.runBatch({ requests });
    expect(JSON.parse(JSON.stringify(again))).toEqual(JSON.parse(JSON.stringify(runBatch({ requests }))));
  });

  it('when sized 0 or given a small batch, then it runs inline without starting threads', async () => {
    pool = new ComputePool(0);
    const requests = mixedBatch();
    expect((await pool.runBatch({ requests })).results.length).toBe(requests.length);
    const small = new ComputePool(2);
    await small.runBatch({ requests: requests.slice(0, 2) });
    expect((small as unknown as { slots: unknown }).slots).toBeNull();
  });
});
