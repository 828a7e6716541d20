// `npm run bench`: every benchmark script (projects/wick-core/bench/*.bench.ts, server/bench/*.bench.ts), one after
// another, then the browser benchmark of the design editor against a stack of its own (its own database and
// ports, stopped afterwards). Benchmarks report; they print TARGET lines but never fail the run.
// `npm run bench -- batch editor` runs only the benchmarks whose file names contain those words.
import { spawnSync } from 'node:child_process';
import { existsSync, readFileSync, readdirSync, rmSync } from 'node:fs';
import { join } from 'node:path';
import { ROOT, buildUi, ensureChromium, ensureDependencies, ensurePostgres, freePortBase, log, migrateAndSeed } from './bootstrap.mjs';

ensureDependencies();

/** Share of CPU time spent idle over the next `ms` (Linux /proc/stat; 1 where it cannot be read). */
async function idleShare(ms) {
  const read = () => {
    try {
      const f = readFileSync('/proc/stat', 'utf8').split('\n')[0].trim().split(/\s+/).slice(1).map(Number);
      return { idle: f[3] + (f[4] || 0), total: f.reduce((a, b) => a + b, 0) };
    } catch {
      return null;
    }
  };
  const a = read();
  await new Promise((r) => setTimeout(r, ms));
  const b = read();
  return a && b && b.total > a.total ? (b.idle - a.idle) / (b.total - a.total) : 1;
}

/**
 * Waits (at most a minute) until the machine is quiet — what a build or a test run just did (compilers,
 * database maintenance, a browser closing) would otherwise be timed along with the code. Says so if it is not.
 */
async function quietMachine() {
  const until = Date.now() + 60_000;
  let idle = await idleShare(1000);
  while (idle < 0.9 && Date.now() < until) idle = await idleShare(1000);
  if (idle < 0.9) log(`The machine is busy (${Math.round(idle * 100)} % idle): timings below include that load.`);
}
const dirs = [join(ROOT, 'projects', 'wick-core', 'bench'), join(ROOT, 'server', 'bench')];
const only = process.argv.slice(2);
const targets = [];
for (const dir of dirs) {
  if (!existsSync(dir)) continue;
  for (const file of readdirSync(dir).filter((f) => f.endsWith('.bench.ts')).sort()) {
    if (only.length && !only.some((o) => file.includes(o))) continue;
    await quietMachine();
    log(`— ${file} —`);
    const r = spawnSync(process.execPath, ['--import', 'tsx', join(dir, file)], {
      cwd: ROOT,
      encoding: 'utf8',
      env: { ...process.env, TSX_TSCONFIG_PATH: join(ROOT, 'server', 'tsconfig.json') },
      maxBuffer: 64 * 1024 * 1024,
    });
    process.stdout.write(r.stdout);
    process.stderr.write(r.stderr);
    targets.push(...r.stdout.split('\n').filter((l) => l.startsWith('TARGET ')));
    if (r.status !== 0) targets.push(`TARGET ${file}: did not finish (exit ${r.status}) FAIL`);
  }
}
// The design editor in a real browser (projects/wick-ui/e2e/editor.bench.ts).
if (!only.length || only.some((o) => 'editor.bench.ts'.includes(o))) {
  log('— editor.bench.ts (headless Chromium against a stack of its own) —');
  const { startStack, stackPorts } = await import('./stack.mjs');
  const chrome = ensureChromium();
  const pg = await ensurePostgres();
  const db = `wickwright_bench_${process.pid}`;
  const url = pg.freshDatabase(db);
  const stateDir = join(ROOT, '.wick', `bench-state-${process.pid}`);
  let stack;
  try {
    migrateAndSeed(url);
    buildUi();
    const ports = stackPorts(await freePortBase(4760));
    stack = await startStack({ databaseUrl: url, ports, env: { WICK_STATE_DIR: stateDir, WICK_LOG_REQUESTS: '0' } });
    await quietMachine();
    const r = spawnSync(process.execPath, ['--import', 'tsx', join(ROOT, 'projects', 'wick-ui', 'e2e', 'editor.bench.ts')], {
      cwd: ROOT,
      encoding: 'utf8',
      env: { ...process.env, WICK_E2E_URL: stack.appUrl, CHROME_BIN: chrome },
      maxBuffer: 16 * 1024 * 1024,
    });
    process.stdout.write(r.stdout);
    process.stderr.write(r.stderr);
    targets.push(...r.stdout.split('\n').filter((l) => l.startsWith('TARGET ')));
    if (r.status !== 0) targets.push(`TARGET editor.bench.ts: did not finish (exit ${r.status}) FAIL`);
  } catch (e) {
    targets.push(`TARGET editor.bench.ts: could not start (${e instanceof Error ? e.message : e}) FAIL`);
  } finally {
    await stack?.stop();
    rmSync(stateDir, { recursive: true, force: true });
    pg.dropDatabase(db);
    if (pg.otherConnections() === 0) pg.stop();
  }
}

console.log('\nSummary of targets:');
for (const t of targets) console.log('  ' + t);
