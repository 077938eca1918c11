import "server-only";
import knexFactory, { type Knex } from "knex";
import mysql from "mysql2/promise";
import { serverEnv } from "./env";

// One Knex instance and one mysql2 pool per server process, kept on globalThis so that
// module re-evaluation (dev reloads, several route bundles) does not open more pools.
const globalForDb = globalThis as unknown as { threadlineKnex?: Knex; threadlinePool?: mysql.Pool };

/** Where the app's database is, for a connection opened outside the pools (the ledger check's worker threads). */
export function connectionOptions() {
  const env = serverEnv();
  return {
    host: env.DB_HOST,
    port: env.DB_PORT,
    user: env.DB_USER,
    password: env.DB_PASSWORD,
    database: env.DB_NAME,
    timezone: "Z" as const,
  };
}

export function db(): Knex {
  globalForDb.threadlineKnex ??= knexFactory({
    client: "mysql2",
    connection: connectionOptions(),
    // Few writers: more only queue on the ledger head row (see shared performance notes).
    pool: { min: 0, max: 8 },
  });
  return globalForDb.threadlineKnex;
}

/** A raw mysql2 pool for the session adapter and the hot paths that skip the query builder. */
export function pool(): mysql.Pool {
  globalForDb.threadlinePool ??= mysql.createPool({ ...connectionOptions(), connectionLimit: 8, waitForConnections: true });
  return globalForDb.threadlinePool;
}

export type Trx = Knex | Knex.Transaction;

/** Closes both pools, for a script that must exit when its work is done (the demo seed's replays). */
export async function closeDatabase(): Promise<void> {
  const { threadlineKnex, threadlinePool } = globalForDb;
  globalForDb.threadlineKnex = undefined;
  globalForDb.threadlinePool = undefined;
  await Promise.all([threadlineKnex?.destroy(), threadlinePool?.end()]);
}
