// Property-based bad input against every JSON route and the upload route: whatever arrives, the
// answer is never a 5xx, a refusal is a 4xx with {error: {code, message}}, and a refused request
// writes nothing. Write routes only ever get bodies that are invalid by construction (required
// fields missing or of the wrong type, or an id that does not exist), so the demo state other
// suites rely on stays as it is.
import fc from "fast-check";
import { beforeAll, describe, expect, it } from "vitest";
import type { Role } from "../../src/lib/roles";
import { http, signInAs, testDb } from "../support/api";
import { dbFingerprint } from "./integrity-support";

const RUNS = Number(process.env.FUZZ_RUNS ?? 100);

interface WriteRoute {
  method: "POST" | "PATCH";
  path: string;
  as: Role;
}

// Every route handler that reads a JSON body (from src/app/api/**/route.ts).
const WRITE_ROUTES: WriteRoute[] = [
  { method: "POST", path: "/api/session", as: "technician" },
  { method: "POST", path: "/api/password-resets", as: "technician" },
  { method: "POST", path: "/api/password-resets/fuzz-token", as: "technician" },
  { method: "POST", path: "/api/invitations/fuzz-token/accept", as: "technician" },
  { method: "POST", path: "/api/swaps", as: "technician" },
  { method: "POST", path: "/api/swaps/check", as: "technician" },
  { method: "POST", path: "/api/discrepancies", as: "technician" },
  { method: "POST", path: "/api/aircraft/Q-FRAA/utilization", as: "technician" },
  { method: "POST", path: "/api/aircraft/Q-FRAA/utilization/import", as: "technician" },
  { method: "POST", path: "/api/parts/{partId}/movements", as: "stores" },
  { method: "POST", path: "/api/receipts/part-number-requests", as: "stores" },
  { method: "POST", path: "/api/layouts", as: "admin" },
  { method: "POST", path: "/api/layouts/{typeCode}/positions", as: "admin" },
  { method: "PATCH", path: "/api/layouts/NO-SUCH-TYPE/positions/NO-SUCH-POSITION", as: "admin" },
  { method: "POST", path: "/api/part-numbers", as: "admin" },
  { method: "PATCH", path: "/api/part-numbers/999999999", as: "admin" },
  { method: "POST", path: "/api/part-numbers/import", as: "admin" },
  { method: "POST", path: "/api/users/invitations", as: "admin" },
  { method: "PATCH", path: "/api/users/no-such-user", as: "admin" },
];

// Field names the routes read, so the fuzzer reaches the schemas' inner checks, not only "missing".
const FIELD_NAMES = [
  "registration", "positionCode", "aircraftHours", "aircraftCycles", "performedAt", "removed", "installed", "removalType", "reason",
  "workOrder", "taskReference", "testResult", "asOf", "hours", "cycles", "rows", "kind", "bin", "partNumber", "serialNumber", "cage",
  "code", "name", "label", "description", "ataChapter", "eligible", "alternates", "email", "password", "role", "status", "licence",
  "stationId", "token", "details", "lifeLimitCycles", "lifeLimitHours", "note",
];
const POLLUTION_KEYS = ["__proto__", "constructor", "prototype", "toString", "hasOwnProperty"];

const hugeString = fc.integer({ min: 10_000, max: 300_000 }).map((n) => "A".repeat(n));
const nastyString = fc.oneof(
  fc.string({ unit: "grapheme", maxLength: 40 }),
  fc.constantFrom("\u202Egnp.exe", "\u0000", "'; DROP TABLE parts; --", "../../etc/passwd", "%00", "\uD800", "😀".repeat(50), "Q-FRAA\u0000"),
  hugeString,
);
/** Never a valid value for a scalar field: objects, arrays and booleans. */
const wrongTyped = fc.oneof(fc.object({ maxDepth: 2 }), fc.array(fc.jsonValue({ maxDepth: 2 }), { maxLength: 5 }), fc.boolean(), fc.constant({ __proto__: { admin: true } }));

