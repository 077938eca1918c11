// `npm test`: build when stale, then every suite (unit, integration, end to end) in one vitest run.
// Services for the integration suites are started by test/support/global-setup.ts in a throwaway
// directory on free ports; .data/ is never touched.
import { spawnSync } from "node:child_process";
import path from "node:path";
import { ensureBuild } from "./lib/build";
import { projectRoot } from "./lib/services";

const log = (message: string) => process.stdout.write(`[threadline] ${message}\n`);

ensureBuild(projectRoot, log);
// Under tsx, so the global setup (in vitest's own process) can load the TypeScript migrations and seeds.
const result = spawnSync(
  process.execPath,
  ["--import", "tsx", path.join(projectRoot, "node_modules", "vitest", "vitest.mjs"), "run", ...process.argv.slice(3)],
  { cwd: projectRoot, stdio: "inherit", env: { ...process.env, NEXT_TELEMETRY_DISABLED: "1" } },
);
process.exit(result.status ?? 1);
