// `npm test`: the same bootstrapping as `npm start`, then every suite. Ends with one plain line
// `N passed, N failed` summing all suites, and exits non-zero on any failure or on a suite that ran nothing.
import { spawn } from 'node:child_process';
import { rmSync } from 'node:fs';
import { join } from 'node:path';
import { ROOT, buildUi, ensureChromium, ensureDependencies, ensurePostgres, freePortBase, log, migrateAndSeed } from './bootstrap.mjs';

const only = process.argv.slice(2); // e.g. `npm test -- core server`
const want = (name) => only.length === 0 || only.includes(name);

ensureDependencies();
const { startStack, stackPorts } = await import('./stack.mjs');
const chrome = want('ui') || want('e2e') ? ensureChromium() : undefined;
const pg = await ensurePostgres();

const results = [];
const createdDbs = [];
const stateDirs = [];
/** A state folder (keys, secrets, mail store) of this run alone, removed at the end. */
function runStateDir(name) {
  const dir = join(ROOT, '.wick', `${name}-state-${process.pid}`);
  stateDirs.push(dir);
  return dir;
}
const NODE = process.execPath;
const JASMINE = join(ROOT, 'node_modules', 'jasmine', 'bin', 'jasmine.js');

/** Runs a command, echoing its output, and returns the combined text. */
function capture(cmd, args, env = {}) {
  return new Promise((resolveRun) => {
    const child = spawn(cmd, args, { cwd: ROOT, env: { ...process.env, ...env }, stdio: ['ignore', 'pipe', 'pipe'] });
    let text = '';
    child.stdout.on('data', (d) => { text += d; process.stdout.write(d); });
    child.stderr.on('data', (d) => { text += d; process.stderr.write(d); });
    child.on('close', (code) => resolveRun({ code: code ?? 1, text }));
  });
}

function record(suite, passed, failed, code, note = '') {
  // A suite that executed nothing, or exited non-zero with no failure counted, is a failure.
  if (passed + failed === 0) failed = 1, note ||= 'ran no test';
  else if (code !== 0 && failed === 0) failed = 1, note ||= `exited with code ${code}`;
  results.push({ suite, passed, failed, note });
  log(`${suite}: ${passed} passed, ${failed} failed${note ? ` (${note})` : ''}`);
}

function parseJasmine(text) {
  const m = [...text.matchAll(/(\d+) specs?, (\d+) failures?(?:, (\d+) pending specs?)?/g)].pop();
  if (!m) return { passed: 0, failed: 0 };
  const total = Number(m[1]), failed = Number(m[2]), pending = Number(m[3] ?? 0);
  return { passed: total - failed - pending, failed };
}

async function jasmineSuite(suite, config, env = {}, tsconfig = 'tsconfig.json') {
  log(`— ${suite} —`);
  const r = await capture(NODE, ['--import', 'tsx', JASMINE, `--config=${config}`], { TSX_TSCONFIG_PATH: join(ROOT, tsconfig), ...env });
  const { passed, failed } = parseJasmine(r.text);
  record(suite, passed, failed, r.code);
}

if (want('typecheck')) {
  log('— typecheck (wick-core, server, browser tests and benchmarks) —');
  const projects = ['projects/wick-core/tsconfig.spec.json', 'server/tsconfig.json', 'projects/wick-ui/e2e/tsconfig.json'];
  const codes = [];
  for (const p of projects) codes.push((await capture(join(ROOT, 'node_modules', '.bin', 'tsc'), ['-p', p, '--noEmit'])).code);
  record('typecheck', codes.filter((c) => c === 0).length, codes.filter((c) => c !== 0).length, 0);
}

if (want('core')) await jasmineSuite('wick-core', 'projects/wick-core/jasmine.json');

if (want('server')) {
  // Per-run names: several runs (developers, helpers, CI) may share one cluster.
  const db = `wickwright_test_${process.pid}`;
  const url = pg.freshDatabase(db);
  if (!pg.external) createdDbs.push(db);
  migrateAndSeed(url, { seed: false });
  await jasmineSuite('server', 'server/jasmine.json', { DATABASE_URL: url, NODE_ENV: 'test', WICK_STATE_DIR: runStateDir('server') }, 'server/tsconfig.json');
}

if (want('ui')) {
  log('— wick-ui (karma, headless Debian chromium) —');
  const r = await capture(join(ROOT, 'node_modules', '.bin', 'ng'), ['test', 'wick-ui', '--watch=false', '--no-progress'], { CHROME_BIN: chrome, NG_CLI_ANALYTICS: 'false' });
  const m = [...r.text.matchAll(/Executed (\d+) of (\d+)(?: \((\d+) FAILED\))?(?: \(skipped (\d+)\))?/g)].pop();
  const executed = m ? Number(m[1]) : 0;
  const failed = m ? Number(m[3] ?? 0) : 0;
  record('wick-ui', executed - failed, failed, r.code);
}

if (want('e2e')) {
  log('— end-to-end (playwright-core, Debian chromium) —');
  const db = `wickwright_e2e_${process.pid}`;
  const url = pg.freshDatabase(db);
  if (!pg.external) createdDbs.push(db);
  migrateAndSeed(url);
  buildUi();
  const ports = stackPorts(process.env.WICK_E2E_PORT ? Number(process.env.WICK_E2E_PORT) : await freePortBase(4710));
  let stack;
  try {
    stack = await startStack({ databaseUrl: url, ports, env: { WICK_STATE_DIR: runStateDir('e2e'), WICK_LOG_REQUESTS: '0' } });
    await jasmineSuite('e2e', 'projects/wick-ui/e2e/jasmine.json', { WICK_E2E_URL: stack.appUrl, WICK_E2E_IDP_URL: stack.idpUrl, WICK_E2E_MAIL_API: `http://127.0.0.1:${ports.mailApi}`, CHROME_BIN: chrome });
  } catch (e) {
    record('e2e', 0, 1, 1, String(e));
  } finally {
    await stack?.stop();
  }
}

if (!pg.external) for (const db of createdDbs) pg.dropDatabase(db);
for (const dir of stateDirs) rmSync(dir, { recursive: true, force: true });
if (!pg.external && pg.otherConnections() > 0) log('PostgreSQL stays up: another run is using it.');
else pg.stop();
const passed = results.reduce((s, r) => s + r.passed, 0);
const failed = results.reduce((s, r) => s + r.failed, 0);
console.log('');
for (const r of results) console.log(`  ${r.suite.padEnd(10)} ${String(r.passed).padStart(5)} passed ${String(r.failed).padStart(4)} failed ${r.note}`);
console.log(`${passed} passed, ${failed} failed`);
process.exit(failed > 0 || results.length === 0 ? 1 : 0);
