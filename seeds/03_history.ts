import type { Knex } from "knex";
import { uploadAll } from "./lib/certificates";
import { DEMO_USERS } from "./lib/demo";
import { simulateHistory } from "./lib/history";
import { historyCertificates } from "./lib/history-certificates";
import { runServerScript } from "./lib/server-script";

const userId = (role: string) => DEMO_USERS.find((u) => u.role === role)!.id;

// Two years of the invented fleet (seeds/lib/history.ts), recorded through the app's own swap
// recording and ledger append by seeds/replay/history.ts in a child process. Meanwhile this
// process stores the history's release certificates in the object store.
export async function seed(knex: Knex): Promise<void> {
  const started = Date.now();
  const replay = runServerScript(knex, "seeds/replay/history.ts");
  const { events } = simulateHistory({ technician: userId("technician"), inspector: userId("inspector"), stores: userId("stores") });
  const certificates = [...historyCertificates(events).values()];
  const uploads = uploadAll(certificates.map((c) => ({ key: c.key, body: c.body }))).then(() => {
    if (process.env.SEED_TIMING) console.log(`[seed 03] uploaded ${certificates.length} certificates in ${Date.now() - started} ms`);
  });
  // Both run to the end before a failure is reported, so nothing is left writing behind the seed.
  const failed = (await Promise.allSettled([replay, uploads])).find((r) => r.status === "rejected");
  if (failed) throw failed.reason;
  if (process.env.SEED_TIMING) console.log(`[seed 03] done in ${Date.now() - started} ms`);
}
