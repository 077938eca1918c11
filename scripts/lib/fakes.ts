// Local stand-ins for the hosted services: an S3-compatible store and an SMTP server with an inbox.
import { spawn, type ChildProcess } from "node:child_process";
import { mkdirSync } from "node:fs";
import net from "node:net";
import path from "node:path";

// Listening ports come from below the kernel's ephemeral range (32768-60999 on Linux), which the
// outgoing connections of a busy run (thousands during the demo seed) draw their local ports from:
// a port picked there with listen(0) can be taken by a client socket before the service binds it.
const LISTEN_PORTS = { from: 20_000, to: 32_000 };
const taken = new Set<number>();

function canListen(port: number): Promise<boolean> {
  return new Promise((resolve) => {
    const server = net.createServer();
    server.unref();
    server.once("error", () => resolve(false));
    server.listen(port, "127.0.0.1", () => server.close(() => resolve(true)));
  });
}

/** A free loopback port for a service this process is about to start (never the same one twice). */
export async function freePort(): Promise<number> {
  for (let attempt = 0; attempt < 200; attempt++) {
    const port = LISTEN_PORTS.from + Math.floor(Math.random() * (LISTEN_PORTS.to - LISTEN_PORTS.from));
    if (taken.has(port)) continue;
    if (await canListen(port)) {
      taken.add(port);
      return port;
    }
  }
  throw new Error(`no free port between ${LISTEN_PORTS.from} and ${LISTEN_PORTS.to} on 127.0.0.1`);
}

async function waitForPort(port: number, timeoutMs = 20_000): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    const open = await new Promise<boolean>((resolve) => {
      const socket = net.connect(port, "127.0.0.1");
      socket.once("connect", () => (socket.destroy(), resolve(true)));
      socket.once("error", () => resolve(false));
    });
    if (open) return;
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
  throw new Error(`nothing listened on 127.0.0.1:${port} within ${timeoutMs} ms`);
}

export interface RunningService {
  stop(): Promise<void>;
}

/** s3rver in its own process, so it has a core of its own while the seed uploads certificates. */
export async function startS3Fake(options: { dir: string; port: number; bucket: string; root: string }): Promise<RunningService> {
  mkdirSync(options.dir, { recursive: true });
  const child = spawn(
    path.join(options.root, "node_modules", ".bin", "s3rver"),
    ["-d", options.dir, "-a", "127.0.0.1", "-p", String(options.port), "--silent", "--configure-bucket", options.bucket],
    { detached: true, stdio: "ignore" },
  );
  await waitForPort(options.port);
  return { stop: () => stopChild(child) };
}

function stopChild(child: ChildProcess): Promise<void> {
  return new Promise((resolve) => {
    if (child.exitCode !== null || child.signalCode !== null) return resolve();
    child.once("exit", () => resolve());
    child.kill("SIGTERM");
    setTimeout(() => child.kill("SIGKILL"), 5_000).unref();
  });
}

/** maildev: SMTP on one port, and a web inbox (with a REST API at /api/email) on another. */
export async function startMailFake(options: {
  dir: string;
  smtpPort: number;
  webPort: number;
  root: string;
}): Promise<RunningService> {
  mkdirSync(options.dir, { recursive: true });
  const child = spawn(
    path.join(options.root, "node_modules", ".bin", "maildev"),
    [
      "--smtp", String(options.smtpPort),
      "--ip", "127.0.0.1",
      "--web", String(options.webPort),
      "--web-ip", "127.0.0.1",
      "--mail-directory", options.dir,
      "--silent",
    ],
    { detached: true, stdio: "ignore" },
  );
  await waitForPort(options.smtpPort);
  await waitForPort(options.webPort);
  return { stop: () => stopChild(child) };
}

export { stopChild, waitForPort };
