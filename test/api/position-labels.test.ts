// Position labels (Threadline's own TLPOS1 syntax): the PNG route and the print sheet, read back
// with the camera scanner's decoder. Aircraft and positions are the invented demo fleet.
import { beforeAll, describe, expect, it } from "vitest";
import { parsePositionLabel } from "../../src/domain/labels";
import { http, signInAs, testDb } from "../support/api";
import { decodeSymbol } from "../domain/label-print-decoder";
import { binaryParser } from "./receipts-fixtures";

let technician: string;
beforeAll(async () => {
  technician = await signInAs("technician");
});

const pngOf = (path: string, query: Record<string, string> = {}) => http().get(path).query(query).set("cookie", technician).buffer(true).parse(binaryParser);

describe("GET /api/aircraft/{registration}/positions/{code}/label.png", () => {
  it("renders each symbol as a PNG that decodes to the position label text", async () => {
    for (const symbol of ["datamatrix", "code128"] as const) {
      const response = await pngOf("/api/aircraft/Q-FRBB/positions/B3-EBA2/label.png", { symbol });
      expect(response.status, symbol).toBe(200);
      expect(response.headers["content-type"]).toBe("image/png");
      const text = decodeSymbol(response.body as Buffer, symbol);
      expect(text).toBe("TLPOS1 Q-FRBB B3-EBA2");
      expect(parsePositionLabel(text)).toMatchObject({ ok: true, registration: "Q-FRBB", positionCode: "B3-EBA2" });
    }
    // Lower case in the address is the same position.
    expect((await pngOf("/api/aircraft/q-frbb/positions/b3-eba2/label.png")).status).toBe(200);
  });

  it("refuses what is not a position of the aircraft, naming the field", async () => {
    const get = (path: string, query: Record<string, string> = {}) => http().get(path).query(query).set("cookie", technician);
    const unknown = await get("/api/aircraft/Q-FRBB/positions/B9-EBA9/label.png");
    expect(unknown.status).toBe(404);
    expect(unknown.body.error.message).toMatch(/Position B9-EBA9 of Q-FRBB/);
    const bad = await get("/api/aircraft/Q-FRBB/positions/B3_EBA2/label.png");
    expect(bad.status).toBe(422);
    expect(bad.body.error.fields).toHaveProperty("code");
    expect((await get("/api/aircraft/Q-NONE/positions/B3-EBA2/label.png")).status).toBe(404);
    expect((await get("/api/aircraft/Q-FRBB/positions/B3-EBA2/label.png", { symbol: "qr" })).status).toBe(422);
    expect((await http().get("/api/aircraft/Q-FRBB/positions/B3-EBA2/label.png")).status).toBe(401);
  });

  it("answers an address with no position segment (e.g. after a '.' resolved away) with a JSON 404", async () => {
    const response = await http().get("/api/aircraft/Q-FRBB/positions/label.png").set("cookie", technician);
    expect(response.status).toBe(404);
    expect(response.body.error).toMatchObject({ code: "no_such_route", message: "There is no API route GET /api/aircraft/Q-FRBB/positions/label.png." });
  });
});

describe("the position label print sheet", () => {
  async function positionsOfZone(zone: string) {
    return testDb()("positions as p")
      .join("aircraft as a", "a.aircraft_type_id", "p.aircraft_type_id")
      .where({ "a.registration": "Q-FRBB", "p.zone": zone })
      .pluck("p.code");
  }

  it("renders one label per position of the zone, each with its text, Data Matrix and Code 128", async () => {
    const zone = (await testDb()("positions as p").join("aircraft as a", "a.aircraft_type_id", "p.aircraft_type_id").where("a.registration", "Q-FRBB").where("p.code", "B3-EBA2").first("p.zone")).zone as string;
    const codes = await positionsOfZone(zone);
    const response = await http().get("/aircraft/Q-FRBB/position-labels").query({ zone }).set("cookie", technician);
    expect(response.status).toBe(200);
    const html = response.text;
    const labelled = [...html.matchAll(/data-position-code="([^"]+)"/g)].map((m) => m[1]);
    expect(labelled.sort()).toEqual([...codes].sort());
    expect(html).toContain("TLPOS1 Q-FRBB B3-EBA2");
    expect(html.match(/data-symbol="datamatrix"[^>]*><svg/g)?.length).toBe(codes.length);
    expect(html.match(/data-symbol="code128"/g)?.length).toBe(codes.length);
  });

  it("renders a single position's label, and says so when the position is unknown", async () => {
    const one = await http().get("/aircraft/Q-FRBB/position-labels").query({ position: "b3-eba2", layout: "label" }).set("cookie", technician);
    expect([...one.text.matchAll(/data-position-code="([^"]+)"/g)].map((m) => m[1])).toEqual(["B3-EBA2"]);
    const none = await http().get("/aircraft/Q-FRBB/position-labels").query({ position: "B9-EBA9" }).set("cookie", technician);
    expect(none.status).toBe(200);
    expect(none.text).toContain("Q-FRBB has no position B9-EBA9");
    expect(none.text).not.toContain("data-position-code=");
    expect((await http().get("/aircraft/Q-NONE/position-labels").set("cookie", technician)).status).toBe(404);
  });
});
