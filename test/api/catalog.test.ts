import { randomBytes } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { http, signInAs, testDb } from "../support/api";

// Every part number this file creates is invented and unique to the run (prefix QT-), so the seeded
// catalog (QF-...) that other suites rely on stays as it is.
const run = randomBytes(3).toString("hex").toUpperCase();
const pn = (name: string) => `QT-${run}-${name}`;
const CAGE = "QT001";

let admin: string;
let technician: string;
let stores: string;

beforeAll(async () => {
  [admin, technician, stores] = await Promise.all([signInAs("admin"), signInAs("technician"), signInAs("stores")]);
});
afterAll(async () => {
  await testDb().destroy();
});

const create = (body: Record<string, unknown>, cookie = admin) => http().post("/api/part-numbers").set("cookie", cookie).send(body);
const newPart = (name: string, extra: Record<string, unknown> = {}) => ({
  partNumber: pn(name),
  cage: CAGE,
  description: `Test unit ${name}`,
  ataChapter: "29-11",
  ...extra,
});
const find = async (partNumber: string) => {
  const response = await http().get(`/api/part-numbers?q=${encodeURIComponent(partNumber)}`).set("cookie", admin);
  return response.body.partNumbers.find((p: { partNumber: string }) => p.partNumber === partNumber);
};

describe("GET /api/part-numbers", () => {
  it("lets any signed-in role search the catalog, with alternates both ways", async () => {
    const response = await http().get("/api/part-numbers?q=QF-3242-50").set("cookie", technician);
    expect(response.status).toBe(200);
    const actuator = response.body.partNumbers.find((p: { partNumber: string }) => p.partNumber === "QF-3242-50");
    expect(actuator).toMatchObject({ cage: "Q4B22", ataChapter: "32-42", serialised: true });
    expect(actuator.alternates).toEqual([expect.objectContaining({ partNumber: "QF-3242-51", direction: "two-way" })]);

    // Seeded one-way link: the improved brake may replace the original, not the reverse.
    const brake = await find("QF-3242-10");
    expect(brake.alternates).toEqual([expect.objectContaining({ partNumber: "QF-3242-12", direction: "one-way" })]);
    expect(brake.replaces).toEqual([]);
    const improved = await find("QF-3242-12");
    expect(improved.alternates).toEqual([]);
    expect(improved.replaces).toEqual([expect.objectContaining({ partNumber: "QF-3242-10", direction: "one-way" })]);
  });

  it("searches descriptions and filters by chapter or chapter-section, with a total", async () => {
    const section = await http().get("/api/part-numbers?ata=32-42&limit=500").set("cookie", stores);
    expect(section.status).toBe(200);
    expect(section.body.total).toBe(section.body.partNumbers.length);
    expect(section.body.total).toBeGreaterThanOrEqual(6);
    expect(section.body.partNumbers.every((p: { ataChapter: string }) => p.ataChapter.startsWith("32-42"))).toBe(true);

    const chapter = await http().get("/api/part-numbers?ata=32&limit=500").set("cookie", stores);
    expect(chapter.body.total).toBeGreaterThan(section.body.total);
    expect(chapter.body.partNumbers.every((p: { ataChapter: string }) => p.ataChapter.startsWith("32-"))).toBe(true);

    const byText = await http().get("/api/part-numbers?q=retraction actuator").set("cookie", stores);
    expect(byText.body.partNumbers.map((p: { partNumber: string }) => p.partNumber).sort()).toEqual(["QF-3231-10", "QF-3231-20"]);
    // LIKE wildcards typed by a user are literal characters, not patterns.
    const wildcard = await http().get("/api/part-numbers?q=%25").set("cookie", stores);
    expect(wildcard.body.total).toBe(0);
  });

  it("answers 422 naming the field for a malformed filter, and 401 without a session", async () => {
    const bad = await http().get("/api/part-numbers?ata=32-4").set("cookie", technician);
    expect(bad.status).toBe(422);
    expect(bad.body.error.fields).toHaveProperty("ata");
    const sorted = await http().get("/api/part-numbers?sort=price").set("cookie", technician);
    expect(sorted.status).toBe(422);
    expect(sorted.body.error.fields).toHaveProperty("sort");
    expect((await http().get("/api/part-numbers")).status).toBe(401);
  });

  it("returns one part number by id, 404 for an unknown one", async () => {
    const listed = await find("QF-3242-50");
    const one = await http().get(`/api/part-numbers/${listed.id}`).set("cookie", technician);
    expect(one.status).toBe(200);
    expect(one.body.partNumber.partNumber).toBe("QF-3242-50");
    expect((await http().get("/api/part-numbers/99999999").set("cookie", technician)).status).toBe(404);
    expect((await http().get("/api/part-numbers/not-an-id").set("cookie", technician)).status).toBe(404);
  });
});

