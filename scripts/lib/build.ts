// Builds the Next.js app only when its inputs changed since the last build.
import { spawnSync } from "node:child_process";
import { createHash } from "node:crypto";
import { existsSync, readdirSync, readFileSync, statSync, writeFileSync } from "node:fs";
import path from "node:path";

const INPUTS = ["src", "public", "fonts", "next.config.ts", "tailwind.config.ts", "postcss.config.mjs", "tsconfig.json", "package-lock.json"];

function hashTree(root: string, entry: string, hash: ReturnType<typeof createHash>): void {
  const full = path.join(root, entry);
  if (!existsSync(full)) return;
  const stat = statSync(full);
  if (stat.isDirectory()) {
    for (const name of readdirSync(full).sort()) hashTree(root, path.join(entry, name), hash);
  } else {
    hash.update(entry).update("\0").update(readFileSync(full)).update("\0");
  }
}

export function sourceHash(root: string): string {
  const hash = createHash("sha256");
  for (const input of INPUTS) hashTree(root, input, hash);
  return hash.digest("hex");
}

export function ensureBuild(root: string, log: (m: string) => void): void {
  const stamp = path.join(root, ".next", "threadline-source-hash");
  const wanted = sourceHash(root);
  const built = existsSync(stamp) && existsSync(path.join(root, ".next", "BUILD_ID")) ? readFileSync(stamp, "utf8").trim() : null;
  if (built === wanted) {
    log("build is up to date");
    return;
  }
  log("building the app (next build)");
  const result = spawnSync(path.join(root, "node_modules", ".bin", "next"), ["build"], {
    cwd: root,
    stdio: "inherit",
    env: { ...process.env, NEXT_TELEMETRY_DISABLED: "1" },
  });
  if (result.status !== 0) throw new Error("next build failed");
  writeFileSync(stamp, wanted + "\n");
}
