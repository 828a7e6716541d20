/**
 * Benchmark: the design editor's recompute + replot after an input change (1,000 curve points, a band of 1,000
 * Monte Carlo samples), target under 50 ms, in Debian's headless Chromium against a running stack with nothing
 * else going on. `npm run bench` starts the stack (its own database and ports), runs this, and stops it;
 * WICK_E2E_URL and CHROME_BIN say where. Prints one `TARGET … PASS|FAIL` line and never fails the run.
 */
import { launch, openPage } from './support/browser';
import { benchmarkRecompute, recomputeTargetLine } from './support/editor-benchmark';

const browser = await launch();
try {
  const { context, page, requests } = await openPage(browser);
  // Twenty typed values: a longer series than the e2e check, so one slow frame moves the median less.
  const values = Array.from({ length: 22 }, (_, i) => String(46 + (i % 8) + (i >= 8 ? 0.5 : 0) + (i >= 16 ? 0.25 : 0)));
  const r = await benchmarkRecompute(page, requests, values);
  await context.close();
  console.log(
    `editor recompute+replot, ${r.runs} typed values: total median ${r.totalMedianMs.toFixed(1)} ms (min ${r.totalMinMs.toFixed(1)}, max ${r.totalMaxMs.toFixed(1)}); ` +
      `compute ${r.computeMedianMs.toFixed(1)} ms, Plotly.react ${r.plotMedianMs.toFixed(1)} ms; requests to the server while typing: ${r.apiCallsWhileTyping}`,
  );
  console.log(recomputeTargetLine(r));
} finally {
  await browser.close();
}
