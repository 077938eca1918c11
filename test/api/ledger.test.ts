import { beforeAll, describe, expect, it } from "vitest";
import { rootSql } from "../../scripts/lib/mariadb";
import { http, signInAs, testDb, testEnv } from "../support/api";

let auditor: string;
beforeAll(async () => {
  auditor = await signInAs("auditor");
});

// The update trigger exactly as migrations/20261201000300_create-parts-and-ledger.ts creates it.
const UPDATE_TRIGGER = `CREATE TRIGGER ledger_entries_no_update BEFORE UPDATE ON ledger_entries FOR EACH ROW
    SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'ledger entries are append-only: record a correction entry instead'`;

const DELETE_TRIGGER = `CREATE TRIGGER ledger_entries_no_delete BEFORE DELETE ON ledger_entries FOR EACH ROW
    SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'ledger entries are append-only: they cannot be deleted'`;

/** As the database administrator: lift the update trigger, run one UPDATE, put the trigger back. */
async function updateBehindTheTriggers(update: string) {
  const db = testEnv().DB_NAME;
  await rootSql(testEnv().DB_ADMIN_SOCKET, `USE \`${db}\`; DROP TRIGGER IF EXISTS ledger_entries_no_update; ${update}; ${UPDATE_TRIGGER};`);
}

describe("the ledger is append-only in the database", () => {
  it("refuses a raw UPDATE and a raw DELETE from the app's own database user", async () => {
    const { seq } = await testDb()("ledger_entries").orderBy("seq").first("seq");
    await expect(testDb().raw("UPDATE ledger_entries SET reason = 'edited' WHERE seq = ?", [seq])).rejects.toThrow(/append-only: record a correction entry instead/);
    await expect(testDb().raw("DELETE FROM ledger_entries WHERE seq = ?", [seq])).rejects.toThrow(/append-only: they cannot be deleted/);
    const row = await testDb()("ledger_entries").where({ seq }).first("reason");
    expect(row).toBeDefined();
    expect(row.reason).not.toBe("edited");
  });
});

describe("GET /api/ledger/verify", () => {
  it("recomputes the whole chain: ok, the count of entries and the head hash", async () => {
    const response = await http().get("/api/ledger/verify").set("cookie", auditor);
    expect(response.status, response.text).toBe(200);
    const head = await testDb()("ledger_head").where({ id: 1 }).first("last_seq", "last_hash");
    expect(response.body).toMatchObject({ ok: true, entries: Number(head.last_seq), head: head.last_hash, headSeq: Number(head.last_seq) });
    expect(response.body.durationMs).toEqual(expect.any(Number));
  });

  it("is for auditors and administrators only", async () => {
    expect((await http().get("/api/ledger/verify").set("cookie", await signInAs("technician"))).status).toBe(403);
    expect((await http().get("/api/ledger/verify").set("cookie", await signInAs("admin"))).status).toBe(200);
    expect((await http().get("/api/ledger/verify")).status).toBe(401);
  });

  it("names exactly the seq of a row altered behind the triggers' back, and is intact again once it is restored", async () => {
    // A received entry has no reason, so restoring it is setting it back to NULL.
    const { seq } = await testDb()("ledger_entries").where({ kind: "received" }).whereNull("reason").orderBy("seq").offset(200).first("seq");
    try {
      await updateBehindTheTriggers(`UPDATE ledger_entries SET reason = 'quietly altered' WHERE seq = ${Number(seq)}`);
      expect((await testDb()("ledger_entries").where({ seq }).first("reason")).reason).toBe("quietly altered");
      const response = await http().get("/api/ledger/verify").set("cookie", auditor);
      expect(response.status).toBe(200);
      expect(response.body).toMatchObject({ ok: false, brokenAt: Number(seq), reason: "hash_mismatch", entries: Number(seq) - 1 });
      expect(response.body.message).toContain(`seq ${seq}`);
    } finally {
      await updateBehindTheTriggers(`UPDATE ledger_entries SET reason = NULL WHERE seq = ${Number(seq)}`);
    }
    expect((await http().get("/api/ledger/verify").set("cookie", auditor)).body.ok).toBe(true);
    // The trigger is back exactly as before.
    await expect(testDb().raw("UPDATE ledger_entries SET reason = 'edited' WHERE seq = ?", [seq])).rejects.toThrow(/append-only/);
  });
});

