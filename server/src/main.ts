import { createApp } from './app';
import { computePool } from './compute/compute-pool';
import { loadConfig } from './config';
import { connectWithRetry, createSequelize } from './db';

const config = loadConfig();
const sequelize = createSequelize(config.databaseUrl);
await connectWithRetry(sequelize);
const app = createApp({ config, sequelize });
const server = app.listen(config.port, config.host, () => {
  console.log(`Wickwright API listening on ${config.publicUrl} (${config.env})`);
  // Load wick-core in the compute threads now rather than on the first batch.
  computePool().warm();
});

function shutdown(): void {
  server.close(() => void Promise.all([sequelize.close(), computePool().close()]).finally(() => process.exit(0)));
  setTimeout(() => process.exit(0), 3000).unref();
}
process.on('SIGINT', shutdown);
process.on('SIGTERM', shutdown);
