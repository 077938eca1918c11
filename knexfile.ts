// Knex configuration for the CLI, the start and test scripts, and the bench generator.
// The connection comes from the same DB_* variables the app reads (see src/server/env.ts).
import type { Knex } from "knex";

export function connectionFromEnv(env: NodeJS.ProcessEnv = process.env): Knex.MySql2ConnectionConfig {
  return {
    host: env.DB_HOST ?? "127.0.0.1",
    port: Number(env.DB_PORT ?? 3307),
    user: env.DB_USER ?? "threadline",
    password: env.DB_PASSWORD ?? "threadline-local",
    database: env.DB_NAME ?? "threadline",
    timezone: "Z",
    dateStrings: false,
    // No `charset` here: it makes Knex emit a table charset that overrides the database's collation.
  };
}

export function knexConfig(env: NodeJS.ProcessEnv = process.env): Knex.Config {
  return {
    client: "mysql2",
    connection: connectionFromEnv(env),
    pool: { min: 0, max: 4 },
    migrations: { directory: "./migrations", extension: "ts", loadExtensions: [".ts"] },
    seeds: { directory: "./seeds", extension: "ts", loadExtensions: [".ts"] },
  };
}

export default knexConfig();
