// A private MariaDB server for one data directory: initialise, start on loopback, stop cleanly.
// Every client binary gets --no-defaults first, so /etc/mysql/my.cnf is never read.
import { execFile, spawn } from "node:child_process";
import { existsSync, mkdirSync, readFileSync } from "node:fs";
import path from "node:path";
import { promisify } from "node:util";

const run = promisify(execFile);

export interface MariadbServer {
  port: number;
  socket: string;
  dataDir: string;
  /** The pid of the mariadbd process (for the crash test). */
  pid: number;
  stop(): Promise<void>;
}

export interface MariadbOptions {
  dataDir: string;
  port: number;
  /** Extra mariadbd options, e.g. a bigger buffer pool for the benchmarks. */
  extraArgs?: string[];
  log?: (message: string) => void;
}

function isAlive(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch {
    return false;
  }
}

function readPid(pidFile: string): number | null {
  if (!existsSync(pidFile)) return null;
  const pid = Number(readFileSync(pidFile, "utf8").trim());
  return Number.isInteger(pid) && pid > 0 ? pid : null;
}

async function ping(socket: string): Promise<boolean> {
  try {
    await run("mariadb-admin", ["--no-defaults", `--socket=${socket}`, "--connect-timeout=1", "ping"]);
    return true;
  } catch {
    return false;
  }
}

export function serverArgs(dataDir: string, port: number, extra: string[] = []): string[] {
  const runAsRoot = typeof process.getuid === "function" && process.getuid() === 0;
  return [
    "--no-defaults",
    ...(runAsRoot ? ["--user=root"] : []),
    `--datadir=${path.join(dataDir, "mysql")}`,
    `--socket=${path.join(dataDir, "mysqld.sock")}`,
    `--pid-file=${path.join(dataDir, "mysqld.pid")}`,
    `--port=${port}`,
    "--bind-address=127.0.0.1",
    "--skip-name-resolve",
    `--log-error=${path.join(dataDir, "mysqld.err")}`,
    "--character-set-server=utf8mb4",
    "--collation-server=utf8mb4_unicode_ci",
    "--innodb-buffer-pool-size=256M",
    "--max-connections=300",
    "--local-infile=1",
    ...extra,
  ];
}

export async function startMariadb(options: MariadbOptions): Promise<MariadbServer> {
  const { dataDir, port } = options;
  const log = options.log ?? (() => {});
  const socket = path.join(dataDir, "mysqld.sock");
  const pidFile = path.join(dataDir, "mysqld.pid");
  mkdirSync(dataDir, { recursive: true });

  const stalePid = readPid(pidFile);
  if (stalePid && isAlive(stalePid)) {
    // A server from an earlier run that was not stopped: stop it, so this run owns its process.
    log(`stopping a MariaDB server left running (pid ${stalePid})`);
    await stopPid(stalePid);
  }

  if (!existsSync(path.join(dataDir, "mysql", "mysql"))) {
    log(`initialising a MariaDB data directory in ${dataDir}`);
    const runAsRoot = typeof process.getuid === "function" && process.getuid() === 0;
    await run("mariadb-install-db", [
      "--no-defaults",
      `--datadir=${path.join(dataDir, "mysql")}`,
      ...(runAsRoot ? ["--user=root"] : []),
      "--skip-test-db",
      "--auth-root-authentication-method=socket",
    ]);
  }

  // Its own process group, so a Ctrl-C in the terminal does not reach it; we stop it ourselves.
  const child = spawn("mariadbd", serverArgs(dataDir, port, options.extraArgs), {
    detached: true,
    stdio: "ignore",
  });
  child.unref();
  let exited = false;
  child.on("exit", () => (exited = true));

  for (let attempt = 0; attempt < 300; attempt++) {
    if (exited) {
      throw new Error(`mariadbd exited during start; see ${path.join(dataDir, "mysqld.err")}`);
    }
    if (await ping(socket)) break;
    await new Promise((resolve) => setTimeout(resolve, 100));
    if (attempt === 299) throw new Error(`mariadbd did not answer within 30 s; see ${dataDir}/mysqld.err`);
  }
  const pid = child.pid!;
  return {
    port,
    socket,
    dataDir,
    pid,
    stop: () => stopPid(pid),
  };
}

/** SIGTERM makes mariadbd flush and shut down cleanly; wait until it has gone. */
export async function stopPid(pid: number, timeoutMs = 60_000): Promise<void> {
  if (!isAlive(pid)) return;
  process.kill(pid, "SIGTERM");
  const deadline = Date.now() + timeoutMs;
  while (isAlive(pid) && Date.now() < deadline) {
    await new Promise((resolve) => setTimeout(resolve, 50));
  }
  if (isAlive(pid)) process.kill(pid, "SIGKILL");
}

/** Runs SQL as the server's root user over the socket (root authenticates by socket, no password). */
export async function rootSql(socket: string, sql: string): Promise<string> {
  const { stdout } = await run("mariadb", ["--no-defaults", `--socket=${socket}`, "-uroot", "--batch", "-e", sql]);
  return stdout;
}

export interface AppDatabase {
  database: string;
  user: string;
  password: string;
}

export async function ensureAppDatabase(socket: string, db: AppDatabase): Promise<void> {
  const quote = (value: string) => value.replace(/'/g, "''");
  await rootSql(
    socket,
    [
      `CREATE DATABASE IF NOT EXISTS \`${db.database}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`,
      `CREATE USER IF NOT EXISTS '${quote(db.user)}'@'127.0.0.1' IDENTIFIED BY '${quote(db.password)}'`,
      `CREATE USER IF NOT EXISTS '${quote(db.user)}'@'localhost' IDENTIFIED BY '${quote(db.password)}'`,
      `GRANT ALL PRIVILEGES ON \`${db.database}\`.* TO '${quote(db.user)}'@'127.0.0.1'`,
      `GRANT ALL PRIVILEGES ON \`${db.database}\`.* TO '${quote(db.user)}'@'localhost'`,
    ].join(";\n"),
  );
}
