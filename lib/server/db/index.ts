import 'server-only';
import pg from 'pg';
import { Sequelize, type Options } from 'sequelize';
import { initModels, type Models } from '@/models';
import { serverEnv } from '@/lib/server/config/env';

type DbCache = { sequelize: Sequelize; models: Models };
const globalForDb = globalThis as unknown as { __borelineDb?: DbCache };

/**
 * Query option for a read that may come from a streaming replica, and so may lag the primary by a
 * moment: reports, public pages, lists. Every other query (writes, transactions, and any read that
 * must see what was just written, such as the dock's verdict after recording) goes to the primary.
 * With no replica configured it changes nothing.
 */
export const FROM_REPLICA = { useMaster: false } as const;

function connection(url: string) {
  const u = new URL(url);
  return {
    host: u.hostname,
    port: u.port || '5432',
    username: decodeURIComponent(u.username),
    password: decodeURIComponent(u.password),
    database: decodeURIComponent(u.pathname.slice(1)),
  };
}

/**
 * A Sequelize instance on DATABASE_URL, with Sequelize's read/write split when replicas are given.
 * Sequelize would send every SELECT outside a transaction to a replica; here the primary stays the
 * default and only queries that pass FROM_REPLICA read from a replica.
 */
export function createSequelize(url: string, replicaUrls: string[], poolMax: number, poolIdleMs = 10_000): Sequelize {
  const options: Options = {
    dialect: 'postgres',
    dialectModule: pg,
    logging: false,
    pool: { max: poolMax, min: 0, acquire: 5000, idle: poolIdleMs },
    dialectOptions: { connectionTimeoutMillis: 3000, statement_timeout: 15000 },
    retry: { max: 0 },
  };
  if (replicaUrls.length === 0) return new Sequelize(url, options);
  const sequelize = new Sequelize({
    ...options,
    replication: { write: connection(url), read: replicaUrls.map(connection) },
  });
  const manager = sequelize.connectionManager as unknown as {
    getConnection(o?: { useMaster?: boolean; type?: string }): Promise<unknown>;
  };
  const get = manager.getConnection.bind(manager);
  manager.getConnection = (o = {}) => get({ ...o, useMaster: o.useMaster ?? true });
  return sequelize;
}

// Created on first use (never at build time) and cached on globalThis for dev hot reload.
export function getDb(): DbCache {
  if (globalForDb.__borelineDb) return globalForDb.__borelineDb;
  const { DATABASE_URL: url, DATABASE_REPLICA_URLS: replicas, DB_POOL_MAX: poolMax, DB_POOL_IDLE_MS } = serverEnv();
  const sequelize = createSequelize(url, replicas, poolMax, DB_POOL_IDLE_MS);
  const models = initModels(sequelize);
  globalForDb.__borelineDb = { sequelize, models };
  return globalForDb.__borelineDb;
}
