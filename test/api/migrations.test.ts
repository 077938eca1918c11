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
