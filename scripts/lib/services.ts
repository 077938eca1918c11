// Brings up everything Threadline needs on one machine: MariaDB, the S3 fake and the mail fake,
// then migrates and (optionally) seeds. Used by `npm start`, `npm test` and the benchmarks.
import path from "node:path";
import knexFactory, { type Knex } from "knex";
import { knexConfig } from "../../knexfile";
import { ensureAppDatabase, startMariadb, type MariadbServer } from "./mariadb";
import { freePort, startMailFake, startS3Fake, type RunningService } from "./fakes";

export const projectRoot = path.resolve(import.meta.dirname, "..", "..");

export interface ServiceOptions {
  dataDir: string;
  dbPort: number;
  s3Port: number;
  smtpPort: number;
  mailWebPort: number;
  appUrl: string;
  database?: string;
  log?: (message: string) => void;
}

export interface RunningServices {
  env: Record<string, string>;
  mariadb: MariadbServer;
  stop(): Promise<void>;
}

export const APP_DB_USER = "threadline";
export const APP_DB_PASSWORD = "threadline-local";
export const S3_BUCKET = "threadline-documents";

export async function startServices(options: ServiceOptions): Promise<RunningServices> {
  const log = options.log ?? (() => {});
  const database = options.database ?? "threadline";
  const stoppers: Array<() => Promise<void>> = [];
  const stop = async () => {
    for (const stopOne of stoppers.reverse()) {
      await stopOne().catch((error) => log(`while stopping: ${error}`));
    }
    stoppers.length = 0;
  };

  try {
    const mariadb = await startMariadb({ dataDir: path.join(options.dataDir, "mariadb"), port: options.dbPort, log });
    stoppers.push(() => mariadb.stop());
    await ensureAppDatabase(mariadb.socket, { database, user: APP_DB_USER, password: APP_DB_PASSWORD });
    log(`MariaDB ready on 127.0.0.1:${options.dbPort}`);

    const s3: RunningService = await startS3Fake({
      dir: path.join(options.dataDir, "s3"),
      port: options.s3Port,
      bucket: S3_BUCKET,
      root: projectRoot,
    });
    stoppers.push(() => s3.stop());
    const mail = await startMailFake({
      dir: path.join(options.dataDir, "mail"),
      smtpPort: options.smtpPort,
      webPort: options.mailWebPort,
      root: projectRoot,
    });
    stoppers.push(() => mail.stop());
    log(`S3 fake on 127.0.0.1:${options.s3Port}, mail fake on SMTP ${options.smtpPort} (inbox http://127.0.0.1:${options.mailWebPort})`);

    const env: Record<string, string> = {
      DB_HOST: "127.0.0.1",
      DB_PORT: String(options.dbPort),
      DB_NAME: database,
      DB_USER: APP_DB_USER,
      DB_PASSWORD: APP_DB_PASSWORD,
      DB_ADMIN_SOCKET: mariadb.socket,
      S3_ENDPOINT: `http://127.0.0.1:${options.s3Port}`,
      S3_BUCKET,
      S3_REGION: "us-east-1",
      S3_ACCESS_KEY_ID: "S3RVER",
      S3_SECRET_ACCESS_KEY: "S3RVER",
      SMTP_HOST: "127.0.0.1",
      SMTP_PORT: String(options.smtpPort),
      MAIL_FROM: "Threadline <no-reply@threadline.test>",
      MAIL_INBOX_URL: `http://127.0.0.1:${options.mailWebPort}`,
      APP_URL: options.appUrl,
    };
    return { env, mariadb, stop };
  } catch (error) {
    await stop();
    throw error;
  }
}

export function appKnex(env: Record<string, string>): Knex {
  return knexFactory(knexConfig({ ...process.env, ...env }));
}

export async function migrate(env: Record<string, string>): Promise<void> {
  const knex = appKnex(env);
  try {
    await knex.migrate.latest();
  } finally {
    await knex.destroy();
  }
}

/** Seeds the demo unless the database already holds it, so a second start keeps its data. */
export async function seedDemoOnce(env: Record<string, string>, log: (m: string) => void): Promise<void> {
  const knex = appKnex(env);
  try {
    const [{ count }] = await knex("users").count({ count: "*" });
    if (Number(count) > 0) {
      log("demo data already present: keeping it");
      return;
    }
    const started = Date.now();
    // The seeds store demo certificates in the S3 fake, so they need its address.
    Object.assign(process.env, env);
    await knex.seed.run();
    log(`demo data seeded in ${((Date.now() - started) / 1000).toFixed(1)} s`);
  } finally {
    await knex.destroy();
  }
}

export { freePort };
