// Starts a private MariaDB, the S3 and mail fakes, and the built app (`next start`) for the
// integration and end-to-end suites, in a temporary directory on free ports.
import { spawn, type ChildProcess } from "node:child_process";
import { existsSync, mkdtempSync, readFileSync, rmSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import type { TestProject } from "vitest/node";
import { freePort, waitForPort, stopChild } from "../../scripts/lib/fakes";
import { migrate, projectRoot, startServices, type RunningServices } from "../../scripts/lib/services";
import { appKnex } from "../../scripts/lib/services";
import { stopPid } from "../../scripts/lib/mariadb";

declare module "vitest" {
  export interface ProvidedContext {
    env: Record<string, string>;
  }
}

let services: RunningServices | null = null;
let app: ChildProcess | null = null;
let tempDir: string | null = null;

export async function setup(project: TestProject) {
  tempDir = mkdtempSync(path.join(os.tmpdir(), "threadline-test-"));
  const appPort = await freePort();
  const appUrl = `http://127.0.0.1:${appPort}`;
  const log = (message: string) => process.stdout.write(`[test services] ${message}\n`);
  services = await startServices({
    dataDir: tempDir,
    dbPort: await freePort(),
    s3Port: await freePort(),
    smtpPort: await freePort(),
    mailWebPort: await freePort(),
    appUrl,
    log,
  });
  await migrate(services.env);
  Object.assign(process.env, services.env);
  const knex = appKnex(services.env);
  try {
    await knex.seed.run();
  } finally {
    await knex.destroy();
  }

  app = spawn(path.join(projectRoot, "node_modules", ".bin", "next"), ["start", "-p", String(appPort), "-H", "127.0.0.1"], {
    cwd: projectRoot,
    stdio: ["ignore", "ignore", "inherit"],
    // The demo ledger is a few thousand entries: segments of 500 make the ledger check split it
    // across its worker threads, so every ledger-check test goes through the joined path.
    env: { ...process.env, ...services.env, NODE_ENV: "production", NEXT_TELEMETRY_DISABLED: "1", LEDGER_CHECK_MIN_SEGMENT: "500", LEDGER_CHECK_THREADS: "3" },
  });
  await waitForPort(appPort, 60_000);
  log(`app on ${appUrl}`);

  // The crash suite kills and restarts mariadbd itself; it needs the pid, data directory and port.
  const env = {
    ...services.env,
    APP_URL: appUrl,
    TEST_TEMP_DIR: tempDir,
    DB_PID: String(services.mariadb.pid),
    DB_DATA_DIR: services.mariadb.dataDir,
  };
  Object.assign(process.env, env);
  project.provide("env", env);
}

export async function teardown() {
  if (app) await stopChild(app);
  if (services) await services.stop();
  // A suite may have restarted mariadbd under a new pid: stop whichever server the pid file names now.
  const pidFile = tempDir ? path.join(tempDir, "mariadb", "mysqld.pid") : null;
  if (pidFile && existsSync(pidFile)) {
    const pid = Number(readFileSync(pidFile, "utf8").trim());
    if (Number.isInteger(pid) && pid > 0) await stopPid(pid);
  }
  if (tempDir) rmSync(tempDir, { recursive: true, force: true });
}
