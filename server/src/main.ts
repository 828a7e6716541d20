import { createApp } from './app';
import { loadConfig } from './config';
import { connectWithRetry, createSequelize } from './db';

const config = loadConfig();
const sequelize = createSequelize(config.databaseUrl);
await connectWithRetry(sequelize);
const app = createApp({ config, sequelize });
const server = app.listen(config.port, config.host, () => {
  console.log(`Wickwright API listening on ${config.publicUrl} (${config.env})`);
});

function shutdown(): void {
  server.close(() => void sequelize.close().finally(() => process.exit(0)));
  setTimeout(() => process.exit(0), 3000).unref();
}
process.on('SIGINT', shutdown);
process.on('SIGTERM', shutdown);
