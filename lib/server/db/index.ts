import 'server-only';
import pg from 'pg';
import { Sequelize } from 'sequelize';
import { initModels, type Models } from '@/models';
import { serverEnv } from '@/lib/server/config/env';

type DbCache = { sequelize: Sequelize; models: Models };
const globalForDb = globalThis as unknown as { __borelineDb?: DbCache };

// Created on first use (never at build time) and cached on globalThis for dev hot reload.
export function getDb(): DbCache {
  if (globalForDb.__borelineDb) return globalForDb.__borelineDb;
  const { DATABASE_URL: url, DB_POOL_MAX: poolMax } = serverEnv();
  const sequelize = new Sequelize(url, {
    dialect: 'postgres',
    dialectModule: pg,
    logging: false,
    pool: { max: poolMax, min: 0, acquire: 5000, idle: 10000 },
    dialectOptions: { connectionTimeoutMillis: 3000, statement_timeout: 15000 },
    retry: { max: 0 },
  });
  const models = initModels(sequelize);
  globalForDb.__borelineDb = { sequelize, models };
  return globalForDb.__borelineDb;
}
