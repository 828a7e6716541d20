// `npm run bench`: every benchmark script (projects/wick-core/bench/*.bench.ts, server/bench/*.bench.ts), one after
// another on one core. Benchmarks report; they print TARGET lines but never fail the run.
import { spawnSync } from 'node:child_process';
import { existsSync, readdirSync } from 'node:fs';
import { join } from 'node:path';
import { ROOT, ensureDependencies, log } from './bootstrap.mjs';

ensureDependencies();
const dirs = [join(ROOT, 'projects', 'wick-core', 'bench'), join(ROOT, 'server', 'bench')];
const only = process.argv.slice(2);
const targets = [];
for (const dir of dirs) {
  if (!existsSync(dir)) continue;
  for (const file of readdirSync(dir).filter((f) => f.endsWith('.bench.ts')).sort()) {
    if (only.length && !only.some((o) => file.includes(o))) continue;
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
console.log('\nSummary of targets:');
for (const t of targets) console.log('  ' + t);
