/**
 * `tsx migrations/cli.ts up|down|seed|status` against DATABASE_URL.
 * Used by the start and test scripts; also handy by hand.
 */
import { Sequelize } from 'sequelize';
import { createMigrator, createSeeder } from './umzug';

const url = process.env['DATABASE_URL'];
if (!url) {
  console.error('DATABASE_URL is not set.');
  process.exit(2);
}
const sequelize = new Sequelize(url, { logging: false, dialect: 'postgres' });
const command = process.argv[2] ?? 'up';
try {
  const migrator = createMigrator(sequelize);
  if (command === 'up') {
    const done = await migrator.up();
    console.log(done.length ? `migrated: ${done.map((m) => m.name).join(', ')}` : 'schema up to date');
  } else if (command === 'down') {
    const done = await migrator.down();
    console.log(`reverted: ${done.map((m) => m.name).join(', ') || 'nothing'}`);
  } else if (command === 'seed') {
    const done = await createSeeder(sequelize).up();
    console.log(done.length ? `seeded: ${done.map((m) => m.name).join(', ')}` : 'demo data already present');
  } else if (command === 'status') {
    console.log('pending:', (await migrator.pending()).map((m) => m.name));
  } else {
    console.error(`unknown command ${command}; use up, down, seed or status`);
    process.exitCode = 2;
  }
} catch (e) {
  console.error('migration failed:', e instanceof Error ? e.message : e);
  process.exitCode = 1;
} finally {
  await sequelize.close();
}