describe("POST /api/part-numbers", () => {
  it("creates a part number, taking hours as H:MM or decimal hours and answering H:MM", async () => {
    const response = await create(
      newPart("PUMP", { partNumber: pn("pump").toLowerCase(), cage: "qt001", lifeLimitHours: "30000:00", overhaulHours: 12000.5, lifeLimitCycles: 20000 }),
    );
    expect(response.status).toBe(201);
    expect(response.body.partNumber).toMatchObject({
      partNumber: pn("PUMP"),
      cage: CAGE,
      serialised: true,
      lifeLimitHours: "30000:00",
      overhaulHours: "12000:30",
      lifeLimitCycles: 20000,
      lifeLimitDays: null,
      overhaulCycles: null,
      alternates: [],
    });
    const row = await testDb()("part_numbers").where({ id: response.body.partNumber.id }).first();
    expect(row.life_limit_minutes).toBe(1_800_000);
    expect(row.overhaul_interval_minutes).toBe(720_030);
  });

  it("refuses bad fields with 422 naming each field, and writes nothing", async () => {
    const cases: Array<[Record<string, unknown>, string]> = [
      [{ ataChapter: "32-4" }, "ataChapter"],
      [{ ataChapter: "3242" }, "ataChapter"],
      [{ cage: "Q4" }, "cage"],
      [{ description: "" }, "description"],
      [{ partNumber: "QT BAD SPACE" }, "partNumber"],
      [{ lifeLimitHours: "12:75" }, "lifeLimitHours"],
      [{ lifeLimitHours: "lots" }, "lifeLimitHours"],
      [{ overhaulHours: 0 }, "overhaulHours"],
      [{ lifeLimitCycles: 2.5 }, "lifeLimitCycles"],
      [{ lifeLimitDays: -1 }, "lifeLimitDays"],
      [{ serialised: false, lifeLimitCycles: 100 }, "serialised"],
      [{ alternates: [{ partNumber: "QF-3242-51", direction: "sideways" }] }, "alternates.0.direction"],
    ];
    for (const [change, field] of cases) {
      const response = await create(newPart("BAD", change));
      expect(response.status, JSON.stringify(change)).toBe(422);
      expect(response.body.error.fields, JSON.stringify(change)).toHaveProperty([field]);
    }
    expect(await testDb()("part_numbers").where({ part_number: pn("BAD") }).first()).toBeUndefined();
  });

  it("refuses an unknown alternate with 422 and writes nothing", async () => {
    const response = await create(newPart("ORPHAN", { alternates: [{ partNumber: pn("NOWHERE"), direction: "one-way" }] }));
    expect(response.status).toBe(422);
    expect(response.body.error.fields["alternates.0.partNumber"]).toMatch(/not in the catalog/);
    expect(await testDb()("part_numbers").where({ part_number: pn("ORPHAN") }).first()).toBeUndefined();
  });

  it("answers 409 naming the part number when the P/N and CAGE exist", async () => {
    const response = await create({ partNumber: "QF-3242-50", cage: "Q4B22", description: "Copy", ataChapter: "32-42" });
    expect(response.status).toBe(409);
    expect(response.body.error.code).toBe("duplicate_part_number");
    expect(response.body.error.message).toContain("QF-3242-50");
    expect(response.body.error.fields).toHaveProperty("partNumber");
  });

  it("answers 400 for a body that is not JSON", async () => {
    const response = await http().post("/api/part-numbers").set("cookie", admin).set("content-type", "application/json").send("{oops");
    expect(response.status).toBe(400);
  });

  it("is for the admin only", async () => {
    for (const cookie of [technician, stores]) {
      const response = await create(newPart("NOTMINE"), cookie);
      expect(response.status).toBe(403);
    }
    expect(await testDb()("part_numbers").where({ part_number: pn("NOTMINE") }).first()).toBeUndefined();
  });
});

