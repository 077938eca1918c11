import Papa from "papaparse";
import { beforeAll, describe, expect, it } from "vitest";
import { http, signInAs, testDb } from "../support/api";

const HEADER =
  "registration,aircraft_type,position_code,ata_chapter,part_number,cage,serial_number,removed_at,removal_type,reason,work_order,aircraft_hours,aircraft_cycles,hours_on_wing,cycles_on_wing,part_tsn,part_csn,installed_part_number,installed_serial_number,recorded_by";

let reliability: string;
let auditor: string;
let technician: string;
beforeAll(async () => {
  [reliability, auditor, technician] = await Promise.all([signInAs("reliability"), signInAs("auditor"), signInAs("technician")]);
});

const hm = (minutes: number) => `${Math.floor(minutes / 60)}:${String(minutes % 60).padStart(2, "0")}`;

async function download(cookie: string, query: string) {
  const response = await http()
    .get(`/api/exports/removals.csv${query}`)
    .set("cookie", cookie)
    .buffer(true)
    .parse((res, callback) => {
      const chunks: Buffer[] = [];
      res.on("data", (chunk: Buffer) => chunks.push(chunk));
      res.on("end", () => callback(null, Buffer.concat(chunks).toString("utf8")));
    });
  return { response, text: response.body as string };
}

function rowsOf(text: string): Array<Record<string, string>> {
  const parsed = Papa.parse<Record<string, string>>(text, { header: true, skipEmptyLines: true });
  expect(parsed.errors).toEqual([]);
  return parsed.data;
}

describe("GET /api/exports/removals.csv", () => {
  it("streams one row per removal of a seeded period under the contract's header, values equal to the ledger", async () => {
    const { response, text } = await download(reliability, "?from=2025-01-01&to=2025-12-31");
    expect(response.status).toBe(200);
    expect(response.headers["content-type"]).toBe("text/csv; charset=utf-8");
    expect(response.headers["content-disposition"]).toMatch(/attachment; filename="removals-2025-01-01-to-2025-12-31\.csv"/);
    expect(text.split("\r\n")[0]).toBe(HEADER);

    const rows = rowsOf(text);
    const ledger = await testDb()("ledger_entries as r")
      .join("aircraft as a", "a.id", "r.aircraft_id")
      .join("parts as p", "p.id", "r.part_id")
      .join("part_numbers as pn", "pn.id", "p.part_number_id")
      .join("users as u", "u.id", "r.recorded_by")
      .leftJoin("swaps as s", "s.removed_seq", "r.seq")
      .leftJoin("ledger_entries as i", "i.seq", "s.installed_seq")
      .leftJoin("parts as ip", "ip.id", "i.part_id")
      .where("r.kind", "removed")
      .andWhere("r.occurred_at", ">=", new Date("2025-01-01T00:00:00Z"))
      .andWhere("r.occurred_at", "<", new Date("2026-01-01T00:00:00Z"))
      .orderBy("r.seq")
      .select("r.*", "a.registration", "pn.part_number", "pn.cage", "p.serial_number", "u.name as recorded_by_name", "ip.serial_number as installed_serial");
    expect(ledger.length).toBeGreaterThan(300);
    expect(rows).toHaveLength(ledger.length);

    // Every row in ledger order; a spread of rows compared field by field.
    expect(rows.map((r) => r.serial_number)).toEqual(ledger.map((l) => l.serial_number));
    for (const index of [0, 1, Math.floor(ledger.length / 3), Math.floor(ledger.length / 2), ledger.length - 1]) {
      const row = rows[index];
      const entry = ledger[index];
      expect(row).toMatchObject({
        registration: entry.registration,
        part_number: entry.part_number,
        cage: entry.cage,
        serial_number: entry.serial_number,
        removed_at: new Date(entry.occurred_at).toISOString(),
        removal_type: entry.removal_type,
        reason: entry.reason ?? "",
        work_order: entry.work_order ?? "",
        aircraft_hours: hm(Number(entry.aircraft_minutes)),
        aircraft_cycles: String(entry.aircraft_cycles),
        part_tsn: hm(Number(entry.tsn_minutes)),
        part_csn: String(entry.csn),
        installed_serial_number: entry.installed_serial ?? "",
        recorded_by: entry.recorded_by_name,
      });
      expect(row.removed_at).toMatch(/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2}\.\d{3}Z$/);
      expect(row.hours_on_wing).toMatch(/^\d+:[0-5]\d$/);
    }
  });

  it("exports the whole ledger's removals without filters, and applies the same filters as the report", async () => {
    const all = rowsOf((await download(auditor, "")).text);
    const [{ count }] = await testDb()("ledger_entries").where({ kind: "removed" }).count({ count: "*" });
    expect(all).toHaveLength(Number(count));

    const query = "?partNumber=QF-3242-50&removalType=unscheduled&station=QSH&from=2026-09-01&to=2026-11-30";
    const filtered = rowsOf((await download(reliability, query)).text);
    const report = await http().get(`/api/removals${query}`).set("cookie", reliability);
    expect(filtered).toHaveLength(report.body.total);
    expect(filtered.length).toBeGreaterThan(10);
    expect(filtered.every((r) => r.part_number === "QF-3242-50" && r.removal_type === "unscheduled" && r.removed_at >= "2026-09-01")).toBe(true);
  });

  it("answers 422 naming the field for a bad date, and 403 for a technician", async () => {
    const bad = await http().get("/api/exports/removals.csv?from=yesterday").set("cookie", reliability);
    expect(bad.status).toBe(422);
    expect(bad.body.error.fields).toHaveProperty("from");
    const badTo = await http().get("/api/exports/removals.csv?to=2026-11-31").set("cookie", reliability);
    expect(badTo.status).toBe(422);
    expect(badTo.body.error.fields).toHaveProperty("to");
    const forbidden = await http().get("/api/exports/removals.csv").set("cookie", technician);
    expect(forbidden.status).toBe(403);
    expect(forbidden.headers["content-type"]).toMatch(/json/);
  });
});
