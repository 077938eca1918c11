import "server-only";
import { z } from "zod";

// Every variable the server reads, validated once. `npm start` and the test setup provide them.
const EnvSchema = z.object({
  DB_HOST: z.string().default("127.0.0.1"),
  DB_PORT: z.coerce.number().int().positive().default(3307),
  DB_NAME: z.string().default("threadline"),
  DB_USER: z.string().default("threadline"),
  DB_PASSWORD: z.string().default("threadline-local"),
  S3_ENDPOINT: z.string().url().default("http://127.0.0.1:4569"),
  S3_BUCKET: z.string().default("threadline-documents"),
  S3_REGION: z.string().default("us-east-1"),
  S3_ACCESS_KEY_ID: z.string().default("S3RVER"),
  S3_SECRET_ACCESS_KEY: z.string().default("S3RVER"),
  SMTP_HOST: z.string().default("127.0.0.1"),
  SMTP_PORT: z.coerce.number().int().positive().default(1025),
  MAIL_FROM: z.string().default("Threadline <no-reply@threadline.test>"),
  APP_URL: z.string().url().default("http://localhost:3000"),
  NODE_ENV: z.string().default("production"),
  // The ledger check splits a long ledger into seq ranges verified by worker threads side by side:
  // at most this many threads (default: the machine's cores, plus one to cover I/O waits) ...
  LEDGER_CHECK_THREADS: z.coerce.number().int().min(1).max(32).optional(),
  // ... each with at least this many entries (below two of them the check stays in one thread; the
  // tests set it low so that their small ledgers are split too).
  LEDGER_CHECK_MIN_SEGMENT: z.coerce.number().int().min(1).default(100_000),
});

export type ServerEnv = z.infer<typeof EnvSchema>;

let cached: ServerEnv | null = null;

export function serverEnv(): ServerEnv {
  cached ??= EnvSchema.parse(process.env);
  return cached;
}
