// `npm start`: MariaDB, the fakes, migrations, the demo seed, a fresh build, and the app on :3000.
// Data lives in .data/ (git-ignored) and survives restarts. Ctrl-C stops every child cleanly.
import { spawn } from "node:child_process";
import path from "node:path";
import { ensureBuild } from "./lib/build";
import { migrate, projectRoot, seedDemoOnce, startServices } from "./lib/services";

const log = (message: string) => process.stdout.write(`[threadline] ${message}\n`);
const port = Number(process.env.PORT ?? 3000);
const appUrl = process.env.APP_URL ?? `http://localhost:${port}`;

async function main() {
  const services = await startServices({
    dataDir: path.resolve(projectRoot, process.env.THREADLINE_DATA_DIR ?? ".data"),
    dbPort: Number(process.env.DB_PORT ?? 3307),
    s3Port: Number(process.env.S3_PORT ?? 4569),
    smtpPort: Number(process.env.SMTP_PORT ?? 1025),
    mailWebPort: Number(process.env.MAIL_WEB_PORT ?? 1080),
    appUrl,
    log,
  });

  let stopping = false;
  let app: ReturnType<typeof spawn> | null = null;
  const shutdown = async (code: number) => {
    if (stopping) return;
    stopping = true;
    log("stopping…");
    if (app && app.exitCode === null) {
      const exited = new Promise((resolve) => app!.once("exit", resolve));
      app.kill("SIGTERM");
      await exited;
    }
    await services.stop();
    log("stopped");
    process.exit(code);
  };
  process.on("SIGINT", () => void shutdown(0));
  process.on("SIGTERM", () => void shutdown(0));

  try {
    await migrate(services.env);
    log("migrations are up to date");
    await seedDemoOnce(services.env, log);
    ensureBuild(projectRoot, log);
  } catch (error) {
    console.error(error);
    await shutdown(1);
    return;
  }

  app = spawn(path.join(projectRoot, "node_modules", ".bin", "next"), ["start", "-p", String(port), "-H", "127.0.0.1"], {
    cwd: projectRoot,
    stdio: ["ignore", "inherit", "inherit"],
    env: { ...process.env, ...services.env, NODE_ENV: "production", NEXT_TELEMETRY_DISABLED: "1" },
    detached: true,
  });
  app.on("exit", (code) => {
    if (!stopping) {
      log(`the app exited (${code}); stopping the services`);
      void shutdown(code ?? 1);
    }
  });

  log("");
  log(`Threadline is serving on ${appUrl}`);
  log(`Mail sent by the app lands in the inbox at ${services.env.MAIL_INBOX_URL}`);
  log("Demo sign-ins (password: threadline-demo):");
  for (const role of ["technician", "inspector", "stores", "reliability", "auditor", "admin"]) {
    log(`  ${role.padEnd(12)} ${role}@demo.threadline.test`);
  }
  log("Press Ctrl-C to stop.");
}

main().catch((error) => {
  console.error(error);
  process.exit(1);
});
