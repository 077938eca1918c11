// Helpers for tests that drive the real app over HTTP.
import knexFactory, { type Knex } from "knex";
import request from "supertest";
import { inject } from "vitest";
import { knexConfig } from "../../knexfile";
import { DEMO_PASSWORD, demoEmail } from "../../seeds/lib/demo";
import type { Role } from "../../src/lib/roles";

export const testEnv = () => inject("env");
export const appUrl = () => testEnv().APP_URL;
export const http = () => request(appUrl());

/** Signs a demo user in through the API and returns the Cookie header value to send. */
export async function signInAs(role: Role | { email: string; password: string }): Promise<string> {
  const body = typeof role === "string" ? { email: demoEmail(role), password: DEMO_PASSWORD } : role;
  const response = await http().post("/api/session").send(body);
  if (response.status !== 200) throw new Error(`sign-in as ${JSON.stringify(body.email)} failed: ${response.status} ${response.text}`);
  return sessionCookieFrom(response.headers["set-cookie"]);
}

export function sessionCookieFrom(setCookie: string | string[] | undefined): string {
  const cookies = Array.isArray(setCookie) ? setCookie : setCookie ? [setCookie] : [];
  const session = cookies.find((cookie) => cookie.startsWith("threadline_session="));
  if (!session) throw new Error("no session cookie was set");
  return session.split(";")[0];
}

let shared: Knex | null = null;
/** Direct database access for checks the API does not expose. */
export function testDb(): Knex {
  shared ??= knexFactory(knexConfig({ ...process.env, ...testEnv() }));
  return shared;
}
