import { beforeAll, describe, expect, it } from "vitest";
import { http, signInAs, testDb } from "../support/api";

let reliability: string;
let technician: string;
beforeAll(async () => {
  reliability = await signInAs("reliability");
  technician = await signInAs("technician");
});

const hm = (minutes: number) => `${Math.floor(minutes / 60)}:${String(minutes % 60).padStart(2, "0")}`;

/** Removals counted straight from the ledger, for comparison with what the API says. */
async function countRemovals(where: (q: ReturnType<typeof base>) => void = () => {}) {
  const q = base();
  where(q);
  const [{ count }] = await q.count({ count: "*" });
  return Number(count);
}
function base() {
  return testDb()("ledger_entries as r")
    .join("parts as p", "p.id", "r.part_id")
    .join("part_numbers as pn", "pn.id", "p.part_number_id")
    .join("aircraft as a", "a.id", "r.aircraft_id")
    .join("stations as st", "st.id", "a.station_id")
    .join("positions as pos", "pos.id", "r.position_id")
    .where("r.kind", "removed");
}

describe("GET /api/removals", () => {
  it("refuses a technician (403) and a request without a session (401)", async () => {
    const forbidden = await http().get("/api/removals").set("cookie", technician);
    expect(forbidden.status).toBe(403);
    expect(forbidden.body.error.code).toBe("forbidden");
    expect((await http().get("/api/removals")).status).toBe(401);
  });

  it("pages every removal of the ledger, newest first, with the total and the unscheduled count", async () => {
    const response = await http().get("/api/removals").set("cookie", reliability);
    expect(response.status, response.text).toBe(200);
    expect(response.body.total).toBe(await countRemovals());
    expect(response.body.unscheduled).toBe(await countRemovals((q) => q.andWhere("r.removal_type", "unscheduled")));
    expect(response.body.removals).toHaveLength(50);
    const instants = response.body.removals.map((r: { removedAt: string }) => r.removedAt);
    expect([...instants].sort().reverse()).toEqual(instants);

    const second = await http().get("/api/removals?page=2").set("cookie", reliability);
    expect(second.body.page).toBe(2);
    expect(second.body.removals[0].seq).not.toBe(response.body.removals[0].seq);
  });

  it("gives each removal's time on wing, TSN/CSN and the unit fitted in its place as the ledger has them", async () => {
    const { body } = await http().get("/api/removals?partNumber=QF-3242-50&pageSize=5").set("cookie", reliability);
    expect(body.removals.length).toBeGreaterThan(0);
    for (const row of body.removals) {
      const removed = await testDb()("ledger_entries").where({ seq: row.seq }).first();
      const installed = await testDb()("ledger_entries").where({ part_id: removed.part_id, kind: "installed" }).andWhere("seq", "<", row.seq).orderBy("seq", "desc").first();
      expect(row.removedAt).toBe(new Date(removed.occurred_at).toISOString());
      expect(row.aircraftHours).toBe(hm(Number(removed.aircraft_minutes)));
      expect(row.hoursOnWing).toBe(hm(Number(removed.aircraft_minutes) - Number(installed.aircraft_minutes)));
      expect(row.cyclesOnWing).toBe(Number(removed.aircraft_cycles) - Number(installed.aircraft_cycles));
      expect(row.partTsn).toBe(hm(Number(removed.tsn_minutes)));
      expect(row.partCsn).toBe(Number(removed.csn));
      const swap = await testDb()("swaps").where({ removed_seq: row.seq }).first();
      const fittedInstead = await testDb()("ledger_entries as e").join("parts as p", "p.id", "e.part_id").where("e.seq", swap.installed_seq).first("p.serial_number");
      expect(row.installedSerialNumber).toBe(fittedInstead.serial_number);
      expect(row.recordedBy).toBe("Ines Marwood");
    }
  });

  it("filters by period, part number, station and removal type, and by ATA chapter, aircraft and type", async () => {
    const query = "from=2026-09-01&to=2026-11-30&partNumber=QF-3242-50&station=QSH&removalType=unscheduled&pageSize=200";
    const { body } = await http().get(`/api/removals?${query}`).set("cookie", reliability);
    const expected = await countRemovals((q) =>
      q
        .andWhere("r.occurred_at", ">=", new Date("2026-09-01T00:00:00Z"))
        .andWhere("r.occurred_at", "<", new Date("2026-12-01T00:00:00Z"))
        .andWhere({ "pn.part_number": "QF-3242-50", "st.code": "QSH", "r.removal_type": "unscheduled" }),
    );
    expect(expected).toBeGreaterThan(10);
    expect(body.total).toBe(expected);
    for (const row of body.removals) {
      expect(row).toMatchObject({ partNumber: "QF-3242-50", station: "QSH", removalType: "unscheduled" });
      expect(row.removedAt >= "2026-09-01" && row.removedAt < "2026-12-01").toBe(true);
    }

    const chapter = await http().get("/api/removals?ataChapter=32&registration=Q-FRBA&aircraftType=QL-40").set("cookie", reliability);
    expect(chapter.body.total).toBe(await countRemovals((q) => q.andWhere("pos.ata_chapter", "like", "32-%").andWhere("a.registration", "Q-FRBA")));
    expect(chapter.body.removals.every((r: { ataChapter: string; registration: string }) => r.ataChapter.startsWith("32-") && r.registration === "Q-FRBA")).toBe(true);
  });

  it("sorts on the server", async () => {
    const { body } = await http().get("/api/removals?sort=hoursOnWing&dir=desc&pageSize=20").set("cookie", reliability);
    const hours = body.removals.map((r: { hoursOnWing: string }) => Number(r.hoursOnWing.split(":")[0]) * 60 + Number(r.hoursOnWing.split(":")[1]));
    expect([...hours].sort((a, b) => b - a)).toEqual(hours);
    const byPn = await http().get("/api/removals?sort=partNumber&dir=asc&pageSize=20").set("cookie", reliability);
    const pns = byPn.body.removals.map((r: { partNumber: string }) => r.partNumber);
    expect([...pns].sort()).toEqual(pns);
  });

  it("answers 422 naming the field for a bad date, a reversed period or an unknown sort", async () => {
    const badDate = await http().get("/api/removals?from=2026-02-30").set("cookie", reliability);
    expect(badDate.status).toBe(422);
    expect(badDate.body.error.fields).toHaveProperty("from");
    expect(badDate.body.error.fields.from).toMatch(/YYYY-MM-DD/);
    const reversed = await http().get("/api/removals?from=2026-05-01&to=2026-04-01").set("cookie", reliability);
    expect(reversed.status).toBe(422);
    expect(reversed.body.error.fields).toHaveProperty("to");
    const sort = await http().get("/api/removals?sort=price").set("cookie", reliability);
    expect(sort.status).toBe(422);
    expect(sort.body.error.fields).toHaveProperty("sort");
  });
});

describe("the Removals page", () => {
  it("renders the first page on the server for the reliability engineer and is 403 for a technician", async () => {
    const page = await http().get("/removals?partNumber=QF-3242-50").set("cookie", reliability);
    expect(page.status).toBe(200);
    expect(page.text).toContain("QF-3242-50");
    expect(page.text).toMatch(/Showing/);
    const forbidden = await http().get("/removals").set("cookie", technician);
    expect(forbidden.status).toBe(403);
  });
});
