/**
 * Benchmark of the pore-size bundle uptake curve.
 *
 *   node --import tsx projects/wick-core/bench/pore-size.bench.ts
 *
 * Measures (tinybench) a 100-class pore-size distribution (log-normal shape, 5–200 µm) taking up water in a
 * vertical layer, evaluated at 1,000 times (each class on the gravity-restrained Washburn solution);
 * target ≤ 5 ms per curve. Benchmarks report; the exit code is 0.
 */
import { Bench, type Task } from 'tinybench';
import { poreSizeUptake, type PoreSizeUptakeInput } from '../src/pore-size';

const classes = 100;
const diameters = Array.from({ length: classes }, (_, i) => 5e-6 * 40 ** (i / (classes - 1)));
const weights = diameters.map((d) => Math.exp(-0.5 * (Math.log(d / 40e-6) / 0.6) ** 2));
const total = weights.reduce((s, w) => s + w, 0);
const input: PoreSizeUptakeInput = {
  diameters,
  fractions: weights.map((w) => w / total),
  form: 'differential',
  surfaceTension: 0.0728,
  contactAngle: (40 * Math.PI) / 180,
  density: 998,
  viscosity: 1.0e-3,
  porosity: 0.85,
  thickness: 1.5e-3,
  times: Float64Array.from({ length: 1000 }, (_, i) => 0.6 * (i + 1)),
};

function msPerCall(task: Task | undefined): number {
  const r = task?.result as { latency?: { mean: number } } | undefined;
  return r?.latency?.mean ?? Number.NaN;
}

function opsPerSecond(task: Task | undefined): number {
  const r = task?.result as { throughput?: { mean: number } } | undefined;
  return r?.throughput?.mean ?? Number.NaN;
}

async function main(): Promise<void> {
  const check = poreSizeUptake(input);
  const bench = new Bench({ name: 'pore-size', time: 2000 });
  bench.add('poreSizeUptake, 100 classes × 1,000 times', () => {
    poreSizeUptake(input);
  });
  await bench.run();
  const last = input.times.length - 1;
  console.log(
    `Case: 100 classes 5–200 µm, water, θ = 40°, vertical; at 600 s front ${(check.frontLength[last] * 1000).toFixed(1)} mm, ` +
      `mean saturation ${check.saturation[last].toFixed(3)}, ${(check.massPerWidth[last] * 1000).toFixed(3)} g per m width.`,
  );
  for (const task of bench.tasks) {
    console.log(
      `  ${task.name.padEnd(48)} ${opsPerSecond(task).toExponential(3).padStart(10)} ops/s  ` +
        `${msPerCall(task).toPrecision(4).padStart(9)} ms/call`,
    );
  }
  const ms = msPerCall(bench.tasks[0]);
  console.log(`TARGET 100-class PSD uptake curve, 1,000 points: ${ms.toPrecision(4)} ms (target ≤ 5 ms) ${ms <= 5 ? 'PASS' : 'FAIL'}`);
}

main().then(
  () => process.exit(0),
  (e: unknown) => {
    console.error(e);
    process.exit(0);
  },
);
