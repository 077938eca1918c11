import { createHash } from "node:crypto";
import { afterAll, describe, expect, it } from "vitest";
import { http, sessionCookieFrom, signInAs, testDb } from "../support/api";
import { linkIn, mailsTo, waitForMails } from "../support/mail-inbox";
import { createActivePerson, uniqueEmail, uniqueIp } from "../support/people";

afterAll(async () => {
  await testDb().destroy();
});

const sha256 = (text: string) => createHash("sha256").update(text).digest("hex");
const NEW_PASSWORD = "Harbour-quince-tally-84";

async function requestReset(email: string, ip = uniqueIp()) {
  return http().post("/api/password-resets").set("x-forwarded-for", ip).send({ email });
}

async function signInWith(email: string, password: string) {
  return http().post("/api/session").set("x-forwarded-for", uniqueIp()).send({ email, password });
}

describe("asking for a password reset", () => {
  it("answers known and unknown addresses alike, so the form reveals no account", async () => {
    const person = await createActivePerson();
    const known = await requestReset(person.email);
    const unknown = await requestReset(uniqueEmail("nobody"));
    expect(known.status).toBe(202);
    expect(unknown.status).toBe(known.status);
    expect(unknown.text).toBe(known.text);
    expect(unknown.headers["content-type"]).toBe(known.headers["content-type"]);
    expect(known.body.message).toMatch(/If an account uses that address/);
  });

  it("is on the sign-in page as 'Forgot password?'", async () => {
    const page = await http().get("/sign-in");
    expect(page.text).toMatch(/href="\/reset-password"[^>]*>Forgot password\?/);
    expect((await http().get("/reset-password")).status).toBe(200);
  });

  it("mails at most three links per address per hour, silently", async () => {
    const person = await createActivePerson();
    const answers = [];
    for (let i = 0; i < 4; i++) answers.push(await requestReset(person.email));
    expect(answers.map((a) => a.status)).toEqual([202, 202, 202, 202]);
    expect(new Set(answers.map((a) => a.text)).size).toBe(1);
    await waitForMails(person.email, 1 + 3); // the invitation and three reset links
    const queued = await testDb()("mail_outbox").where({ to_address: person.email, subject: "Choose a new Threadline password" });
    expect(queued).toHaveLength(3);
    const events = await testDb()("account_events").where({ subject_email: person.email, kind: "password_reset_requested" }).orderBy("id");
    expect(events.map((e) => JSON.parse(e.details).mailed)).toEqual([true, true, true, false]);
    expect(JSON.parse(events[3].details).reason).toBe("hourly limit reached");
  });

  it("answers 429 to a client that keeps asking, whatever the address", async () => {
    const ip = uniqueIp();
    const statuses = [];
    for (let i = 0; i < 21; i++) statuses.push((await requestReset(uniqueEmail("probe"), ip)).status);
    expect(statuses.slice(0, 20).every((status) => status === 202)).toBe(true);
    expect(statuses[20]).toBe(429);
  });

  it("refuses a malformed address with 422 naming the field", async () => {
    const response = await http().post("/api/password-resets").send({ email: "nope" });
    expect(response.status).toBe(422);
    expect(response.body.error.fields).toHaveProperty("email");
  });
});

