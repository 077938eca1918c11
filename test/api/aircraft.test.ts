import { beforeAll, describe, expect, it } from "vitest";
import { http, signInAs } from "../support/api";

let technician: string;
let stores: string;
beforeAll(async () => {
  technician = await signInAs("technician");
  stores = await signInAs("stores");
});

const toMinutes = (hm: string) => {
  const [h, m] = hm.split(":").map(Number);
  return h * 60 + m;
};
const toHm = (minutes: number) => `${Math.floor(minutes / 60)}:${String(minutes % 60).padStart(2, "0")}`;
/** An instant just after the aircraft's newest snapshot (other suites may have added some). */
const afterSnapshot = (asOf: string, minutes: number) => new Date(Date.parse(asOf) + minutes * 60_000).toISOString();

describe("GET /api/aircraft", () => {
  it("lists the fleet with H:MM hours and integer cycles", async () => {
    const response = await http().get("/api/aircraft").set("cookie", technician);
    expect(response.status).toBe(200);
    expect(response.body.aircraft.length).toBeGreaterThanOrEqual(6);
    for (const aircraft of response.body.aircraft) {
      expect(aircraft.registration).toMatch(/^Q-[A-Z]{4}$/);
      expect(aircraft.hours).toMatch(/^\d+:[0-5]\d$/);
      expect(Number.isInteger(aircraft.cycles)).toBe(true);
      expect(aircraft).toHaveProperty("type");
      expect(aircraft).toHaveProperty("station");
    }
  });

  it("answers 401 without a session", async () => {
    expect((await http().get("/api/aircraft")).status).toBe(401);
  });
});

describe("GET /api/aircraft/{registration}", () => {
  it("returns every position with eligibility and what is fitted", async () => {
    const response = await http().get("/api/aircraft/Q-FRAA").set("cookie", technician);
    expect(response.status).toBe(200);
    expect(response.body.aircraft.registration).toBe("Q-FRAA");
    const positions = response.body.positions;
    expect(positions.length).toBeGreaterThanOrEqual(120);
    const actuator = positions.find((p: { code: string }) => p.code === "B1-EBA1");
    expect(actuator).toMatchObject({ ataChapter: "32-42", eligible: expect.arrayContaining(["QF-3242-50", "QF-3242-51"]) });
    expect(actuator.fitted).toMatchObject({
      partNumber: expect.stringMatching(/^QF-3242-5[01]$/),
      serialNumber: expect.any(String),
      cage: expect.any(String),
      installedAt: expect.any(String),
      hoursOnWing: expect.stringMatching(/^\d+:[0-5]\d$/),
      cyclesOnWing: expect.any(Number),
      tsn: expect.stringMatching(/^\d+:[0-5]\d$/),
      csn: expect.any(Number),
    });
    expect(actuator.cautions.join(" ")).toMatch(/circuit breakers/);
  });

  it("answers 404 for an unknown registration and 422 for a malformed one", async () => {
    const unknown = await http().get("/api/aircraft/Q-ZZZZ").set("cookie", technician);
    expect(unknown.status).toBe(404);
    expect(unknown.body.error.message).toMatch(/Q-ZZZZ/);
    const malformed = await http().get("/api/aircraft/Q_F%24").set("cookie", technician);
    expect(malformed.status).toBe(422);
  });
});

