import { randomBytes } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { http, signInAs, testDb } from "../support/api";

// Positions are written only on an aircraft type this file creates (code QT-...), so the seeded
// layouts of QL-72 and QL-40 keep their 126 and 124 positions for the other suites.
const run = randomBytes(3).toString("hex").toUpperCase();
const TYPE = `QT-${run}`;

let admin: string;
let technician: string;

beforeAll(async () => {
  [admin, technician] = await Promise.all([signInAs("admin"), signInAs("technician")]);
  const created = await http().post("/api/layouts").set("cookie", admin).send({ code: TYPE, name: `Test type ${run}` });
  expect(created.status).toBe(201);
  const root = await addPosition({ code: "MLG-L-STRUT", label: "Main gear shock strut, left", ataChapter: "32-11", x: 560, y: 190, zone: "MLG-L" });
  expect(root.status).toBe(201);
});
afterAll(async () => {
  await testDb().destroy();
});

const addPosition = (body: Record<string, unknown>, cookie = admin) =>
  http().post(`/api/layouts/${TYPE}/positions`).set("cookie", cookie).send(body);
const patchPosition = (code: string, body: Record<string, unknown>, cookie = admin) =>
  http().patch(`/api/layouts/${TYPE}/positions/${code}`).set("cookie", cookie).send(body);
const brake = (code: string, extra: Record<string, unknown> = {}) => ({
  code,
  label: `Brake ${code}`,
  parentCode: "MLG-L-STRUT",
  ataChapter: "32-42",
  x: 540,
  y: 168,
  zone: "MLG-L",
  ...extra,
});

describe("GET /api/layouts and /api/layouts/{typeCode}", () => {
  it("lists the types with their position counts, for any signed-in role", async () => {
    const response = await http().get("/api/layouts").set("cookie", technician);
    expect(response.status).toBe(200);
    expect(response.body.types).toEqual(
      expect.arrayContaining([
        expect.objectContaining({ code: "QL-72", positionCount: 126 }),
        expect.objectContaining({ code: "QL-40", positionCount: 124 }),
      ]),
    );
  });

  it("returns a type's positions with cautions and eligible part numbers", async () => {
    const response = await http().get("/api/layouts/QL-72").set("cookie", technician);
    expect(response.status).toBe(200);
    expect(response.body.total).toBe(126);
    expect(response.body.positions).toHaveLength(126);
    const actuator = response.body.positions.find((p: { code: string }) => p.code === "B1-EBA1");
    expect(actuator).toMatchObject({ parentCode: "B1", ataChapter: "32-42", zone: "MLG-L" });
    expect(actuator.eligible.map((e: { partNumber: string }) => e.partNumber)).toEqual(["QF-3242-50", "QF-3242-51"]);
    expect(actuator.cautions.some((c: string) => /ground-lock pins/.test(c))).toBe(true);
    expect(response.body.zones).toEqual(expect.arrayContaining([{ zone: "MLG-L", count: expect.any(Number) }]));
  });

  it("filters by zone and ATA chapter, keeping the type's total", async () => {
    const zone = await http().get("/api/layouts/QL-40?zone=TAIL").set("cookie", technician);
    expect(zone.body.total).toBe(124);
    expect(zone.body.positions.length).toBeGreaterThan(0);
    expect(zone.body.positions.every((p: { zone: string }) => p.zone === "TAIL")).toBe(true);
    const ata = await http().get("/api/layouts/QL-40?ata=32-42").set("cookie", technician);
    expect(ata.body.positions.every((p: { ataChapter: string }) => p.ataChapter === "32-42")).toBe(true);
    const bad = await http().get("/api/layouts/QL-40?ata=brakes").set("cookie", technician);
    expect(bad.status).toBe(422);
    expect(bad.body.error.fields).toHaveProperty("ata");
  });

  it("answers 404 for an unknown type and 401 without a session", async () => {
    expect((await http().get("/api/layouts/QL-00").set("cookie", technician)).status).toBe(404);
    expect((await http().get("/api/layouts/QL-72")).status).toBe(401);
  });
});

describe("POST /api/layouts", () => {
  it("answers 409 for an existing type code and 403 for another role", async () => {
    const duplicate = await http().post("/api/layouts").set("cookie", admin).send({ code: "QL-72", name: "Again" });
    expect(duplicate.status).toBe(409);
    expect(duplicate.body.error.fields).toHaveProperty("code");
    expect((await http().post("/api/layouts").set("cookie", technician).send({ code: `QT-${run}X`, name: "No" })).status).toBe(403);
  });
});

