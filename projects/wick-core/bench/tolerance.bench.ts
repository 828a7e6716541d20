/**
 * Benchmark of Monte Carlo tolerance propagation.
 *
 *   node --import tsx projects/wick-core/bench/tolerance.bench.ts
 *
 * Measures (tinybench) a 10,000-sample Monte Carlo of the time for water to wick 30 mm up a vertical
 * capillary (gravityTime of the gravity-restrained Washburn solution), with normal, uniform and triangular
 * tolerances on radius, surface tension, contact angle, viscosity and density; target ≤ 20 ms per run.
 * Also times a 2,000-sample × 200-point uptake band for information. Benchmarks report; the exit code is 0.
 */
import { Bench, type Task } from 'tinybench';
import { heightCurveModel, monteCarlo, monteCarloCurve, timeToHeightModel, withPhysicalBounds } from '../src/tolerance';

const deg = Math.PI / 180;
// Water at about 20 °C in a 40 µm-radius capillary (round numbers for a timing case).
const nominal = { radius: 40e-6, surfaceTension: 0.0728, contactAngle: 30 * deg, viscosity: 1.0e-3, density: 998 };
const tolerances = withPhysicalBounds({
  radius: { kind: 'normal', sd: 2e-6 },
  surfaceTension: { kind: 'uniform', min: 0.07, max: 0.0755 },
  contactAngle: { kind: 'triangular', min: 20 * deg, max: 45 * deg },
  viscosity: { kind: 'normal', sd: 0.03e-3 },
  density: { kind: 'normal', sd: 2 },
});
const timeToHeight = timeToHeightModel(0.03);
const times = Float64Array.from({ length: 200 }, (_, i) => 3 * (i + 1));
const curve = heightCurveModel(times);

function msPerCall(task: Task | undefined): number {
  const r = task?.result as { latency?: { mean: number } } | undefined;
  return r?.latency?.mean ?? Number.NaN;
}

function opsPerSecond(task: Task | undefined): number {
  const r = task?.result as { throughput?: { mean: number } } | undefined;
  return r?.throughput?.mean ?? Number.NaN;
}

async function main(): Promise<void> {
  const check = monteCarlo(timeToHeight, nominal, tolerances, { samples: 10_000, seed: 1 });
  const bench = new Bench({ name: 'tolerance', time: 2000 });
  bench
    .add('Monte Carlo, 10,000 samples, time to 30 mm', () => {
      monteCarlo(timeToHeight, nominal, tolerances, { samples: 10_000, seed: 1 });
    })
    .add('Monte Carlo curve, 2,000 samples × 200 times', () => {
      monteCarloCurve(curve, nominal, tolerances, { samples: 2000, seed: 1 });
    });
  await bench.run();

  const s = check.statistics;
  console.log(
    `Case: time to 30 mm, nominal ${check.nominalOutput?.toFixed(2)} s; P10 ${s.p10.toFixed(2)} s, P50 ${s.p50.toFixed(2)} s, ` +
      `P90 ${s.p90.toFixed(2)} s; ${check.failures.count} samples outside validity.`,
  );
  for (const task of bench.tasks) {
    console.log(
      `  ${task.name.padEnd(48)} ${opsPerSecond(task).toExponential(3).padStart(10)} ops/s  ` +
        `${msPerCall(task).toPrecision(4).padStart(9)} ms/call`,
    );
  }
  const ms = msPerCall(bench.tasks[0]);
  console.log(`TARGET 10,000-sample Monte Carlo of time-to-height: ${ms.toPrecision(4)} ms (target ≤ 20 ms) ${ms <= 20 ? 'PASS' : 'FAIL'}`);
}

main().then(
  () => process.exit(0),
  (e: unknown) => {
    console.error(e);
    process.exit(0);
  },
);
