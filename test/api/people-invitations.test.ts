import { createHash } from "node:crypto";
import { afterAll, describe, expect, it } from "vitest";
import { http, sessionCookieFrom, signInAs, testDb } from "../support/api";
import { linkIn, waitForMails } from "../support/mail-inbox";
import { GOOD_PASSWORD, acceptLatestInvitation, invite, inviteBody } from "../support/people";

afterAll(async () => {
  await testDb().destroy();
});

const sha256 = (text: string) => createHash("sha256").update(text).digest("hex");

describe("inviting a person by e-mail", () => {
  it("mails a single-use link; the invitee sets a password and is signed in", async () => {
    const admin = await signInAs("admin");
    const { body, user } = await invite(admin, { name: "Rosalind Quarrie", role: "inspector" });
    expect(user).toMatchObject({ email: body.email, role: "inspector", status: "invited" });

    const [mail] = await waitForMails(body.email);
    expect(mail.subject).toBe("Your Threadline invitation");
    expect(mail.text).toContain("Caspian Threlkeld has invited you to Threadline as Inspector");
    const { url, token } = linkIn(mail, "/invitation");
    expect(new URL(url).pathname).toBe(`/invitation/${token}`);

    const page = await http().get(`/invitation/${token}`);
    expect(page.status).toBe(200);
    expect(page.text).toContain("Choose your password");
    expect(page.text).toContain("Rosalind Quarrie");

    const accepted = await http().post(`/api/invitations/${token}/accept`).send({ password: GOOD_PASSWORD });
    expect(accepted.status, accepted.text).toBe(200);
    expect(accepted.body.user).toMatchObject({ id: user.id, email: body.email, role: "inspector" });
    const cookie = sessionCookieFrom(accepted.headers["set-cookie"]);
    const who = await http().get("/api/session").set("cookie", cookie);
    expect(who.status).toBe(200);
    expect(who.body.user.email).toBe(body.email);

    const listed = await http().get(`/api/users?q=${encodeURIComponent(body.email)}`).set("cookie", admin);
    expect(listed.body.users).toHaveLength(1);
    expect(listed.body.users[0].status).toBe("active");
    expect(listed.body.users[0].lastSignInAt).not.toBeNull();

    // And the password works for an ordinary sign-in afterwards.
    expect((await http().post("/api/session").send({ email: body.email, password: GOOD_PASSWORD })).status).toBe(200);
  });

  it("stores only the SHA-256 of each token", async () => {
    const admin = await signInAs("admin");
    const { body, user } = await invite(admin);
    const { token } = linkIn((await waitForMails(body.email))[0], "/invitation");
    const rows = await testDb()("account_tokens").where({ user_id: user.id });
    expect(rows).toHaveLength(1);
    expect(rows[0].token_hash).toBe(sha256(token));
    expect(JSON.stringify(rows)).not.toContain(token);
    expect(token).toMatch(/^[A-Za-z0-9_-]{43}$/); // 32 random bytes, base64url
  });

  it("refuses a link that was already used, with a clear page", async () => {
    const admin = await signInAs("admin");
    const { body } = await invite(admin);
    const { token } = linkIn((await waitForMails(body.email))[0], "/invitation");
    expect((await http().post(`/api/invitations/${token}/accept`).send({ password: GOOD_PASSWORD })).status).toBe(200);

    const again = await http().post(`/api/invitations/${token}/accept`).send({ password: "Another-long-phrase-77" });
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe("link_used");
    const page = await http().get(`/invitation/${token}`);
    expect(page.status).toBe(200);
    expect(page.text).toContain("This link has already been used");
    expect(page.text).not.toMatch(/Something went wrong/);
  });

  it("refuses an expired link, with a clear page", async () => {
    const admin = await signInAs("admin");
    const { body } = await invite(admin);
    const { token } = linkIn((await waitForMails(body.email))[0], "/invitation");
    await testDb()("account_tokens").where({ token_hash: sha256(token) }).update({ expires_at: new Date(Date.now() - 60_000) });

    const page = await http().get(`/invitation/${token}`);
    expect(page.status).toBe(200);
    expect(page.text).toContain("This link has expired");
    const accept = await http().post(`/api/invitations/${token}/accept`).send({ password: GOOD_PASSWORD });
    expect(accept.status).toBe(409);
    expect(accept.body.error.code).toBe("link_expired");
    expect(accept.body.error.message).toMatch(/send the invitation again/i);
  });

  it("gives links 48 hours", async () => {
    const admin = await signInAs("admin");
    const { user } = await invite(admin);
    const [row] = await testDb()("account_tokens").where({ user_id: user.id });
    expect(new Date(row.expires_at).getTime() - new Date(row.created_at).getTime()).toBe(48 * 60 * 60_000);
  });

  it("re-sending replaces the link: the earlier one stops working", async () => {
    const admin = await signInAs("admin");
    const { body, user } = await invite(admin);
    const first = linkIn((await waitForMails(body.email, 1))[0], "/invitation").token;

    const resent = await http().post(`/api/users/${user.id}/invitation/resend`).set("cookie", admin).send({});
    expect(resent.status, resent.text).toBe(200);
    const mails = await waitForMails(body.email, 2);
    const second = linkIn(mails[1], "/invitation").token;
    expect(second).not.toBe(first);

    const old = await http().post(`/api/invitations/${first}/accept`).send({ password: GOOD_PASSWORD });
    expect(old.status).toBe(409);
    expect(old.body.error.code).toBe("link_superseded");
    expect((await http().get(`/invitation/${first}`)).text).toContain("This link has been replaced");

    await acceptLatestInvitation(body.email, GOOD_PASSWORD, 2);
    const again = await http().post(`/api/users/${user.id}/invitation/resend`).set("cookie", admin).send({});
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe("not_invited");
  });

  it("answers a link Threadline never sent with a clear page and 404 from the API", async () => {
    const made = "A".repeat(43);
    const page = await http().get(`/invitation/${made}`);
    expect(page.status).toBe(200);
    expect(page.text).toContain("This link is not valid");
    const accept = await http().post(`/api/invitations/${made}/accept`).send({ password: GOOD_PASSWORD });
    expect(accept.status).toBe(404);
    expect(accept.body.error.code).toBe("link_unknown");
    expect((await http().post("/api/invitations/not-a-token/accept").send({ password: GOOD_PASSWORD })).status).toBe(404);
  });

  it("refuses a short or common password with 422 naming the field, and keeps the link usable", async () => {
    const admin = await signInAs("admin");
    const { body } = await invite(admin);
    const { token } = linkIn((await waitForMails(body.email))[0], "/invitation");
    for (const password of ["short-one", "password12345", "qwertyuiop!!", "111111111111"]) {
      const response = await http().post(`/api/invitations/${token}/accept`).send({ password });
      expect(response.status, password).toBe(422);
      expect(response.body.error.fields).toHaveProperty("password");
    }
    expect((await http().post(`/api/invitations/${token}/accept`).send({ password: GOOD_PASSWORD })).status).toBe(200);
  });
});

