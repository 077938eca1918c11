// The demo history is recorded through the app's own swap recording (seeds/replay/history.ts).
import { describe, expect, it } from "vitest";
import { WITHDRAWN_MAIL_REASON } from "../../seeds/replay/support";
import { testDb } from "../support/api";

describe("the seeded demo history", () => {
  it("went through the swap recording: every demo swap has its request digest and stored answer", async () => {
    const swaps = await testDb()("swaps").where("idempotency_key", "like", "demo-%").select("request_hash", "response", "removed_seq", "installed_seq");
    expect(swaps.length).toBeGreaterThan(500);
    expect(swaps.filter((s) => !/^[0-9a-f]{64}$/.test(s.request_hash) || /^0+$/.test(s.request_hash))).toEqual([]);
    const answers = swaps.map((s) => JSON.parse(s.response));
    expect(answers.every((a, i) => a.entries.map((e: { seq: number }) => e.seq).join() === [swaps[i].removed_seq, swaps[i].installed_seq].join())).toBe(true);
  });

  it("keeps the mail its swaps queued in the outbox, withdrawn and never sent", async () => {
    const rows = await testDb()("mail_outbox").where({ last_error: WITHDRAWN_MAIL_REASON }).select("subject", "sent_at", "attempts");
    expect(rows.length).toBeGreaterThan(100);
    expect(rows.every((r) => r.subject.startsWith("Unscheduled removal:"))).toBe(true);
    // The outbox sends only rows with attempts left; these have none and were never sent.
    expect(rows.filter((r) => r.sent_at !== null || r.attempts < 10)).toEqual([]);
  });
});
