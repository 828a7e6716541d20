import { loadavg } from 'node:os';
import type { Page, Request } from 'playwright-core';
import { signIn } from './sign-in';
import { choose, DEMO_PROJECT_LINK, recomputedPast, recomputes, typeInto } from './editor';

export const RECOMPUTE_TARGET_MS = 50;

export interface RecomputeSample {
  /** wick-core evaluation in the page, ms. */
  readonly compute: number;
  /** Plotly.react of the main chart, ms. */
  readonly plot: number;
  /** From the start of the recompute to the drawn chart (compute, Angular's update, plotly), ms. */
  readonly total: number;
  /** From the keystroke, with the editor's debounce, to the drawn chart, ms. */
  readonly endToEnd: number;
}

export interface RecomputeBenchmark {
  readonly curvePoints: number;
  readonly samples: number;
  readonly runs: number;
  readonly computeMedianMs: number;
  readonly plotMedianMs: number;
  readonly totalMedianMs: number;
  readonly totalMinMs: number;
  readonly totalMaxMs: number;
  readonly endToEndMedianMs: number;
  readonly loadAverage: number;
  /** Requests to /api/ while typing (the editor must ask the server nothing). */
  readonly apiCallsWhileTyping: number;
  readonly raw: readonly RecomputeSample[];
}

/**
 * The design editor's live-update benchmark, as a person works: signed in as the demo engineer, a new variant
 * in the demo project with three toleranced inputs (a band of 1,000 Monte Carlo samples), 1,000 curve points,
 * then basis weights typed one after another. Each typed value is one recompute and one redraw; the first two
 * are left out (warm-up). Used by the e2e suite and by `npm run bench`.
 */
export async function benchmarkRecompute(page: Page, requests: readonly Request[], values = ['48', '49', '50', '51', '52', '53', '47', '46', '50.5', '49.5', '48.5', '51.5']): Promise<RecomputeBenchmark> {
  await signIn(page, 'priya', '/designs');
  await page.getByRole('link', { name: DEMO_PROJECT_LINK }).first().click();
  await page.locator('mat-card', { hasText: 'Acquisition layer options' }).getByRole('link', { name: 'New variant' }).click();
  await page.locator('[data-testid="equilibrium"]').waitFor();
  // ± in each input's default unit: fibre size, fibre density, basis weight (the first three offered).
  for (const plusMinus of ['0.1', '20', '2']) {
    await page.getByRole('button', { name: 'Add a tolerance' }).click();
    await page.locator('.tolerance').last().locator('wick-unit-input input').fill(plusMinus);
  }
  let count = await recomputes(page);
  await choose(page, '[data-testid="curve-points"]', '1,000');
  count = await recomputedPast(page, count);
  await page.locator('[data-testid="uptake-plot"] .main-svg').first().waitFor();

  const apiCalls = () => requests.filter((r) => new URL(r.url()).pathname.startsWith('/api/')).length;
  const before = apiCalls();
  const raw: RecomputeSample[] = [];
  for (const v of values) {
    const n = await recomputes(page);
    const t0 = Date.now();
    await typeInto(page, 'structure.basisWeight', v);
    await recomputedPast(page, n);
    // The chart reports its Plotly.react time after the draw: wait for that draw.
    await page.waitForFunction(
      (k) => {
        const el = document.querySelector('[data-testid="results"]');
        return Number(el?.getAttribute('data-recomputes')) === k && el?.getAttribute('data-plot-drawn') === String(k);
      },
      n + 1,
      { timeout: 20_000 },
    );
    const endToEnd = Date.now() - t0;
    const results = page.locator('[data-testid="results"]');
    raw.push({
      compute: Number(await results.getAttribute('data-compute-ms')),
      plot: Number(await results.getAttribute('data-plot-ms')),
      total: Number(await results.getAttribute('data-update-ms')),
      endToEnd,
    });
  }
  const warm = raw.slice(2);
  const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];
  return {
    curvePoints: 1000,
    samples: 1000,
    runs: warm.length,
    computeMedianMs: median(warm.map((s) => s.compute)),
    plotMedianMs: median(warm.map((s) => s.plot)),
    totalMedianMs: median(warm.map((s) => s.total)),
    totalMinMs: Math.min(...warm.map((s) => s.total)),
    totalMaxMs: Math.max(...warm.map((s) => s.total)),
    endToEndMedianMs: median(warm.map((s) => s.endToEnd)),
    loadAverage: loadavg()[0],
    apiCallsWhileTyping: apiCalls() - before,
    raw,
  };
}

/** The benchmark's one-line report, `TARGET … PASS|FAIL` like every other benchmark. */
export function recomputeTargetLine(r: RecomputeBenchmark): string {
  return (
    `TARGET recompute+replot (1,000 points, 1,000-sample band) < ${RECOMPUTE_TARGET_MS} ms: median ${r.totalMedianMs.toFixed(1)} ms, ` +
    `min ${r.totalMinMs.toFixed(1)} ms (compute ${r.computeMedianMs.toFixed(1)}, Plotly.react ${r.plotMedianMs.toFixed(1)}; ` +
    `keystroke to drawn incl. the 120 ms debounce ${r.endToEndMedianMs} ms; load average ${r.loadAverage.toFixed(1)}) ` +
    `${r.totalMedianMs < RECOMPUTE_TARGET_MS ? 'PASS' : 'FAIL'}`
  );
}
