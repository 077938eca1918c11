import { afterAll, describe, expect, it } from "vitest";
import { http, signInAs, testDb } from "../support/api";
import { createActivePerson, invite, uniqueIp } from "../support/people";

afterAll(async () => {
  await testDb().destroy();
});

const patch = (cookie: string, id: string, body: Record<string, unknown>) => http().patch(`/api/users/${id}`).set("cookie", cookie).send(body);

describe("changing roles", () => {
  it("lets an admin change someone's role, which applies on their next request", async () => {
    const admin = await signInAs("admin");
    const person = await createActivePerson({ role: "stores", licenceNumber: null, licenceExpiresOn: null });
    expect((await http().get("/api/users").set("cookie", person.cookie)).status).toBe(403);

    const changed = await patch(admin, person.id, { role: "auditor" });
    expect(changed.status, changed.text).toBe(200);
    expect(changed.body.user.role).toBe("auditor");
    expect((await http().get("/api/account-events").set("cookie", person.cookie)).status).toBe(200);
  });

  it("needs a licence when someone becomes a technician or inspector", async () => {
    const admin = await signInAs("admin");
    const person = await createActivePerson({ role: "stores", licenceNumber: null, licenceExpiresOn: null });
    const refused = await patch(admin, person.id, { role: "technician" });
    expect(refused.status).toBe(422);
    expect(refused.body.error.fields).toHaveProperty("licenceNumber");
    const ok = await patch(admin, person.id, { role: "technician", licenceNumber: "QL-B1-55120", licenceExpiresOn: "2029-01-31" });
    expect(ok.status).toBe(200);
  });

  it("never lets a person change their own role or deactivate themselves", async () => {
    const admin = await signInAs("admin");
    const ownRole = await patch(admin, "usr-admin", { role: "auditor" });
    expect(ownRole.status).toBe(409);
    expect(ownRole.body.error.code).toBe("own_account");
    expect(ownRole.body.error.message).toMatch(/cannot change your own role/);
    const ownStatus = await patch(admin, "usr-admin", { status: "deactivated" });
    expect(ownStatus.status).toBe(409);
    expect(ownStatus.body.error.message).toMatch(/cannot deactivate your own account/);
    const seeded = await testDb()("users").where({ id: "usr-admin" }).first();
    expect(seeded).toMatchObject({ role: "admin", status: "active" });
    // Their own licence they may keep up to date.
    expect((await patch(admin, "usr-admin", { licenceExpiresOn: "2028-06-30" })).status).toBe(200);
  });

  it("counts active admins: a second admin can be demoted, and may not demote themselves", async () => {
    const admin = await signInAs("admin");
    const second = await createActivePerson({ role: "admin", licenceNumber: null, licenceExpiresOn: null });
    const third = await createActivePerson({ role: "admin", licenceNumber: null, licenceExpiresOn: null });
    expect((await patch(second.cookie, second.id, { role: "stores" })).body.error.code).toBe("own_account");
    expect((await patch(second.cookie, third.id, { role: "stores" })).status).toBe(200);
    expect((await patch(admin, second.id, { status: "deactivated" })).status).toBe(200);
    // A demoted or deactivated admin can no longer act as one.
    expect((await patch(third.cookie, second.id, { status: "active" })).status).toBe(403);
    expect((await patch(second.cookie, third.id, { role: "admin" })).status).toBe(401);
  });

  it("refuses an unknown person with 404 and a status it does not know with 422", async () => {
    const admin = await signInAs("admin");
    expect((await patch(admin, "usr-nobody", { role: "stores" })).status).toBe(404);
    const bad = await patch(admin, "usr-stores", { status: "invited" });
    expect(bad.status).toBe(422);
    expect(bad.body.error.fields).toHaveProperty("status");
    expect((await patch(admin, "usr-stores", {})).status).toBe(422);
    expect((await patch(admin, "usr-stores", { password_hash: "x" })).status).toBe(422);
  });
});

