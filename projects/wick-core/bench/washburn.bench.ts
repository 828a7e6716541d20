/**
 * Benchmark of the gravity-restrained Washburn solution.
 *
 *   node --import tsx projects/wick-core/bench/washburn.bench.ts
 *
 * Measures (tinybench):
 *  1. a 1,000-point uptake curve from the explicit solution (gravityCurve), target ≤ 0.3 ms per curve;
 *  2. time-to-height inversions (gravityTime), timed in batches of 1,000 and reported per call;
 *  3. the same 1,000-point curve by integrating dh/dt = a/h − b with mathjs solveODE (Dormand–Prince RK45),
 *     at the loosest tolerance whose maximum relative error against the closed form is ≤ 1e-6;
 * and prints the speed ratio (target ≥ 300×). Times per call are tinybench's median latency (robust on a busy
 * machine); the mean is printed beside it. The closed form's own accuracy is stated from its inverse
 * round trip. Benchmarks report; they do not fail: the exit code is 0 whatever the numbers.
 */
import { all, create } from 'mathjs';
import { Bench, type Task } from 'tinybench';
import { gravityCurve, gravityHeight, gravityTime } from '../src/washburn';

/** mathjs 15 ships solveODE but its type declarations do not list it. */
type SolveOde = (
  f: (t: number, y: number[]) => number[],
  tspan: [number, number],
  y0: number[],
  options: { tol: number },
) => { t: number[]; y: number[][] };
const solveODE = (create(all) as unknown as { solveODE: SolveOde }).solveODE;

// Water at about 20 °C (γ = 72.8 mN/m, η = 1.0 mPa·s, ρ = 998 kg/m³) in a vertical glass capillary, r = 50 µm.
const radius = 50e-6;
const gamma = 0.0728;
const eta = 1.0e-3;
const rho = 998;
const g = 9.80665;
const a = (gamma * radius) / (4 * eta); // m²/s
const b = (rho * g * radius * radius) / (8 * eta); // m/s
const tStar = a / (b * b);
const hEq = a / b;

const N = 1000;
const REQUIRED_ACCURACY = 1e-6;
/** Reading times from 0.005 t* to 5 t*: the whole rise from the Washburn regime to 99.75 % of equilibrium. */
const times = new Float64Array(N);
for (let i = 0; i < N; i++) times[i] = (5 * tStar * (i + 1)) / N;
const curve = new Float64Array(N);

/**
 * The same curve by numerical integration, in the variables an implementer would pick: y = H² with
 * dy/dT = 2 − 2√y (regular at T = 0, unlike dh/dt), stepped from reading to reading.
 */
function odeCurve(tol: number, out: Float64Array): Float64Array {
  const rhs = (_t: number, y: number[]): number[] => [2 - 2 * Math.sqrt(Math.max(y[0], 0))];
  let t0 = 0;
  let y0 = 0;
  for (let i = 0; i < N; i++) {
    const t1 = times[i] / tStar;
    const sol = solveODE(rhs, [t0, t1], [y0], { tol });
    y0 = sol.y[sol.y.length - 1][0];
    t0 = t1;
    out[i] = hEq * Math.sqrt(y0);
  }
  return out;
}

function maxRelativeError(x: Float64Array, reference: Float64Array): number {
  let worst = 0;
  for (let i = 0; i < x.length; i++) worst = Math.max(worst, Math.abs(x[i] - reference[i]) / reference[i]);
  return worst;
}

/**
 * Median latency in ms: robust against the scheduler pre-empting a few samples on a busy machine (the mean is
 * printed beside it).
 */
function msPerCall(task: Task | undefined): number {
  const r = task?.result as { latency?: { p50: number } } | undefined;
  return r?.latency?.p50 ?? Number.NaN;
}

function meanMsPerCall(task: Task | undefined): number {
  const r = task?.result as { latency?: { mean: number } } | undefined;
  return r?.latency?.mean ?? Number.NaN;
}

function opsPerSecond(task: Task | undefined): number {
  const r = task?.result as { throughput?: { mean: number } } | undefined;
  return r?.throughput?.mean ?? Number.NaN;
}

function target(what: string, value: number, unit: string, limit: string, pass: boolean): void {
  console.log(`TARGET ${what}: ${value.toPrecision(4)}${unit} (target ${limit}) ${pass ? 'PASS' : 'FAIL'}`);
}

