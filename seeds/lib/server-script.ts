// Seeds that record demo data through the app's own server code run that code in a child process.
// The server modules start with `import "server-only"`, which throws unless the module is resolved
// for a React Server Components bundle; Node's `--conditions=react-server` resolves it (and any
// other package with a react-server export) the way Next.js does for server code, so the child
// imports the real modules unchanged. The child writes to the same database as the seed's knex.
import { spawn } from "node:child_process";
import path from "node:path";
import type { Knex } from "knex";

const projectRoot = path.resolve(import.meta.dirname, "..", "..");

/** Runs `script` (a path from the project root) under tsx with the react-server condition; rejects when it fails. */
export async function runServerScript(knex: Knex, script: string): Promise<void> {
  const connection = knex.client.config.connection as Knex.MySql2ConnectionConfig;
  const env: NodeJS.ProcessEnv = {
    ...process.env,
    DB_HOST: connection.host ?? process.env.DB_HOST,
    DB_PORT: connection.port === undefined ? process.env.DB_PORT : String(connection.port),
    DB_NAME: connection.database ?? process.env.DB_NAME,
    DB_USER: connection.user ?? process.env.DB_USER,
    DB_PASSWORD: connection.password ?? process.env.DB_PASSWORD,
  };
  const child = spawn(process.execPath, ["--conditions=react-server", "--import", "tsx", path.join(projectRoot, script)], {
    cwd: projectRoot,
    env,
    stdio: ["ignore", "inherit", "inherit"],
  });
  const code = await new Promise<number | null>((resolve, reject) => {
    child.once("error", reject);
    child.once("exit", (exitCode, signal) => resolve(signal ? null : exitCode));
  });
  if (code !== 0) throw new Error(`${script} failed (${code === null ? "killed" : `exit code ${code}`}); its error is printed above`);
}