describe("POST /api/layouts/{typeCode}/positions", () => {
  it("creates a position under a parent, with cautions and eligible part numbers", async () => {
    const response = await addPosition(
      brake("B1", {
        cautions: ["Install the ground-lock pins first.", "Let hot brakes cool."],
        requiresIndependentInspection: true,
        eligible: ["QF-3242-10", { partNumber: "QF-3242-12", cage: "Q4B22" }],
        x: 540.456,
      }),
    );
    expect(response.status).toBe(201);
    expect(response.body.position).toMatchObject({
      code: "B1",
      parentCode: "MLG-L-STRUT",
      x: 540.46,
      cautions: ["Install the ground-lock pins first.", "Let hot brakes cool."],
      requiresIndependentInspection: true,
    });
    expect(response.body.position.eligible.map((e: { partNumber: string }) => e.partNumber)).toEqual(["QF-3242-10", "QF-3242-12"]);
    const layout = await http().get(`/api/layouts/${TYPE}`).set("cookie", technician);
    expect(layout.body.positions.map((p: { code: string }) => p.code)).toEqual(["MLG-L-STRUT", "B1"]);
  });

  it("refuses bad fields with 422 naming each field, and writes nothing", async () => {
    const cases: Array<[Record<string, unknown>, string]> = [
      [{ parentCode: "NO-SUCH" }, "parentCode"],
      [{ parentCode: "BADCODE" }, "parentCode"],
      [{ x: 1000.5 }, "x"],
      [{ y: -1 }, "y"],
      [{ y: "middle" }, "y"],
      [{ ataChapter: "32" }, "ataChapter"],
      [{ label: " " }, "label"],
      [{ code: "B 9" }, "code"],
      [{ eligible: ["QT-NOT-IN-CATALOG"] }, "eligible.0.partNumber"],
      [{ cautions: ["fine", ""] }, "cautions.1"],
    ];
    for (const [change, field] of cases) {
      const response = await addPosition(brake("BADCODE", change));
      expect(response.status, JSON.stringify(change)).toBe(422);
      expect(response.body.error.fields, JSON.stringify(change)).toHaveProperty([field]);
    }
    const type = await testDb()("aircraft_types").where({ code: TYPE }).first();
    expect(await testDb()("positions").where({ aircraft_type_id: type.id, code: "BADCODE" }).first()).toBeUndefined();
  });

  it("answers 409 for a code the type already has, 404 for an unknown type, 403 for another role", async () => {
    const duplicate = await addPosition(brake("MLG-L-STRUT", { parentCode: null }));
    expect(duplicate.status).toBe(409);
    expect(duplicate.body.error.code).toBe("duplicate_position");
    expect(duplicate.body.error.fields).toHaveProperty("code");
    expect((await http().post("/api/layouts/QL-00/positions").set("cookie", admin).send(brake("B7"))).status).toBe(404);
    expect((await addPosition(brake("B8"), technician)).status).toBe(403);
  });
});

describe("PATCH /api/layouts/{typeCode}/positions/{code}", () => {
  it("changes label, coordinates, cautions and eligibility", async () => {
    await addPosition(brake("B2", { eligible: ["QF-3242-10"] }));
    const response = await patchPosition("B2", {
      label: "Brake 2, inboard",
      x: 0,
      y: 600,
      cautions: ["Depressurise the brake system first."],
      eligible: ["QF-3242-12"],
      zone: null,
    });
    expect(response.status).toBe(200);
    expect(response.body.position).toMatchObject({ label: "Brake 2, inboard", x: 0, y: 600, zone: null, cautions: ["Depressurise the brake system first."] });
    expect(response.body.position.eligible.map((e: { partNumber: string }) => e.partNumber)).toEqual(["QF-3242-12"]);
  });

  it("refuses a changed code, a parent loop and bad coordinates with 422", async () => {
    await addPosition(brake("B3"));
    await addPosition(brake("B3-EBA1", { parentCode: "B3" }));
    const renamed = await patchPosition("B3", { code: "B4" });
    expect(renamed.status).toBe(422);
    expect(renamed.body.error.fields).toHaveProperty("code");
    expect((await patchPosition("B3", { code: "B3", label: "Brake 3" })).status).toBe(200);
    const loop = await patchPosition("B3", { parentCode: "B3-EBA1" });
    expect(loop.status).toBe(422);
    expect(loop.body.error.fields.parentCode).toMatch(/sits under B3/);
    const self = await patchPosition("B3", { parentCode: "B3" });
    expect(self.status).toBe(422);
    const far = await patchPosition("B3", { x: 2000 });
    expect(far.status).toBe(422);
    expect(far.body.error.fields).toHaveProperty("x");
    const stored = await http().get(`/api/layouts/${TYPE}/positions/B3`).set("cookie", technician);
    expect(stored.body.position).toMatchObject({ parentCode: "MLG-L-STRUT", x: 540, label: "Brake 3" });
  });

  it("answers 404 for an unknown position or type, 403 for another role", async () => {
    expect((await patchPosition("NOPE", { label: "x" })).status).toBe(404);
    expect((await http().patch("/api/layouts/QL-00/positions/B1").set("cookie", admin).send({ label: "x" })).status).toBe(404);
    expect((await http().get(`/api/layouts/${TYPE}/positions/NOPE`).set("cookie", admin)).status).toBe(404);
    const forbidden = await patchPosition("B1", { label: "Not yours" }, technician);
    expect(forbidden.status).toBe(403);
  });

  it("refuses to drop the part number of a unit fitted at the position (409) and changes nothing", async () => {
    const fitted = await testDb()("fitted as f")
      .join("positions as p", "p.id", "f.position_id")
      .join("aircraft_types as t", "t.id", "p.aircraft_type_id")
      .first("t.code as typeCode", "p.code", "p.id");
    expect(fitted, "the demo seed fits units").toBeDefined();
    const before = await testDb()("position_eligibility").where({ position_id: fitted.id }).pluck("part_number_id");
    const response = await http()
      .patch(`/api/layouts/${fitted.typeCode}/positions/${fitted.code}`)
      .set("cookie", admin)
      .send({ eligible: [] });
    expect(response.status).toBe(409);
    expect(response.body.error.code).toBe("fitted_not_eligible");
    expect(response.body.error.fields).toHaveProperty("eligible");
    expect(await testDb()("position_eligibility").where({ position_id: fitted.id }).pluck("part_number_id")).toEqual(before);
  });
});
