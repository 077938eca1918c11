#!/usr/bin/env node
// The one entry point behind `npm start`, `npm test` and `npm run bench`.
// Plain Node (no dependencies), because it runs before node_modules exists:
// it installs what the machine is missing (Debian packages, node_modules) and
// then hands over to the TypeScript script for the command.
import { execFileSync, spawn, spawnSync } from "node:child_process";
import { createHash } from "node:crypto";
import { existsSync, readFileSync, writeFileSync } from "node:fs";
import path from "node:path";
import { fileURLToPath } from "node:url";

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "..");
const command = process.argv[2] ?? "start";

// Which Debian packages each command needs, keyed by the binary that proves the package is there.
const systemNeeds = {
  start: [["mariadbd", "mariadb-server"]],
  dev: [["mariadbd", "mariadb-server"]],
  test: [
    ["mariadbd", "mariadb-server"],
    ["chromium", "chromium"],
    ["ffmpeg", "ffmpeg"],
  ],
  "bench:seed": [["mariadbd", "mariadb-server"]],
  bench: [
    ["mariadbd", "mariadb-server"],
    ["mariadb", "mariadb-client"],
  ],
};

function log(message) {
  process.stdout.write(`[threadline] ${message}\n`);
}

function hasBinary(name) {
  const dirs = (process.env.PATH ?? "").split(":").concat(["/usr/sbin", "/usr/bin", "/sbin"]);
  return dirs.some((dir) => dir && existsSync(path.join(dir, name)));
}

function ensureSystemPackages() {
  const missing = (systemNeeds[command] ?? [])
    .filter(([binary]) => !hasBinary(binary))
    .map(([, pkg]) => pkg);
  if (missing.length === 0) return;
  if (typeof process.getuid === "function" && process.getuid() !== 0) {
    console.error(
      `[threadline] Missing Debian packages: ${missing.join(", ")}.\n` +
        `Install them once as root, then run this command again:\n` +
        `  sudo apt-get update && sudo apt-get install -y ${missing.join(" ")}`,
    );
    process.exit(1);
  }
  log(`installing Debian packages: ${missing.join(", ")} (apt-get)`);
  const env = { ...process.env, DEBIAN_FRONTEND: "noninteractive" };
  execFileSync("apt-get", ["update", "-qq"], { stdio: "inherit", env });
  execFileSync("apt-get", ["install", "-y", "-qq", "--no-install-recommends", ...missing], {
    stdio: "inherit",
    env,
  });
}

// node_modules is stale when package-lock.json changed since the last `npm ci`.
function ensureNodeModules() {
  const lockFile = path.join(root, "package-lock.json");
  const stampFile = path.join(root, "node_modules", ".threadline-lock-hash");
  const lockHash = createHash("sha256").update(readFileSync(lockFile)).digest("hex");
  const current = existsSync(stampFile) ? readFileSync(stampFile, "utf8").trim() : null;
  if (current === lockHash && existsSync(path.join(root, "node_modules", ".bin", "tsx"))) return;
  log("installing npm packages (npm ci)");
  const result = spawnSync("npm", ["ci", "--no-audit", "--no-fund"], { cwd: root, stdio: "inherit" });
  if (result.status !== 0) process.exit(result.status ?? 1);
  writeFileSync(stampFile, lockHash + "\n");
}

const scripts = {
  start: "scripts/start.ts",
  dev: "scripts/start.ts",
  test: "scripts/test.ts",
  "bench:seed": "bench/seed.ts",
  bench: "bench/run.ts",
};

if (!scripts[command]) {
  console.error(`[threadline] unknown command "${command}"; use one of: ${Object.keys(scripts).join(", ")}`);
  process.exit(2);
}

ensureSystemPackages();
ensureNodeModules();

const child = spawn(
  process.execPath,
  ["--import", "tsx", path.join(root, scripts[command]), command, ...process.argv.slice(3)],
  { cwd: root, stdio: "inherit" },
);
// Pass stop signals on, and let the child decide when everything has shut down.
for (const signal of ["SIGINT", "SIGTERM"]) {
  process.on(signal, () => child.kill(signal));
}
child.on("exit", (code, signal) => process.exit(code ?? (signal ? 1 : 0)));
