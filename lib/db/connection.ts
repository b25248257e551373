import { Sequelize } from 'sequelize';
import pg from 'pg';
import { env } from '@/lib/env';

// One connection pool per process. Next's dev server re-evaluates modules on
// every edit, so the instance is kept on globalThis to avoid leaking pools.
const globalForDb = globalThis as unknown as { skywellSequelize?: Sequelize };

export const sequelize: Sequelize =
  globalForDb.skywellSequelize ??
  new Sequelize(env.DATABASE_URL, {
    dialect: 'postgres',
    dialectModule: pg,
    logging: env.DATABASE_LOGGING ? console.log : false,
    pool: { max: 10, idle: 10_000 },
    define: { underscored: true },
  });

globalForDb.skywellSequelize = sequelize;
