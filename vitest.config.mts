import { fileURLToPath } from "node:url";
import { defineConfig } from "vitest/config";

const src = fileURLToPath(new URL("./src", import.meta.url));
// "server-only" throws outside a React Server Component bundle; tests import server modules directly.
const serverOnlyStub = fileURLToPath(new URL("./test/support/server-only-stub.ts", import.meta.url));

export default defineConfig({
  resolve: { alias: { "@": src, "server-only": serverOnlyStub } },
  test: {
    execArgv: ["--import", "tsx"],
    reporters: ["default"],
    projects: [
      {
        extends: true,
        test: { name: "unit", include: ["test/domain/**/*.test.ts", "test/lib/**/*.test.ts"] },
      },
      {
        extends: true,
        test: {
          name: "integration",
          include: ["test/api/**/*.test.ts", "test/e2e/**/*.test.ts", "test/integrity/**/*.test.ts"],
          globalSetup: ["test/support/global-setup.ts"],
          fileParallelism: false,
          testTimeout: 60_000,
          hookTimeout: 120_000,
        },
      },
    ],
  },
});