describe("using a reset link", () => {
  it("sets the new password, ends every other session and signs the person in", async () => {
    const person = await createActivePerson();
    const laptop = sessionCookieFrom((await signInWith(person.email, person.password)).headers["set-cookie"]);
    expect((await http().get("/api/session").set("cookie", laptop)).status).toBe(200);

    expect((await requestReset(person.email)).status).toBe(202);
    const mails = await waitForMails(person.email, 2);
    const { token } = linkIn(mails[mails.length - 1], "/reset-password");
    const page = await http().get(`/reset-password/${token}`);
    expect(page.status).toBe(200);
    expect(page.text).toContain("Choose a new password");

    const done = await http().post(`/api/password-resets/${token}`).send({ password: NEW_PASSWORD });
    expect(done.status, done.text).toBe(200);
    const fresh = sessionCookieFrom(done.headers["set-cookie"]);
    expect((await http().get("/api/session").set("cookie", fresh)).status).toBe(200);
    // Both earlier sessions (the one from accepting the invitation and the laptop's) are gone.
    expect((await http().get("/api/session").set("cookie", laptop)).status).toBe(401);
    expect((await http().get("/api/session").set("cookie", person.cookie)).status).toBe(401);
    const [{ count }] = await testDb()("user_sessions").where({ user_id: person.id }).count({ count: "*" });
    expect(Number(count)).toBe(1);

    expect((await signInWith(person.email, person.password)).status).toBe(401);
    expect((await signInWith(person.email, NEW_PASSWORD)).status).toBe(200);

    const reused = await http().post(`/api/password-resets/${token}`).send({ password: "Yet-another-phrase-31" });
    expect(reused.status).toBe(409);
    expect(reused.body.error.code).toBe("link_used");
    expect((await http().get(`/reset-password/${token}`)).text).toContain("This link has already been used");
  });

  it("gives links one hour and refuses an expired one with a clear page", async () => {
    const person = await createActivePerson();
    await requestReset(person.email);
    const mails = await waitForMails(person.email, 2);
    const { token } = linkIn(mails[mails.length - 1], "/reset-password");
    const row = await testDb()("account_tokens").where({ token_hash: sha256(token) }).first();
    expect(new Date(row.expires_at).getTime() - new Date(row.created_at).getTime()).toBe(60 * 60_000);

    await testDb()("account_tokens").where({ id: row.id }).update({ expires_at: new Date(Date.now() - 1000) });
    const page = await http().get(`/reset-password/${token}`);
    expect(page.status).toBe(200);
    expect(page.text).toContain("This link has expired");
    const response = await http().post(`/api/password-resets/${token}`).send({ password: NEW_PASSWORD });
    expect(response.status).toBe(409);
    expect(response.body.error.code).toBe("link_expired");
    expect((await signInWith(person.email, person.password)).status).toBe(200);
  });

  it("withdraws the earlier link when a newer one is asked for", async () => {
    const person = await createActivePerson();
    await requestReset(person.email);
    const first = linkIn((await waitForMails(person.email, 2))[1], "/reset-password").token;
    await requestReset(person.email);
    const second = linkIn((await waitForMails(person.email, 3))[2], "/reset-password").token;
    expect((await http().post(`/api/password-resets/${first}`).send({ password: NEW_PASSWORD })).body.error.code).toBe("link_superseded");
    expect((await http().post(`/api/password-resets/${second}`).send({ password: NEW_PASSWORD })).status).toBe(200);
  });

  it("refuses a weak new password with 422 and leaves the old one working", async () => {
    const person = await createActivePerson();
    await requestReset(person.email);
    const { token } = linkIn((await waitForMails(person.email, 2))[1], "/reset-password");
    const weak = await http().post(`/api/password-resets/${token}`).send({ password: "Password2024!" });
    expect(weak.status).toBe(422);
    expect(weak.body.error.fields.password).toMatch(/commonly used/);
    const short = await http().post(`/api/password-resets/${token}`).send({ password: "tiny" });
    expect(short.body.error.fields.password).toMatch(/at least 12 characters/);
    expect((await signInWith(person.email, person.password)).status).toBe(200);
  });

  it("sends nothing to a deactivated account", async () => {
    const person = await createActivePerson();
    const admin = await signInAs("admin");
    expect((await http().patch(`/api/users/${person.id}`).set("cookie", admin).send({ status: "deactivated" })).status).toBe(200);
    expect((await requestReset(person.email)).status).toBe(202);
    const event = await testDb()("account_events").where({ subject_email: person.email, kind: "password_reset_requested" }).first();
    expect(JSON.parse(event.details)).toEqual({ mailed: false, reason: "account deactivated" });
    expect(await mailsTo(person.email)).toHaveLength(1); // the invitation only
  });
});
