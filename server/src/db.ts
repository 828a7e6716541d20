import { Sequelize } from 'sequelize';

/** One Sequelize instance per process, with a pool and a bounded retry while the database starts. */
export function createSequelize(databaseUrl: string): Sequelize {
  return new Sequelize(databaseUrl, {
    dialect: 'postgres',
    logging: false,
    pool: { max: 10, min: 0, idle: 10_000, acquire: 30_000 },
    define: { underscored: true },
  });
}

export async function connectWithRetry(sequelize: Sequelize, attempts = 20, delayMs = 500): Promise<void> {
  for (let i = 1; ; i++) {
    try {
      await sequelize.authenticate();
      return;
    } catch (e) {
      if (i >= attempts) throw e;
      await new Promise((r) => setTimeout(r, delayMs));
    }
  }
}