/** A JSON text a write route must refuse. */
const refusedBody: fc.Arbitrary<{ text: string; contentType: string }> = fc.oneof(
  // Not an object at all.
  fc.oneof(fc.jsonValue({ maxDepth: 2 }).filter((v) => v === null || typeof v !== "object" || Array.isArray(v)), nastyString).map((v) => ({ text: JSON.stringify(v), contentType: "application/json" })),
  // Objects whose every known field is of the wrong type, plus random and prototype-pollution keys.
  fc
    .tuple(
      fc.dictionary(fc.constantFrom(...FIELD_NAMES), wrongTyped, { minKeys: 0, maxKeys: 12 }),
      fc.dictionary(fc.string({ maxLength: 12 }).filter((k) => !FIELD_NAMES.includes(k)), fc.jsonValue({ maxDepth: 2 }), { maxKeys: 4 }),
      fc.subarray(POLLUTION_KEYS),
    )
    .map(([known, random, pollution]) => {
      const parts = [...Object.entries(random), ...Object.entries(known)].map(([k, v]) => `${JSON.stringify(k)}:${JSON.stringify(v)}`);
      for (const key of pollution) parts.push(`${JSON.stringify(key)}:{"isAdmin":true,"role":"admin"}`);
      return { text: `{${parts.join(",")}}`, contentType: "application/json" };
    }),
  // Malformed JSON text.
  fc.oneof(fc.string({ maxLength: 200 }).filter((s) => !isJson(s)), fc.constantFrom("{", "{\"a\":", "[1,2", "{'a':1}", "NaN", "undefined", "{\"a\":1}}", "\u0000{}")).map((text) => ({ text, contentType: "application/json" })),
  // The wrong content type.
  fc.tuple(fc.string({ maxLength: 100 }), fc.constantFrom("text/plain", "application/x-www-form-urlencoded", "multipart/form-data; boundary=x", "application/xml", "image/png")).map(([text, contentType]) => ({ text, contentType })),
);

function isJson(text: string): boolean {
  try {
    JSON.parse(text);
    return true;
  } catch {
    return false;
  }
}

const cookies = new Map<Role, string>();
const sample: Record<string, string> = {};
const fill = (path: string) => path.replace(/\{(\w+)\}/g, (_, name: string) => sample[name]);

beforeAll(async () => {
  for (const role of ["technician", "stores", "admin"] as const) cookies.set(role, await signInAs(role));
  const part = await testDb()("parts").where({ status: "serviceable" }).orderBy("id").first("id");
  const type = await testDb()("aircraft_types").orderBy("id").first("code");
  sample.partId = String(part.id);
  sample.typeCode = type.code;
});

function expectRefusal(status: number, body: unknown, text: string, what: string) {
  expect(status, `${what}: ${text.slice(0, 300)}`).toBeGreaterThanOrEqual(400);
  expect(status, `${what}: ${text.slice(0, 300)}`).toBeLessThan(500);
  expect(body, `${what}: ${text.slice(0, 300)}`).toMatchObject({ error: { code: expect.any(String), message: expect.any(String) } });
}

describe("fuzzing the JSON write routes", () => {
  for (const route of WRITE_ROUTES) {
    it(`${route.method} ${route.path} refuses bad input with a 4xx and writes nothing`, async () => {
      const before = await dbFingerprint();
      await fc.assert(
        fc.asyncProperty(refusedBody, async ({ text, contentType }) => {
          const path = fill(route.path);
          const request = route.method === "POST" ? http().post(path) : http().patch(path);
          const response = await request.set("cookie", cookies.get(route.as)!).set("content-type", contentType).send(text);
          expectRefusal(response.status, response.body, String(response.text ?? ""), `${route.method} ${path} with ${text.slice(0, 120)}`);
        }),
        { numRuns: RUNS },
      );
      expect(await dbFingerprint()).toBe(before);
    });
  }
});