describe("the invitation form's checks", () => {
  it("needs a licence number and expiry for technicians and inspectors", async () => {
    const admin = await signInAs("admin");
    const noNumber = await http().post("/api/users/invitations").set("cookie", admin).send(inviteBody({ licenceNumber: "" }));
    expect(noNumber.status).toBe(422);
    expect(noNumber.body.error.fields).toHaveProperty("licenceNumber");
    const noExpiry = await http().post("/api/users/invitations").set("cookie", admin).send(inviteBody({ licenceExpiresOn: null }));
    expect(noExpiry.status).toBe(422);
    expect(noExpiry.body.error.fields).toHaveProperty("licenceExpiresOn");
    const stores = await http()
      .post("/api/users/invitations")
      .set("cookie", admin)
      .send(inviteBody({ role: "stores", licenceNumber: null, licenceExpiresOn: null }));
    expect(stores.status).toBe(201);
  });

  it("names each bad field, and refuses an address that already has an account", async () => {
    const admin = await signInAs("admin");
    const bad = await http()
      .post("/api/users/invitations")
      .set("cookie", admin)
      .send({ name: "", email: "not-an-address", role: "pilot", licenceExpiresOn: "2027-02-30" });
    expect(bad.status).toBe(422);
    expect(Object.keys(bad.body.error.fields)).toEqual(expect.arrayContaining(["name", "email", "role", "licenceExpiresOn"]));

    const station = await http().post("/api/users/invitations").set("cookie", admin).send(inviteBody({ stationCode: "ZZZ" }));
    expect(station.status).toBe(422);
    expect(station.body.error.fields.stationCode).toMatch(/QNF/);

    const taken = await http()
      .post("/api/users/invitations")
      .set("cookie", admin)
      .send(inviteBody({ email: "  Technician@demo.threadline.test " }));
    expect(taken.status).toBe(409);
    expect(taken.body.error.code).toBe("email_taken");

    const malformed = await http().post("/api/users/invitations").set("cookie", admin).set("content-type", "application/json").send("{nope");
    expect(malformed.status).toBe(400);
  });

  it("is for administrators only", async () => {
    expect((await http().get("/api/users")).status).toBe(401);
    const technician = await signInAs("technician");
    expect((await http().get("/api/users").set("cookie", technician)).status).toBe(403);
    expect((await http().post("/api/users/invitations").set("cookie", technician).send(inviteBody())).status).toBe(403);
    expect((await http().patch("/api/users/usr-stores").set("cookie", technician).send({ role: "admin" })).status).toBe(403);
    const page = await http().get("/people").set("cookie", technician);
    expect(page.status).toBe(403);
  });
});