// The test server splits the ledger check into segments of at least 500 entries on 3 worker
// threads (test/support/global-setup.ts), so these cases cross segment boundaries.
describe("GET /api/ledger/verify across segments", () => {
  it("is split into segments, and the joined answer is the whole chain's", async () => {
    const response = await http().get("/api/ledger/verify").set("cookie", auditor);
    expect(response.body).toMatchObject({ ok: true, segments: 3 });
  });

  it("names an entry altered in the last segment with the count of every intact entry before it", async () => {
    const head = await testDb()("ledger_head").where({ id: 1 }).first("last_seq");
    const { seq } = await testDb()("ledger_entries").where({ kind: "received" }).whereNull("reason").where("seq", ">", Math.floor((Number(head.last_seq) * 2) / 3) + 1).orderBy("seq").first("seq");
    try {
      await updateBehindTheTriggers(`UPDATE ledger_entries SET reason = 'quietly altered' WHERE seq = ${Number(seq)}`);
      const response = await http().get("/api/ledger/verify").set("cookie", auditor);
      expect(response.body).toMatchObject({ ok: false, brokenAt: Number(seq), reason: "hash_mismatch", entries: Number(seq) - 1, segments: 3 });
    } finally {
      await updateBehindTheTriggers(`UPDATE ledger_entries SET reason = NULL WHERE seq = ${Number(seq)}`);
    }
    expect((await http().get("/api/ledger/verify").set("cookie", auditor)).body.ok).toBe(true);
  });

  it("names an entry of the middle segment deleted behind the triggers' back as a gap at its seq", async () => {
    const db = testEnv().DB_NAME;
    const head = await testDb()("ledger_head").where({ id: 1 }).first("last_seq");
    const third = Math.floor(Number(head.last_seq) / 3);
    // A receipt: no fitted row, swap or correction refers to it, so it can be deleted and put back.
    const { seq } = await testDb()("ledger_entries as e")
      .where("e.kind", "received")
      .whereBetween("e.seq", [third + 2, 2 * third - 1])
      .whereNotExists(testDb()("ledger_entries as c").whereRaw("c.corrects_seq = e.seq"))
      .orderBy("e.seq")
      .first("e.seq");
    const keep = `ledger_kept_${Number(seq)}`;
    await rootSql(testEnv().DB_ADMIN_SOCKET, `USE \`${db}\`; CREATE TABLE ${keep} AS SELECT * FROM ledger_entries WHERE seq = ${Number(seq)}; DROP TRIGGER IF EXISTS ledger_entries_no_delete; DELETE FROM ledger_entries WHERE seq = ${Number(seq)}; ${DELETE_TRIGGER};`);
    try {
      const response = await http().get("/api/ledger/verify").set("cookie", auditor);
      expect(response.body).toMatchObject({ ok: false, brokenAt: Number(seq), reason: "seq_gap", foundSeq: Number(seq) + 1, entries: Number(seq) - 1, segments: 3 });
    } finally {
      await rootSql(testEnv().DB_ADMIN_SOCKET, `USE \`${db}\`; INSERT INTO ledger_entries SELECT * FROM ${keep}; DROP TABLE ${keep};`);
    }
    expect((await http().get("/api/ledger/verify").set("cookie", auditor)).body.ok).toBe(true);
  });
});

describe("GET /api/ledger/entries/{seq}", () => {
  it("gives one entry's stored hash for checking a printed report, 404 past the head and 422 for a bad seq", async () => {
    const head = await testDb()("ledger_head").where({ id: 1 }).first("last_seq", "last_hash");
    const response = await http().get(`/api/ledger/entries/${head.last_seq}`).set("cookie", auditor);
    expect(response.status).toBe(200);
    expect(response.body.entry).toMatchObject({ seq: Number(head.last_seq), hash: head.last_hash });
    expect((await http().get(`/api/ledger/entries/${Number(head.last_seq) + 1000}`).set("cookie", auditor)).status).toBe(404);
    const bad = await http().get("/api/ledger/entries/first").set("cookie", auditor);
    expect(bad.status).toBe(422);
    expect(bad.body.error.fields).toHaveProperty("seq");
  });
});
