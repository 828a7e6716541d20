// `npm start`: everything a fresh clone needs, then the app on http://127.0.0.1:4610 until Ctrl-C.
import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { ROOT, buildUi, ensureDependencies, ensurePostgres, log, migrateAndSeed } from './bootstrap.mjs';

ensureDependencies();
const { startStack, stackPorts } = await import('./stack.mjs');
const pg = await ensurePostgres();
const dbName = process.env.WICK_DB_NAME ?? 'wickwright';
if (!pg.external) pg.createDatabase(dbName);
const databaseUrl = pg.url(pg.external ? undefined : dbName);
migrateAndSeed(databaseUrl);
buildUi();
const ports = stackPorts(Number(process.env.WICK_PORT ?? 4610));

let stack;
let stopping = false;
async function stop(code = 0) {
  if (stopping) return;
  stopping = true;
  await stack?.stop();
  pg.stop();
  process.exit(code);
}
process.on('SIGINT', () => void stop(0));
process.on('SIGTERM', () => void stop(0));

stack = await startStack({ databaseUrl, ports });
for (const c of stack.children) c.once('exit', (code) => { if (!stopping) { log(`A service exited (code ${code}); stopping.`); void stop(1); } });

const accountsFile = join(ROOT, 'idp-fake', 'accounts.json');
const accounts = existsSync(accountsFile) ? JSON.parse(readFileSync(accountsFile, 'utf8')) : [];
console.log(`
  Wickwright is running:  ${stack.appUrl}
  Health:                 ${stack.appUrl}/api/health
${accounts.length ? '  Demo sign-in accounts (password for all: see idp-fake/accounts.json):\n' + accounts.map((a) => `    ${a.username.padEnd(10)} ${a.name.padEnd(22)} ${a.roles.join(', ')}`).join('\n') : ''}
  Press Ctrl-C to stop everything that was started.
`);