describe("PATCH /api/part-numbers/{id}", () => {
  it("changes fields and clears a limit with null", async () => {
    const created = (await create(newPart("EDIT", { lifeLimitCycles: 5000, lifeLimitDays: 365 }))).body.partNumber;
    const response = await http()
      .patch(`/api/part-numbers/${created.id}`)
      .set("cookie", admin)
      .send({ description: "Edited description", lifeLimitCycles: null, lifeLimitHours: "250:15" });
    expect(response.status).toBe(200);
    expect(response.body.partNumber).toMatchObject({
      description: "Edited description",
      lifeLimitCycles: null,
      lifeLimitDays: 365,
      lifeLimitHours: "250:15",
    });
  });

  it("answers 404 for an unknown id, 422 for a bad field, 403 for another role", async () => {
    expect((await http().patch("/api/part-numbers/99999999").set("cookie", admin).send({ description: "x" })).status).toBe(404);
    const created = (await create(newPart("PATCHCHECK"))).body.partNumber;
    const bad = await http().patch(`/api/part-numbers/${created.id}`).set("cookie", admin).send({ ataChapter: "ATA 32" });
    expect(bad.status).toBe(422);
    expect(bad.body.error.fields).toHaveProperty("ataChapter");
    const limitOnNonSerialised = await http()
      .patch(`/api/part-numbers/${created.id}`)
      .set("cookie", admin)
      .send({ serialised: false, overhaulCycles: 900 });
    expect(limitOnNonSerialised.status).toBe(422);
    expect(limitOnNonSerialised.body.error.fields).toHaveProperty("serialised");
    const forbidden = await http().patch(`/api/part-numbers/${created.id}`).set("cookie", technician).send({ description: "x" });
    expect(forbidden.status).toBe(403);
    const row = await testDb()("part_numbers").where({ id: created.id }).first();
    expect(row).toMatchObject({ description: "Test unit PATCHCHECK", ata_chapter: "29-11", overhaul_interval_cycles: null });
  });

  it("answers 409 when the change would duplicate another part number", async () => {
    const first = (await create(newPart("DUPA"))).body.partNumber;
    const response = await http().patch(`/api/part-numbers/${first.id}`).set("cookie", admin).send({ partNumber: "QF-3242-50", cage: "Q4B22" });
    expect(response.status).toBe(409);
    expect(response.body.error.message).toContain("QF-3242-50");
    expect((await testDb()("part_numbers").where({ id: first.id }).first()).part_number).toBe(pn("DUPA"));
  });

  it("keeps a part number with units on record serialised (409), and changes nothing", async () => {
    const actuator = await find("QF-3242-50");
    const response = await http().patch(`/api/part-numbers/${actuator.id}`).set("cookie", admin).send({ serialised: false, description: "x" });
    expect(response.status).toBe(409);
    expect(response.body.error.code).toBe("units_on_record");
    expect(await find("QF-3242-50")).toMatchObject({ serialised: true, description: actuator.description });
  });

  it("replaces the alternates: listed ones as given, an unlisted two-way keeps only the reverse direction", async () => {
    const [a, b, c] = await Promise.all(["ALTA", "ALTB", "ALTC"].map(async (name) => (await create(newPart(name))).body.partNumber));
    const set = await http()
      .patch(`/api/part-numbers/${a.id}`)
      .set("cookie", admin)
      .send({ alternates: [{ partNumber: b.partNumber, direction: "two-way" }, { partNumber: c.partNumber, cage: CAGE, direction: "one-way" }] });
    expect(set.status).toBe(200);
    expect(set.body.partNumber.alternates.map((x: { partNumber: string; direction: string }) => [x.partNumber, x.direction])).toEqual([
      [b.partNumber, "two-way"],
      [c.partNumber, "one-way"],
    ]);
    expect(set.body.partNumber.replaces.map((x: { partNumber: string }) => x.partNumber)).toEqual([b.partNumber]);
    expect((await find(c.partNumber)).replaces.map((x: { partNumber: string }) => x.partNumber)).toEqual([a.partNumber]);
    expect((await find(c.partNumber)).alternates).toEqual([]);

    const cleared = await http().patch(`/api/part-numbers/${a.id}`).set("cookie", admin).send({ alternates: [] });
    expect(cleared.body.partNumber.alternates).toEqual([]);
    // B may no longer replace A, but nothing was said about A replacing B.
    expect(cleared.body.partNumber.replaces).toEqual([expect.objectContaining({ partNumber: b.partNumber, direction: "one-way" })]);
    expect((await find(c.partNumber)).replaces).toEqual([]);

    const self = await http().patch(`/api/part-numbers/${a.id}`).set("cookie", admin).send({ alternates: [{ partNumber: a.partNumber, direction: "one-way" }] });
    expect(self.status).toBe(422);
    expect(self.body.error.fields).toHaveProperty(["alternates.0.partNumber"]);
  });
});

