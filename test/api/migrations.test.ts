import knexFactory from "knex";
import { describe, expect, it } from "vitest";
import { knexConfig } from "../../knexfile";
import { rootSql } from "../../scripts/lib/mariadb";
import { testEnv } from "../support/api";

describe("migrations", () => {
  it("run up, all the way down, and up again on a fresh database", async () => {
    const env = testEnv();
    const database = "threadline_migration_check";
    await rootSql(
      env.DB_ADMIN_SOCKET,
      `DROP DATABASE IF EXISTS ${database}; CREATE DATABASE ${database} CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;
       GRANT ALL PRIVILEGES ON ${database}.* TO '${env.DB_USER}'@'127.0.0.1';`,
    );
    const knex = knexFactory(knexConfig({ ...process.env, ...env, DB_NAME: database }));
    try {
      await knex.migrate.latest();
      const tablesUp = await knex.raw("SHOW TABLES");
      const names = tablesUp[0].map((row: Record<string, string>) => Object.values(row)[0]);
      expect(names).toEqual(expect.arrayContaining(["users", "user_sessions", "positions", "ledger_entries", "fitted", "swaps"]));

      await knex.migrate.rollback(undefined, true);
      const tablesDown = (await knex.raw("SHOW TABLES"))[0].map((row: Record<string, string>) => Object.values(row)[0]);
      expect(tablesDown.filter((name: string) => !name.startsWith("knex_"))).toEqual([]);

      await knex.migrate.latest();
      const [{ count }] = await knex("ledger_head").count({ count: "*" });
      expect(Number(count)).toBe(1);
    } finally {
      await knex.destroy();
      await rootSql(env.DB_ADMIN_SOCKET, `DROP DATABASE IF EXISTS ${database}`);
    }
  });
});

describe("the schema stays within what a Galera cluster supports", () => {
  it("has only InnoDB tables, each with a primary key", async () => {
    const env = testEnv();
    const knex = knexFactory(knexConfig({ ...process.env, ...env }));
    try {
      const [tables] = await knex.raw(
        `SELECT t.table_name AS name, t.engine AS engine,
                (SELECT COUNT(*) FROM information_schema.table_constraints c
                  WHERE c.table_schema = t.table_schema AND c.table_name = t.table_name AND c.constraint_type = 'PRIMARY KEY') AS primary_keys
           FROM information_schema.tables t WHERE t.table_schema = ? AND t.table_type = 'BASE TABLE'`,
        [env.DB_NAME],
      );
      expect(tables.length).toBeGreaterThan(10);
      for (const table of tables) {
        expect(table.engine, table.name).toBe("InnoDB");
        expect(Number(table.primary_keys), `${table.name} has no primary key`).toBe(1);
      }
    } finally {
      await knex.destroy();
    }
  });
});