async function main(): Promise<void> {
  // Accuracy of the closed form: round trip h → t(h) → h(t) through the implicit solution T = −H − ln(1 − H)
  // (the well-conditioned direction; the unit tests check the explicit form against 30- and 50-digit references).
  const exact = gravityCurve(a, b, times, new Float64Array(N));
  let roundTrip = 0;
  for (let i = 0; i < N; i++) {
    const back = gravityTime(a, b, exact[i]);
    if (back !== null) roundTrip = Math.max(roundTrip, Math.abs(gravityHeight(a, b, back) - exact[i]) / exact[i]);
  }

  // Loosest solver tolerance that still meets the accuracy requirement (fair to the ODE route).
  const odeOut = new Float64Array(N);
  let tol = 1e-3;
  let odeError = maxRelativeError(odeCurve(tol, odeOut), exact);
  while (odeError > REQUIRED_ACCURACY && tol > 1e-12) {
    tol /= 10;
    odeError = maxRelativeError(odeCurve(tol, odeOut), exact);
  }

  // Single inversions take well under a microsecond, close to the timer's own cost: time them in batches of
  // 1,000 target heights (0.1 % … 99.9 % of h_eq) and divide.
  const heights = new Float64Array(N);
  for (let i = 0; i < N; i++) heights[i] = (hEq * (i + 0.5)) / N;
  let sink = 0;
  const fast = new Bench({ name: 'closed form', time: 1000 });
  fast
    .add('gravityCurve, 1,000 points', () => {
      gravityCurve(a, b, times, curve);
    })
    .add('gravityTime, 1,000 inversions', () => {
      for (let i = 0; i < N; i++) sink += gravityTime(a, b, heights[i]) ?? 0;
    });
  await fast.run();
  if (!Number.isFinite(sink)) console.log('unexpected non-finite time');

  const slow = new Bench({ name: 'ODE', time: 0, iterations: 5, warmupIterations: 1, warmupTime: 0 });
  slow.add(`mathjs solveODE RK45 (tol ${tol.toExponential(0)}), 1,000 points`, () => {
    odeCurve(tol, odeOut);
  });
  await slow.run();

  console.log(`Case: water in a vertical capillary r = ${radius * 1e6} µm; a = ${a.toExponential(4)} m²/s, ` +
    `b = ${b.toExponential(4)} m/s, h_eq = ${(hEq * 1000).toFixed(2)} mm, t* = ${tStar.toFixed(3)} s; ` +
    `curve from 0.005 t* to 5 t*.`);
  for (const task of [...fast.tasks, ...slow.tasks]) {
    console.log(
      `  ${task.name.padEnd(52)} ${opsPerSecond(task).toExponential(3).padStart(10)} ops/s  ` +
        `${(msPerCall(task) * 1000).toPrecision(4).padStart(9)} µs/call median ` +
        `(mean ${(meanMsPerCall(task) * 1000).toPrecision(4)})`,
    );
  }
  console.log(`Accuracy: closed form, max relative round-trip error h(t(h)) = ${roundTrip.toExponential(2)}; ` +
    `solveODE (tol ${tol.toExponential(0)}) max relative error vs closed form = ${odeError.toExponential(2)} ` +
    `(required ≤ ${REQUIRED_ACCURACY.toExponential(0)}).`);

  const curveMs = msPerCall(fast.tasks[0]);
  const odeMs = msPerCall(slow.tasks[0]);
  target('1,000-point gravity uptake curve', curveMs, ' ms', '≤ 0.3 ms', curveMs <= 0.3);
  const inversionUs = (msPerCall(fast.tasks[1]) * 1000) / N;
  console.log(`Time-to-height inversion: ${inversionUs.toPrecision(3)} µs per call (${(1e6 / inversionUs).toExponential(3)} ops/s).`);
  target('ODE accuracy vs closed form', odeError, '', `≤ ${REQUIRED_ACCURACY.toExponential(0)}`, odeError <= REQUIRED_ACCURACY);
  target('speed ratio solveODE / closed form', odeMs / curveMs, '×', '≥ 300×', odeMs / curveMs >= 300);
}

main()
  .catch((e: unknown) => {
    console.error('Benchmark error:', e);
  })
  .finally(() => {
    process.exitCode = 0;
  });