describe("POST /api/aircraft/{registration}/utilization", () => {
  it("records a snapshot that follows the last one, and refuses one lower than it with 409 naming the earlier value", async () => {
    const before = await http().get("/api/aircraft/Q-FRAD").set("cookie", technician);
    const minutes = toMinutes(before.body.aircraft.hours);
    const cycles = before.body.aircraft.cycles;

    const created = await http()
      .post("/api/aircraft/Q-FRAD/utilization")
      .set("cookie", technician)
      .send({ asOf: afterSnapshot(before.body.aircraft.asOf, 1), hours: toHm(minutes + 95), cycles: cycles + 1 });
    expect(created.status).toBe(201);
    expect(created.body.snapshot).toEqual({ asOf: afterSnapshot(before.body.aircraft.asOf, 1), hours: toHm(minutes + 95), cycles: cycles + 1 });

    const after = await http().get("/api/aircraft/Q-FRAD").set("cookie", technician);
    expect(after.body.aircraft.hours).toBe(toHm(minutes + 95));

    const lower = await http()
      .post("/api/aircraft/Q-FRAD/utilization")
      .set("cookie", technician)
      .send({ asOf: afterSnapshot(before.body.aircraft.asOf, 2), hours: toHm(minutes + 10), cycles: cycles + 1 });
    expect(lower.status).toBe(409);
    expect(lower.body.error.code).toBe("time_regression");
    expect(lower.body.error.message).toContain(toHm(minutes + 95));
  });

  it("accepts decimal hours", async () => {
    const before = await http().get("/api/aircraft/Q-FRBD").set("cookie", technician);
    const minutes = toMinutes(before.body.aircraft.hours);
    const decimal = (minutes + 90) / 60; // whole minutes, so the decimal form is exact to the minute
    const response = await http()
      .post("/api/aircraft/Q-FRBD/utilization")
      .set("cookie", technician)
      .send({ asOf: afterSnapshot(before.body.aircraft.asOf, 1), hours: Number(decimal.toFixed(4)), cycles: before.body.aircraft.cycles + 2 });
    expect(response.status).toBe(201);
    expect(response.body.snapshot.hours).toBe(toHm(minutes + 90));
  });

  it("refuses a snapshot dated in the future (422 naming asOf)", async () => {
    const response = await http()
      .post("/api/aircraft/Q-FRAB/utilization")
      .set("cookie", technician)
      .send({ asOf: new Date(Date.now() + 86_400_000).toISOString(), hours: "99999:00", cycles: 99999 });
    expect(response.status).toBe(422);
    expect(response.body.error.fields).toHaveProperty("asOf");
  });

  it("refuses bad fields with 422 naming each", async () => {
    const response = await http()
      .post("/api/aircraft/Q-FRAB/utilization")
      .set("cookie", technician)
      .send({ asOf: "yesterday", hours: "12:75", cycles: -3 });
    expect(response.status).toBe(422);
    expect(Object.keys(response.body.error.fields).sort()).toEqual(["asOf", "cycles", "hours"]);
  });

  it("refuses a role that does not record utilisation (403) and an unknown aircraft (404)", async () => {
    const forbidden = await http().post("/api/aircraft/Q-FRAB/utilization").set("cookie", stores).send({ asOf: "2026-12-01T00:00:00Z", hours: "1:00", cycles: 1 });
    expect(forbidden.status).toBe(403);
    const unknown = await http().post("/api/aircraft/Q-ZZZZ/utilization").set("cookie", technician).send({ asOf: "2026-12-01T00:00:00Z", hours: "1:00", cycles: 1 });
    expect(unknown.status).toBe(404);
  });

  it("imports many rows, keeping the good ones and reporting each bad one", async () => {
    const before = await http().get("/api/aircraft/Q-FRBC").set("cookie", technician);
    const minutes = toMinutes(before.body.aircraft.hours);
    const cycles = before.body.aircraft.cycles;
    const response = await http()
      .post("/api/aircraft/Q-FRBC/utilization/import")
      .set("cookie", technician)
      .send({
        rows: [
          { asOf: afterSnapshot(before.body.aircraft.asOf, 2), hours: toHm(minutes + 800), cycles: cycles + 16 },
          { asOf: afterSnapshot(before.body.aircraft.asOf, 1), hours: toHm(minutes + 400), cycles: cycles + 8 },
          { asOf: afterSnapshot(before.body.aircraft.asOf, 3), hours: toHm(minutes + 100), cycles: cycles + 20 }, // lower than the minute before
          { asOf: "not a date", hours: "1:00", cycles: 1 },
        ],
      });
    expect(response.status).toBe(200);
    expect(response.body.accepted).toBe(2);
    expect(response.body.rejected.map((r: { row: number }) => r.row)).toEqual([3, 4]);
    const after = await http().get("/api/aircraft/Q-FRBC").set("cookie", technician);
    expect(after.body.aircraft.hours).toBe(toHm(minutes + 800));
  });
});

describe("GET /api/parts", () => {
  it("finds units by the start of a serial or part number", async () => {
    const bySerial = await http().get("/api/parts?q=EA0").set("cookie", technician);
    expect(bySerial.status).toBe(200);
    expect(bySerial.body.parts.length).toBeGreaterThan(0);
    for (const part of bySerial.body.parts) {
      expect(part).toMatchObject({ id: expect.any(Number), partNumber: expect.any(String), serialNumber: expect.any(String), cage: expect.any(String), status: expect.any(String), tsn: expect.stringMatching(/^\d+:[0-5]\d$/), csn: expect.any(Number) });
    }
    const byPartNumber = await http().get("/api/parts?q=QF-3242-50").set("cookie", technician);
    expect(byPartNumber.body.parts.every((p: { partNumber: string }) => p.partNumber === "QF-3242-50")).toBe(true);
  });

  it("needs a query (422 naming q)", async () => {
    const response = await http().get("/api/parts").set("cookie", technician);
    expect(response.status).toBe(422);
    expect(response.body.error.fields).toHaveProperty("q");
  });
});

describe("GET /api/parts/{id}", () => {
  it("returns one unit with its times and thread", async () => {
    const found = await http().get("/api/parts?q=EA0").set("cookie", technician);
    const id = found.body.parts[0].id;
    const response = await http().get(`/api/parts/${id}`).set("cookie", technician);
    expect(response.status).toBe(200);
    expect(response.body.part.thread.length).toBeGreaterThanOrEqual(1);
    const seqs = response.body.part.thread.map((t: { seq: number }) => t.seq);
    expect([...seqs].sort((a, b) => b - a)).toEqual(seqs); // newest first
  });

  it("answers 404 for an unknown unit and 422 for a malformed id", async () => {
    expect((await http().get("/api/parts/999999").set("cookie", technician)).status).toBe(404);
    expect((await http().get("/api/parts/abc").set("cookie", technician)).status).toBe(422);
  });
});
