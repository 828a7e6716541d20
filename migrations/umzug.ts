import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import type { QueryInterface, Sequelize } from 'sequelize';
import { SequelizeStorage, Umzug } from 'umzug';

const here = dirname(fileURLToPath(import.meta.url));

export interface MigrationContext {
  readonly queryInterface: QueryInterface;
  readonly sequelize: Sequelize;
}
export type Migration = (params: { context: MigrationContext }) => Promise<void>;

function build(sequelize: Sequelize, glob: string, tableName: string): Umzug<MigrationContext> {
  return new Umzug<MigrationContext>({
    migrations: {
      glob: [glob, { cwd: here }],
      // Names are stored without their extension, so the same step compiled to .js is not run again.
      resolve: ({ name, path, context }) => {
        const load = async () => (await import(path!)) as { up: Migration; down: Migration };
        return {
          name: name.replace(/\.(ts|js|mjs)$/, ''),
          up: async ({ context: c }) => (await load()).up({ context: c }),
          down: async ({ context: c }) => (await load()).down({ context: c }),
        };
      },
    },
    context: { queryInterface: sequelize.getQueryInterface(), sequelize },
    storage: new SequelizeStorage({ sequelize, tableName }),
    logger: undefined,
  });
}

/** Schema migrations: `migrations/NNNN-*.ts`. */
export function createMigrator(sequelize: Sequelize): Umzug<MigrationContext> {
  return build(sequelize, '[0-9][0-9][0-9][0-9]-*.ts', 'schema_migrations');
}

/** Demo data: `migrations/seeders/NN-*.ts`, each run once. */
export function createSeeder(sequelize: Sequelize): Umzug<MigrationContext> {
  return build(sequelize, 'seeders/[0-9][0-9]-*.ts', 'seed_runs');
}
