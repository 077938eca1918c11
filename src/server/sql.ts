import "server-only";
import type { Knex } from "knex";
import type { PoolConnection } from "mysql2/promise";
import { pool } from "./db";

// Plain SQL text with `?` placeholders, run on whichever connection the caller holds: a mysql2
// connection of the raw pool (the swap's hot path) or a Knex transaction (the demo seed records its
// history inside its own). The query builder costs about a fifth of a swap's CPU, so the statements
// a swap sends are written out once here and in swap-checks.ts rather than built per request.
// Values are formatted by mysql2 either way, so the two runners send exactly the same statements.

export interface Sql {
  rows<T = Record<string, unknown>>(text: string, values?: readonly unknown[]): Promise<T[]>;
  run(text: string, values?: readonly unknown[]): Promise<{ affectedRows: number }>;
}

function isSql(runner: Sql | Knex | Knex.Transaction): runner is Sql {
  return typeof (runner as Sql).rows === "function" && typeof (runner as Sql).run === "function";
}

/** The same statements through Knex's connection (knex.raw passes them to mysql2 as they are). */
export function sqlOnKnex(knex: Knex | Knex.Transaction): Sql {
  return {
    rows: async <T,>(text: string, values: readonly unknown[] = []) => (await knex.raw(text, values as Knex.RawBinding[]))[0] as T[],
    run: async (text: string, values: readonly unknown[] = []) => ({ affectedRows: Number((await knex.raw(text, values as Knex.RawBinding[]))[0].affectedRows) }),
  };
}

/** A Knex transaction or an Sql runner, as an Sql runner. */
export function asSql(runner: Sql | Knex | Knex.Transaction): Sql {
  return isSql(runner) ? runner : sqlOnKnex(runner);
}

function sqlOnConnection(connection: PoolConnection | ReturnType<typeof pool>): Sql {
  return {
    rows: async <T,>(text: string, values: readonly unknown[] = []) => (await connection.query(text, values as Knex.RawBinding[]))[0] as T[],
    run: async (text: string, values: readonly unknown[] = []) => ({ affectedRows: Number(((await connection.query(text, values as unknown[]))[0] as { affectedRows: number }).affectedRows) }),
  };
}

/** Statements outside a transaction, each on whichever pooled connection is free. */
export function sqlOnPool(): Sql {
  return sqlOnConnection(pool());
}

/**
 * Runs `work` in one transaction on one connection of the raw pool: committed if it returns,
 * rolled back if it throws. A connection whose rollback failed (the server went away) is
 * destroyed rather than handed back to the pool in an unknown state.
 */
export async function sqlTransaction<T>(work: (sql: Sql) => Promise<T>): Promise<T> {
  const connection = await pool().getConnection();
  let healthy = true;
  try {
    await connection.query("START TRANSACTION");
    const result = await work(sqlOnConnection(connection));
    await connection.query("COMMIT");
    return result;
  } catch (error) {
    await connection.query("ROLLBACK").catch(() => {
      healthy = false;
    });
    throw error;
  } finally {
    if (healthy) connection.release();
    else connection.destroy();
  }
}
