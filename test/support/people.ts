// Creating people for the People suites through the real HTTP API and the mail inbox.
import { randomBytes } from "node:crypto";
import { expect } from "vitest";
import { http, sessionCookieFrom, signInAs } from "./api";
import { linkIn, waitForMails } from "./mail-inbox";

export const GOOD_PASSWORD = "Kestrel-lantern-ramp-29";

/** An invented address no other test uses. */
export function uniqueEmail(label: string): string {
  return `${label}-${randomBytes(4).toString("hex")}@demo.threadline.test`;
}

/** A client address of its own for each caller, so rate limits of one test never touch another. */
export function uniqueIp(): string {
  const bytes = randomBytes(2);
  return `198.18.${bytes[0]}.${bytes[1]}`;
}

export interface InviteBody {
  name?: string;
  email?: string;
  role?: string;
  licenceNumber?: string | null;
  licenceExpiresOn?: string | null;
  stationCode?: string | null;
}

export function inviteBody(overrides: InviteBody = {}) {
  return {
    name: "Odile Fenwick",
    email: uniqueEmail("invitee"),
    role: "technician",
    licenceNumber: `QL-B1-${randomBytes(2).toString("hex").toUpperCase()}`,
    licenceExpiresOn: "2028-03-31",
    stationCode: "QNF",
    ...overrides,
  };
}

export async function invite(adminCookie: string, overrides: InviteBody = {}) {
  const body = inviteBody(overrides);
  const response = await http().post("/api/users/invitations").set("cookie", adminCookie).send(body);
  expect(response.status, response.text).toBe(201);
  return { body, user: response.body.user as { id: string; email: string; status: string; role: string } };
}

/** Follows the newest invitation mail's link and sets the password; returns the new session cookie. */
export async function acceptLatestInvitation(email: string, password = GOOD_PASSWORD, mailCount = 1): Promise<string> {
  const mails = await waitForMails(email, mailCount);
  const { token } = linkIn(mails[mails.length - 1], "/invitation");
  const response = await http().post(`/api/invitations/${token}/accept`).send({ password });
  expect(response.status, response.text).toBe(200);
  return sessionCookieFrom(response.headers["set-cookie"]);
}

/** An active account of our own making (never one of the seeded demo users). */
export async function createActivePerson(overrides: InviteBody = {}) {
  const admin = await signInAs("admin");
  const { body, user } = await invite(admin, overrides);
  const cookie = await acceptLatestInvitation(body.email);
  return { id: user.id, email: body.email, password: GOOD_PASSWORD, cookie, name: body.name };
}
