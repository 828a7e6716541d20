/**
 * Benchmark of the layered-stack Richards solver.
 *
 *   node --import tsx projects/wick-core/bench/stack.bench.ts
 *
 * Case (invented product): top sheet 0.3 mm, acquisition layer 1.5 mm, core 3 mm; one gush of
 * 2 mm of liquid per area (0.2 mL/cm²) delivered in 0.4 s; 10 simulated minutes. Measures (tinybench,
 * after warm-up) the wall time per run at 50, 200 and 800 cells, the throughput in cells × simulated
 * seconds per wall second, and the growth of the cost with the cell count. Target: the 200-cell run in
 * under 0.5 s on one core. Benchmarks report; they do not fail: the exit code is 0 whatever the numbers.
 */
import { Bench, type Task } from 'tinybench';
import { simulateStack, type StackInput, type StackResult } from '../src/stack';

const END_TIME = 600;
const CELL_COUNTS = [50, 200, 800] as const;

function input(cells: number): StackInput {
  return {
    layers: [
      {
        name: 'top sheet',
        thickness: 0.3e-3,
        porosity: 0.85,
        retention: { kind: 'brooks-corey', entryPressure: 150, lambda: 2 },
        permeability: 2e-10,
        initialSaturation: 0.02,
      },
      {
        name: 'acquisition layer',
        thickness: 1.5e-3,
        porosity: 0.92,
        retention: { kind: 'van-genuchten', alpha: 1 / 400, n: 3 },
        permeability: 5e-10,
        initialSaturation: 0.02,
      },
      {
        name: 'core',
        thickness: 3e-3,
        porosity: 0.85,
        residualContent: 0.01,
        retention: { kind: 'van-genuchten', alpha: 1 / 2500, n: 2.5 },
        permeability: 2e-11,
        initialSaturation: 0.03,
      },
    ],
    liquid: { density: 1005, viscosity: 1.02e-3, surfaceTension: 0.07 },
    top: { kind: 'insults', insults: [{ start: 0, volume: 2e-3, rate: 5e-3 }] },
    endTime: END_TIME,
    cells,
    snapshots: 121,
  };
}

function msPerRun(task: Task | undefined): number {
  const r = task?.result as { latency?: { mean: number } } | undefined;
  return r?.latency?.mean ?? Number.NaN;
}

function target(what: string, value: number, unit: string, limit: string, pass: boolean): void {
  console.log(`TARGET ${what}: ${value.toPrecision(4)}${unit} (target ${limit}) ${pass ? 'PASS' : 'FAIL'}`);
}

async function main(): Promise<void> {
  // A first run in a fresh process includes compilation by the JavaScript engine: report it apart.
  const cold0 = performance.now();
  simulateStack(input(200));
  const coldMs = performance.now() - cold0;

  const results = new Map<number, StackResult>();
  const bench = new Bench({ name: 'stack', time: 0, iterations: 10, warmupIterations: 2, warmupTime: 0 });
  for (const cells of CELL_COUNTS) {
    bench.add(`${cells} cells`, () => {
      results.set(cells, simulateStack(input(cells)));
    });
  }
  await bench.run();

  console.log(
    `Case: 3 layers (0.3 + 1.5 + 3 mm), one gush of 2 mm per area at 5 mm/s, ${END_TIME} s simulated ` +
      `(mean of ${bench.tasks[0].runs} runs after warm-up).`,
  );
  const ms = CELL_COUNTS.map((_, k) => msPerRun(bench.tasks[k]));
  let worstMass = 0;
  CELL_COUNTS.forEach((cells, k) => {
    const r = results.get(cells) as StackResult;
    worstMass = Math.max(worstMass, r.massBalance.relativeError);
    const throughput = (cells * END_TIME) / (ms[k] / 1000);
    console.log(
      `  ${String(cells).padStart(4)} cells: ${ms[k].toFixed(1).padStart(7)} ms/run, ` +
        `${throughput.toExponential(3)} cell·s/s, ${r.stats.steps} steps (${r.stats.rejectedSteps} redone), ` +
        `${r.stats.iterations} iterations; acquisition ${r.insults[0].acquisitionTime?.toFixed(3) ?? 'not reached'} s, ` +
        `liquid left in the top sheet ${(r.upperLayerLiquid * 1e6).toFixed(2)} µm (mL/m²), mass balance ${r.massBalance.relativeError.toExponential(1)}`,
    );
  });
  console.log(`First (cold) 200-cell run in a fresh process: ${coldMs.toFixed(0)} ms.`);
  const growth1 = ms[1] / ms[0];
  const growth2 = ms[2] / ms[1];
  const exponent = Math.log(ms[2] / ms[0]) / Math.log(CELL_COUNTS[2] / CELL_COUNTS[0]);
  console.log(
    `Cost growth: 50 → 200 cells ×${growth1.toFixed(2)}, 200 → 800 cells ×${growth2.toFixed(2)} ` +
      `(cost ∝ cells^${exponent.toFixed(2)}; more cells also need more, smaller time steps).`,
  );
  const throughput200 = (200 * END_TIME) / (ms[1] / 1000);
  console.log(`Throughput at 200 cells: ${throughput200.toExponential(3)} cells × simulated seconds per wall second.`);
  target('200 cells, 600 s simulated, one insult', ms[1] / 1000, ' s', '< 0.5 s', ms[1] < 500);
  target('mass-balance error of the benchmarked runs', worstMass, '', '< 1e-6 of the absorbed volume', worstMass < 1e-6);
}

main()
  .catch((e: unknown) => {
    console.error('Benchmark error:', e);
  })
  .finally(() => {
    process.exitCode = 0;
  });