describe("deactivating and reactivating", () => {
  it("ends the person's sessions at once and refuses their sign-in with a clear message", async () => {
    const admin = await signInAs("admin");
    const person = await createActivePerson();
    expect((await http().get("/api/session").set("cookie", person.cookie)).status).toBe(200);

    const off = await patch(admin, person.id, { status: "deactivated" });
    expect(off.status).toBe(200);
    expect(off.body.user.status).toBe("deactivated");
    const [{ count }] = await testDb()("user_sessions").where({ user_id: person.id }).count({ count: "*" });
    expect(Number(count)).toBe(0);
    expect((await http().get("/api/session").set("cookie", person.cookie)).status).toBe(401);
    expect((await http().get("/").set("cookie", person.cookie)).headers.location).toMatch(/\/sign-in/);

    const refused = await http().post("/api/session").set("x-forwarded-for", uniqueIp()).send({ email: person.email, password: person.password });
    expect(refused.status).toBe(403);
    expect(refused.body.error.code).toBe("account_deactivated");
    expect(refused.body.error.message).toMatch(/deactivated/);

    const on = await patch(admin, person.id, { status: "active" });
    expect(on.body.user.status).toBe("active");
    expect((await http().post("/api/session").set("x-forwarded-for", uniqueIp()).send({ email: person.email, password: person.password })).status).toBe(200);
  });

  it("refuses the next request of a session whose user was deactivated behind the app's back", async () => {
    const person = await createActivePerson();
    await testDb()("users").where({ id: person.id }).update({ status: "deactivated" });
    expect((await http().get("/api/session").set("cookie", person.cookie)).status).toBe(401);
  });

  it("withdraws an open invitation and puts an invited person back to invited on reactivation", async () => {
    const admin = await signInAs("admin");
    const { user } = await invite(admin);
    expect((await patch(admin, user.id, { status: "deactivated" })).status).toBe(200);
    const open = await testDb()("account_tokens").where({ user_id: user.id }).whereNull("revoked_at").whereNull("used_at");
    expect(open).toHaveLength(0);
    const back = await patch(admin, user.id, { status: "active" });
    expect(back.body.user.status).toBe("invited");
  });
});

describe("the People list", () => {
  it("shows role, licence with expiry state, station, status and last sign-in, with filters", async () => {
    const admin = await signInAs("admin");
    const soon = new Date(Date.now() + 10 * 86_400_000).toISOString().slice(0, 10);
    const expiring = await createActivePerson({ name: "Wendeline Okafor", licenceExpiresOn: soon, stationCode: "QSH" });
    const expired = await createActivePerson({ name: "Barnaby Tolliver" });
    const past = new Date(Date.now() - 40 * 86_400_000).toISOString().slice(0, 10);
    await patch(admin, expired.id, { licenceExpiresOn: past });

    const all = await http().get("/api/users").set("cookie", admin);
    expect(all.status).toBe(200);
    const row = all.body.users.find((u: { id: string }) => u.id === expiring.id);
    expect(row).toMatchObject({ role: "technician", status: "active", licenceStatus: "expiring", station: { code: "QSH" } });
    expect(row.licenceDaysLeft).toBeGreaterThanOrEqual(9);
    expect(all.body.stations.map((s: { code: string }) => s.code)).toEqual(["QNF", "QSH"]);

    const expiredOnly = await http().get("/api/users?licence=expired").set("cookie", admin);
    expect(expiredOnly.body.users.map((u: { id: string }) => u.id)).toContain(expired.id);
    expect(expiredOnly.body.users.every((u: { licenceStatus: string }) => u.licenceStatus === "expired")).toBe(true);

    const filtered = await http().get("/api/users?role=technician&status=active&station=QSH&q=Wendeline").set("cookie", admin);
    expect(filtered.body.users.map((u: { id: string }) => u.id)).toEqual([expiring.id]);
    expect((await http().get("/api/users?status=gone").set("cookie", admin)).status).toBe(422);

    const page = await http().get("/people?q=Tolliver").set("cookie", admin);
    expect(page.status).toBe(200);
    expect(page.text).toContain("Barnaby Tolliver");
    expect(page.text).toMatch(/Expired \d+ days ago/);
  });
});
