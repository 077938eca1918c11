import { afterAll, describe, expect, it } from "vitest";
import { http, signInAs, sessionCookieFrom, testDb } from "../support/api";

afterAll(async () => {
  await testDb().destroy();
});

describe("POST /api/session", () => {
  it("signs a demo user in and sets an HttpOnly, SameSite=Lax session cookie", async () => {
    const response = await http()
      .post("/api/session")
      .send({ email: "technician@demo.threadline.test", password: "threadline-demo" });
    expect(response.status).toBe(200);
    expect(response.body.user).toMatchObject({ email: "technician@demo.threadline.test", role: "technician" });
    const cookie = [response.headers["set-cookie"]].flat().find((c: string) => c.startsWith("threadline_session="))!;
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
    // Plain http on loopback: a Secure cookie would be dropped by the browser.
    expect(cookie).not.toMatch(/Secure/i);
  });

  it("marks the cookie Secure when the app is reached through https", async () => {
    const response = await http()
      .post("/api/session")
      .set("x-forwarded-proto", "https")
      .send({ email: "inspector@demo.threadline.test", password: "threadline-demo" });
    expect(response.status).toBe(200);
    expect([response.headers["set-cookie"]].flat().join("\n")).toMatch(/Secure/i);
  });

  it("answers a wrong password with 401 and a clear message", async () => {
    const response = await http()
      .post("/api/session")
      .set("x-forwarded-for", "198.51.100.10")
      .send({ email: "stores@demo.threadline.test", password: "not-the-password" });
    expect(response.status).toBe(401);
    expect(response.body.error.code).toBe("bad_credentials");
    expect(response.body.error.message).toMatch(/e-mail address or password is not right/i);
  });

  it("answers an unknown address exactly like a wrong password", async () => {
    const response = await http()
      .post("/api/session")
      .set("x-forwarded-for", "198.51.100.11")
      .send({ email: "nobody@demo.threadline.test", password: "whatever-it-is" });
    expect(response.status).toBe(401);
    expect(response.body.error.code).toBe("bad_credentials");
  });

  it("refuses a malformed body with 400 and a missing field with 422 naming it", async () => {
    const malformed = await http().post("/api/session").set("content-type", "application/json").send("{not json");
    expect(malformed.status).toBe(400);
    const missing = await http().post("/api/session").send({ email: "admin@demo.threadline.test" });
    expect(missing.status).toBe(422);
    expect(missing.body.error.fields).toHaveProperty("password");
  });

  it("answers 429 after repeated failed sign-ins for one address", async () => {
    const email = "rate-limit-probe@demo.threadline.test";
    const statuses: number[] = [];
    for (let attempt = 0; attempt < 7; attempt++) {
      const response = await http()
        .post("/api/session")
        .set("x-forwarded-for", `203.0.113.${attempt}`)
        .send({ email, password: "guess-number-" + attempt });
      statuses.push(response.status);
      if (response.status === 429) {
        expect(response.headers["retry-after"]).toBeDefined();
        expect(response.body.error.message).toMatch(/too many failed sign-ins/i);
      }
    }
    expect(statuses.slice(0, 5)).toEqual([401, 401, 401, 401, 401]);
    expect(statuses.slice(5)).toEqual([429, 429]);
  });

  it("refuses a cross-origin POST with 403", async () => {
    const response = await http()
      .post("/api/session")
      .set("origin", "https://elsewhere.example")
      .send({ email: "admin@demo.threadline.test", password: "threadline-demo" });
    expect(response.status).toBe(403);
    expect(response.body.error.code).toBe("bad_origin");
  });
});

describe("GET and DELETE /api/session", () => {
  it("answers 401 without a session", async () => {
    const response = await http().get("/api/session");
    expect(response.status).toBe(401);
    expect(response.body.error.code).toBe("unauthenticated");
  });

  it("returns the signed-in user, and 401 after sign-out", async () => {
    const cookie = await signInAs("auditor");
    const who = await http().get("/api/session").set("cookie", cookie);
    expect(who.status).toBe(200);
    expect(who.body.user.role).toBe("auditor");
    const out = await http().delete("/api/session").set("cookie", cookie);
    expect(out.status).toBe(204);
    expect((await http().get("/api/session").set("cookie", cookie)).status).toBe(401);
  });

  it("ends an expired session", async () => {
    const response = await http()
      .post("/api/session")
      .send({ email: "reliability@demo.threadline.test", password: "threadline-demo" });
    const cookie = sessionCookieFrom(response.headers["set-cookie"]);
    const sessionId = cookie.split("=")[1];
    await testDb()("user_sessions").where({ id: sessionId }).update({ expires_at: new Date(Date.now() - 60_000) });
    expect((await http().get("/api/session").set("cookie", cookie)).status).toBe(401);
  });
});

describe("pages", () => {
  it("sends a visitor without a session to the sign-in page", async () => {
    const response = await http().get("/");
    expect([303, 307, 308]).toContain(response.status);
    expect(response.headers.location).toMatch(/\/sign-in/);
  });

  it("shows the sign-in page", async () => {
    const response = await http().get("/sign-in");
    expect(response.status).toBe(200);
    expect(response.text).toContain("Sign in");
  });

  it("shows each role its own home page", async () => {
    for (const role of ["technician", "inspector", "stores", "reliability", "auditor", "admin"] as const) {
      const cookie = await signInAs(role);
      const response = await http().get("/").set("cookie", cookie);
      expect(response.status, role).toBe(200);
      expect(response.text).toContain("What you can do next");
    }
  });
});