describe("POST /api/part-numbers/import", () => {
  const row = (name: string, extra: Record<string, unknown> = {}) => ({
    part_number: pn(name),
    cage: CAGE,
    description: `Imported ${name}`,
    ata_chapter: "36-11",
    ...extra,
  });

  it("keeps the good rows, reports the bad ones by row and field, and writes nothing for them", async () => {
    // An alternate already in the catalog: our own, so no seeded part number gains a link.
    expect((await create(newPart("IMPBASE"))).status).toBe(201);
    const rows = [
      row("IMPA", { row: 2, life_limit_hours: "1200:30", life_limit_cycles: "20,000", alternates: `${pn("IMPB")}:two-way;${pn("IMPBASE")}:one-way` }),
      row("IMPB", { row: 3, serialised: "yes", overhaul_hours: "850.25" }),
      row("IMPBADATA", { row: 4, ata_chapter: "36" }),
      { row: 5, part_number: "QF-3242-50", cage: "Q4B22", description: "Already there", ata_chapter: "32-42" },
      row("IMPUNKNOWN", { row: 6, alternates: `${pn("NOSUCH")}:one-way` }),
      row("IMPCASCADE", { row: 7, alternates: `${pn("IMPBADATA")}:two-way` }),
      row("IMPA", { row: 8 }),
      row("IMPNONSER", { row: 9, serialised: "no", life_limit_days: "30" }),
      row("IMPHOURS", { row: 10, life_limit_hours: "10:75" }),
      row("IMPSYNTAX", { row: 11, alternates: `${pn("IMPB")}` }),
      row("IMPEXTRA", { row: 12, colour: "blue" }),
    ];
    const response = await http().post("/api/part-numbers/import").set("cookie", admin).send({ rows });
    expect(response.status).toBe(200);
    expect(response.body.accepted).toBe(2);
    const byRow = Object.fromEntries(response.body.rejected.map((r: { row: number; field: string; message: string }) => [r.row, r]));
    expect(Object.keys(byRow).map(Number).sort((x, y) => x - y)).toEqual([4, 5, 6, 7, 8, 9, 10, 11, 12]);
    expect(byRow[4].field).toBe("ata_chapter");
    expect(byRow[5]).toMatchObject({ field: "part_number", message: expect.stringMatching(/QF-3242-50.*already in the catalog/) });
    expect(byRow[6]).toMatchObject({ field: "alternates", message: expect.stringMatching(/not in the catalog/) });
    expect(byRow[7]).toMatchObject({ field: "alternates", message: expect.stringMatching(/row 4/) });
    expect(byRow[8]).toMatchObject({ field: "part_number", message: expect.stringMatching(/row 2/) });
    expect(byRow[9].field).toBe("serialised");
    expect(byRow[10].field).toBe("life_limit_hours");
    expect(byRow[11].field).toBe("alternates");
    expect(byRow[12].field).toBe("colour");

    const a = await find(pn("IMPA"));
    expect(a).toMatchObject({ lifeLimitHours: "1200:30", lifeLimitCycles: 20000, description: "Imported IMPA" });
    expect(a.alternates.map((x: { partNumber: string; direction: string }) => [x.partNumber, x.direction])).toEqual([
      [pn("IMPB"), "two-way"],
      [pn("IMPBASE"), "one-way"],
    ]);
    expect(await find(pn("IMPB"))).toMatchObject({ overhaulHours: "850:15", serialised: true });

    const written = await testDb()("part_numbers").where("part_number", "like", `QT-${run}-IMP%`).pluck("part_number");
    expect(written.sort()).toEqual([pn("IMPA"), pn("IMPB"), pn("IMPBASE")]);
    expect((await find(pn("IMPBASE"))).replaces).toEqual([expect.objectContaining({ partNumber: pn("IMPA"), direction: "one-way" })]);
    // Refused rows left no links behind either.
    const links = await testDb()("part_interchange as i")
      .join("part_numbers as p", "p.id", "i.part_number_id")
      .where("p.part_number", "like", `QT-${run}-IMP%`)
      .pluck("p.part_number");
    expect(links.sort()).toEqual([pn("IMPA"), pn("IMPA")]);
    expect(await find("QF-3242-50")).toMatchObject({ description: "Electric brake actuator" });
  });

  it("numbers rows by their place in the request when no row number is given", async () => {
    const response = await http()
      .post("/api/part-numbers/import")
      .set("cookie", admin)
      .send({ rows: [row("IMPNUM1"), row("IMPNUM2", { cage: "BAD" })] });
    expect(response.body).toEqual({ accepted: 1, rejected: [{ row: 2, field: "cage", message: expect.any(String) }] });
  });

  it("refuses more than 500 rows, an empty list and a wrong shape with 422 naming rows", async () => {
    const many = Array.from({ length: 501 }, (_, i) => row(`MANY${i}`));
    const tooMany = await http().post("/api/part-numbers/import").set("cookie", admin).send({ rows: many });
    expect(tooMany.status).toBe(422);
    expect(tooMany.body.error.fields.rows).toMatch(/at most 500/);
    expect((await http().post("/api/part-numbers/import").set("cookie", admin).send({ rows: [] })).status).toBe(422);
    expect((await http().post("/api/part-numbers/import").set("cookie", admin).send({ rows: "a,b" })).status).toBe(422);
    expect(await testDb()("part_numbers").where({ part_number: pn("MANY0") }).first()).toBeUndefined();
  });

  it("is for the admin only", async () => {
    const response = await http().post("/api/part-numbers/import").set("cookie", stores).send({ rows: [row("IMPSTORES")] });
    expect(response.status).toBe(403);
    expect(await testDb()("part_numbers").where({ part_number: pn("IMPSTORES") }).first()).toBeUndefined();
  });
});

describe("catalog and layout pages", () => {
  it("give other roles the 403 page, with status 403", async () => {
    for (const path of ["/catalog", "/catalog/new", "/catalog/import", "/catalog/1", "/layouts", "/layouts/QL-72"]) {
      const response = await http().get(path).set("cookie", technician);
      expect(response.status, path).toBe(403);
      expect(response.text, path).toContain("Not available to your role");
    }
  });

  it("open for the admin", async () => {
    const catalog = await http().get("/catalog?q=QF-3242").set("cookie", admin);
    expect(catalog.status).toBe(200);
    expect(catalog.text).toContain("QF-3242-50");
    const layouts = await http().get("/layouts").set("cookie", admin);
    expect(layouts.status).toBe(200);
    expect(layouts.text).toContain("QL-72");
  });
});
