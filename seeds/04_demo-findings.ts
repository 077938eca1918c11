import type { Knex } from "knex";
import { runServerScript } from "./lib/server-script";

export { DEMO_FINDING_PART_NUMBER } from "./lib/demo-finding";

// A deliberate demo finding for auditors: a unit booked in with lower times than its own record and
// then fitted on an aircraft, so the trace and the position map show a time regression. See
// seeds/replay/demo-finding.ts; it runs in a child process to use the app's swap recording.
export async function seed(knex: Knex): Promise<void> {
  await runServerScript(knex, "seeds/replay/demo-finding.ts");
}