// Read routes with path and query parameters: answers are 2xx or a 4xx with an error body, never 5xx.
const READ_ROUTES: Array<{ path: (segment: string) => string; query: string[] }> = [
  { path: () => "/api/parts", query: ["q"] },
  { path: (s) => `/api/parts/${s}`, query: [] },
  { path: (s) => `/api/parts/${s}/label.png`, query: ["symbol", "scale"] },
  { path: () => "/api/stock", query: ["status", "partNumber", "bin", "q", "page", "pageSize"] },
  { path: () => "/api/users", query: ["role", "status", "station", "licence", "q"] },
  { path: (s) => `/api/users/${s}`, query: [] },
  { path: () => "/api/account-events", query: ["kind", "user", "q", "from", "to", "before"] },
  { path: () => "/api/part-numbers", query: ["q", "ataChapter"] },
  { path: (s) => `/api/part-numbers/${s}`, query: [] },
  { path: () => "/api/layouts", query: [] },
  { path: (s) => `/api/layouts/${s}`, query: ["zone", "ataChapter"] },
  { path: (s) => `/api/layouts/${s}/positions/${s}`, query: [] },
  { path: () => "/api/aircraft", query: [] },
  { path: (s) => `/api/aircraft/${s}`, query: [] },
  { path: (s) => `/api/aircraft/${s}/utilization`, query: [] },
  { path: (s) => `/api/aircraft/Q-FRAA/positions/${s}/label.png`, query: ["symbol", "scale"] },
  { path: (s) => `/api/aircraft/${s}/positions/B1-EBA1/label.png`, query: ["symbol", "scale"] },
  { path: (s) => `/api/documents/${s}`, query: [] },
];
const segment = fc.oneof(
  fc.constantFrom("0", "-1", "1.5", "1e309", "99999999999999999999", "NaN", "%00", "..%2F..%2Fetc%2Fpasswd", "%E2%80%AE", "Q-FRAA%00", "%F0%9F%98%80"),
  fc.string({ unit: "grapheme", maxLength: 30 }).filter((s) => s.length > 0).map(encodeURIComponent),
  fc.integer({ min: 5000, max: 8000 }).map((n) => "9".repeat(n)),
);
const queryValue = fc.oneof(nastyString.filter((s) => s.length < 20_000), fc.integer().map(String), fc.constantFrom("", "-1", "1e9", "null", "[]", "{}"));

describe("fuzzing the read routes' parameters", () => {
  for (const route of READ_ROUTES) {
    const label = route.path("{id}");
    it(`GET ${label} never answers 5xx`, async () => {
      const before = await dbFingerprint();
      await fc.assert(
        fc.asyncProperty(segment, fc.dictionary(fc.constantFrom(...route.query, "__proto__", "x"), queryValue, { maxKeys: 4 }), async (seg, query) => {
          const search = new URLSearchParams(Object.entries(query)).toString();
          const path = `${route.path(seg)}${search ? `?${search}` : ""}`;
          const response = await http().get(path).set("cookie", cookies.get("admin")!);
          const text = String(response.text ?? "");
          expect(response.status, `GET ${path.slice(0, 200)}: ${text.slice(0, 300)}`).toBeLessThan(500);
          if (response.status >= 400 && response.status !== 414 && response.status !== 431) expectRefusal(response.status, response.body, text, `GET ${path.slice(0, 200)}`);
        }),
        { numRuns: Math.ceil(RUNS / 2) },
      );
      expect(await dbFingerprint()).toBe(before);
    });
  }
});

describe("fuzzing the upload route", () => {
  it("POST /api/receipts refuses bad multipart fields and bodies with a 4xx and writes nothing", async () => {
    const before = await dbFingerprint();
    const fieldValue = fc.oneof(nastyString.filter((s) => s.length < 50_000), fc.constantFrom("", "-1", "1:99", "true", "[object Object]"));
    await fc.assert(
      fc.asyncProperty(
        // Never a catalog part number, so no generated receipt can be booked in.
        fc.dictionary(fc.constantFrom("cage", "serialNumber", "quantity", "formType", "statusWork", "trackingNumber", "issuerName", "issuedOn", "tsn", "csn", "bin", "certificateMatches", "__proto__"), fieldValue, { maxKeys: 10 }),
        fc.string({ maxLength: 20 }).map((s) => `ZZ-FUZZ-${s}`),
        fc.oneof(fc.constant(null), fc.record({ bytes: fc.uint8Array({ maxLength: 2048 }), name: nastyString.filter((s) => s.length > 0 && s.length < 2000), type: fc.constantFrom("application/pdf", "image/png", "text/plain", "application/octet-stream") })),
        async (fields, partNumber, file) => {
          let request = http().post("/api/receipts").set("cookie", cookies.get("stores")!).field("partNumber", partNumber);
          for (const [name, value] of Object.entries(fields)) request = request.field(name, value);
          if (file) request = request.attach("certificate", Buffer.from(file.bytes), { filename: file.name, contentType: file.type });
          const response = await request;
          expectRefusal(response.status, response.body, String(response.text ?? ""), `receipt ${JSON.stringify(fields).slice(0, 200)}`);
        },
      ),
      { numRuns: RUNS },
    );
    await fc.assert(
      fc.asyncProperty(refusedBody, async ({ text, contentType }) => {
        const response = await http().post("/api/receipts").set("cookie", cookies.get("stores")!).set("content-type", contentType).send(text);
        expectRefusal(response.status, response.body, String(response.text ?? ""), `receipt body ${contentType} ${text.slice(0, 100)}`);
      }),
      { numRuns: RUNS },
    );
    expect(await dbFingerprint()).toBe(before);
  });
});
