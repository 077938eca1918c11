// Generated from access-table.ts: every route and page against every role and a signed-out visitor.
import { beforeAll, describe, expect, it } from "vitest";
import { ROLES, type Role } from "../../src/lib/roles";
import { http, signInAs, testDb } from "../support/api";
import { API_ACCESS, PAGE_ACCESS } from "./access-table";
import { dbFingerprint } from "./integrity-support";

type Visitor = Role | "signed out";
const VISITORS: Visitor[] = [...ROLES, "signed out"];
const cookies = new Map<Visitor, string>();
const sample: Record<string, string> = {};

beforeAll(async () => {
  for (const role of ROLES) cookies.set(role, await signInAs(role));
  const db = testDb();
  const part = await db("parts").orderBy("id").first("id");
  const document = await db("documents").orderBy("id").first("id");
  const position = await db("positions as p").join("aircraft_types as t", "t.id", "p.aircraft_type_id").orderBy("p.id").first("p.code", "t.code as typeCode");
  const partNumber = await db("part_numbers").orderBy("id").first("id");
  const swap = await db("swaps").orderBy("created_at").first("id");
  Object.assign(sample, {
    partId: String(part.id),
    documentId: String(document.id),
    typeCode: position.typeCode,
    positionCode: position.code,
    partNumberId: String(partNumber.id),
    userId: "usr-technician",
    swapId: swap?.id ?? "00000000-0000-4000-8000-000000000000",
  });
});

const fill = (path: string) => path.replace(/\{(\w+)\}/g, (_, name: string) => encodeURIComponent(sample[name] ?? name));

function send(method: string, path: string, visitor: Visitor, body?: unknown) {
  const agent = http();
  let request = method === "GET" ? agent.get(path) : method === "POST" ? agent.post(path) : method === "PATCH" ? agent.patch(path) : agent.delete(path);
  const cookie = cookies.get(visitor);
  if (cookie) request = request.set("cookie", cookie);
  return body === undefined ? request : request.send(body as object);
}

describe("API routes by role", () => {
  for (const entry of API_ACCESS) {
    it(`${entry.method} ${entry.path}`, async () => {
      const before = await dbFingerprint();
      const wrong: string[] = [];
      for (const visitor of VISITORS) {
        const response = await send(entry.method, fill(entry.path), visitor, entry.body);
        const allowed = entry.roles === "public" || (visitor !== "signed out" && entry.roles.includes(visitor));
        const expected = entry.roles === "public" ? "not 403" : visitor === "signed out" ? "401" : allowed ? "not 401/403" : "403";
        const ok =
          expected === "401" ? response.status === 401 : expected === "403" ? response.status === 403 : expected === "not 403" ? response.status !== 403 : response.status !== 401 && response.status !== 403;
        if (!ok) wrong.push(`${visitor}: expected ${expected}, got ${response.status} ${String(response.text ?? "").slice(0, 120)}`);
        if (response.status === 401 || response.status === 403) {
          expect(response.body.error, `${visitor} refusal body`).toMatchObject({ code: expect.any(String), message: expect.any(String) });
        }
        expect(response.status, `${visitor}: ${String(response.text ?? "").slice(0, 200)}`).toBeLessThan(500);
      }
      expect(wrong).toEqual([]);
      // Every request above was refused or invalid: nothing may have been written.
      expect(await dbFingerprint()).toBe(before);
    });
  }
});

describe("pages by role", () => {
  for (const entry of PAGE_ACCESS) {
    it(`GET ${entry.path}`, async () => {
      const wrong: string[] = [];
      for (const visitor of VISITORS) {
        const response = await send("GET", fill(entry.path), visitor).redirects(0);
        const location = String(response.headers.location ?? "");
        let ok: boolean;
        let expected: string;
        if (entry.roles === "public") {
          // Sign-in pages send a signed-in visitor on to the app.
          expected = visitor === "signed out" ? "200" : "200 or a redirect into the app";
          ok = response.status === 200 || (visitor !== "signed out" && response.status >= 300 && response.status < 400 && !location.includes("/sign-in"));
        } else if (visitor === "signed out") {
          expected = "redirect to /sign-in";
          ok = response.status >= 300 && response.status < 400 && location.includes("/sign-in");
        } else if (entry.roles.includes(visitor)) {
          expected = "200 or 404";
          ok = response.status === 200 || response.status === 404;
        } else {
          expected = "403";
          ok = response.status === 403;
        }
        if (!ok) wrong.push(`${visitor}: expected ${expected}, got ${response.status}${location ? ` -> ${location}` : ""}`);
      }
      expect(wrong).toEqual([]);
    });
  }
});
