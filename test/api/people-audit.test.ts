import { afterAll, describe, expect, it } from "vitest";
import { http, signInAs, testDb } from "../support/api";
import { linkIn, waitForMails } from "../support/mail-inbox";
import { GOOD_PASSWORD, invite, uniqueEmail, uniqueIp } from "../support/people";

afterAll(async () => {
  await testDb().destroy();
});

interface EventView {
  id: number;
  kind: string;
  actor: { id: string } | null;
  subject: { id: string } | null;
  subjectEmail: string | null;
  ip: string | null;
  details: Record<string, unknown> | null;
}

async function eventsFor(cookie: string, query: string): Promise<EventView[]> {
  const response = await http().get(`/api/account-events?${query}`).set("cookie", cookie);
  expect(response.status, response.text).toBe(200);
  return response.body.events;
}

describe("the account audit trail", () => {
  it("records each action on an account: who, whom, what, when and from where", async () => {
    const admin = await signInAs("admin");
    const adminIp = uniqueIp();
    const { body, user } = await invite(admin, { name: "Ingrid Penhallow" });
    await http().post(`/api/users/${user.id}/invitation/resend`).set("cookie", admin).set("x-forwarded-for", adminIp).send({});
    const mails = await waitForMails(body.email, 2);
    const inviteeIp = uniqueIp();
    await http()
      .post(`/api/invitations/${linkIn(mails[1], "/invitation").token}/accept`)
      .set("x-forwarded-for", inviteeIp)
      .send({ password: GOOD_PASSWORD });
    const patch = (change: Record<string, unknown>) =>
      http().patch(`/api/users/${user.id}`).set("cookie", admin).set("x-forwarded-for", adminIp).send(change);
    expect((await patch({ role: "inspector" })).status).toBe(200);
    expect((await patch({ licenceNumber: "QL-B1-60606" })).status).toBe(200);
    expect((await patch({ status: "deactivated" })).status).toBe(200);
    expect((await patch({ status: "active" })).status).toBe(200);
    await http().post("/api/password-resets").set("x-forwarded-for", inviteeIp).send({ email: body.email });
    const resetMail = (await waitForMails(body.email, 3))[2];
    await http()
      .post(`/api/password-resets/${linkIn(resetMail, "/reset-password").token}`)
      .set("x-forwarded-for", inviteeIp)
      .send({ password: "Harbour-quince-tally-84" });

    const events = (await eventsFor(admin, `user=${user.id}&limit=50`)).reverse();
    expect(events.map((e) => e.kind)).toEqual([
      "invitation_sent",
      "invitation_resent",
      "invitation_accepted",
      "role_changed",
      "details_changed",
      "deactivated",
      "reactivated",
      "password_reset_requested",
      "password_reset_completed",
    ]);
    const byKind = Object.fromEntries(events.map((e) => [e.kind, e]));
    expect(byKind.invitation_sent).toMatchObject({ actor: { id: "usr-admin" }, subject: { id: user.id }, subjectEmail: body.email });
    expect(byKind.invitation_resent.ip).toBe(adminIp);
    expect(byKind.invitation_accepted).toMatchObject({ actor: { id: user.id }, ip: inviteeIp });
    expect(byKind.role_changed.details).toEqual({ from: "technician", to: "inspector" });
    expect(byKind.details_changed.details).toMatchObject({ licenceNumber: { to: "QL-B1-60606" } });
    expect(byKind.deactivated.details).toMatchObject({ sessionsEnded: 1 });
    expect(byKind.password_reset_requested).toMatchObject({ actor: null, ip: inviteeIp, details: { mailed: true } });
    expect(byKind.password_reset_completed.actor).toEqual(expect.objectContaining({ id: user.id }));
  });

  it("records a failed sign-in burst once, when the limit is reached", async () => {
    const email = uniqueEmail("burst");
    for (let attempt = 0; attempt < 7; attempt++) {
      await http().post("/api/session").set("x-forwarded-for", uniqueIp()).send({ email, password: `guess-${attempt}` });
    }
    const auditor = await signInAs("auditor");
    const events = await eventsFor(auditor, `kind=sign_in_locked&q=${encodeURIComponent(email)}`);
    expect(events).toHaveLength(1);
    expect(events[0]).toMatchObject({ subjectEmail: email, details: { lockedBy: "address", failures: 5, windowMinutes: 15 } });
  });

  it("is readable by auditors and admins only, with filters and pages", async () => {
    const auditor = await signInAs("auditor");
    const first = await http().get("/api/account-events?limit=2").set("cookie", auditor);
    expect(first.status).toBe(200);
    expect(first.body.events).toHaveLength(2);
    expect(first.body.events[0].id).toBeGreaterThan(first.body.events[1].id);
    const next = await http().get(`/api/account-events?limit=2&before=${first.body.nextBefore}`).set("cookie", auditor);
    expect(next.body.events[0].id).toBeLessThan(first.body.events[1].id);
    const invitations = await eventsFor(auditor, "kind=invitation_sent");
    expect(invitations.length).toBeGreaterThan(0);
    expect(invitations.every((e) => e.kind === "invitation_sent")).toBe(true);
    expect((await http().get("/api/account-events?kind=nonsense").set("cookie", auditor)).status).toBe(422);

    for (const role of ["technician", "inspector", "stores", "reliability"] as const) {
      expect((await http().get("/api/account-events").set("cookie", await signInAs(role))).status, role).toBe(403);
    }
    const page = await http().get("/people/audit").set("cookie", auditor);
    expect(page.status).toBe(200);
    expect(page.text).toContain("Account audit");
  });

  it("cannot be changed: no write route, and the database refuses UPDATE and DELETE", async () => {
    const admin = await signInAs("admin");
    for (const method of ["post", "patch", "put", "delete"] as const) {
      expect((await http()[method]("/api/account-events").set("cookie", admin).send({})).status, method).toBe(405);
    }
    const [row] = await testDb()("account_events").orderBy("id", "desc").limit(1);
    await expect(testDb().raw("UPDATE account_events SET kind = 'role_changed' WHERE id = ?", [row.id])).rejects.toThrow(/append-only/);
    await expect(testDb().raw("DELETE FROM account_events WHERE id = ?", [row.id])).rejects.toThrow(/append-only/);
    const still = await testDb()("account_events").where({ id: row.id }).first();
    expect(still.kind).toBe(row.kind);
  });
});
