import "server-only";
import { Mysql2Adapter } from "@lucia-auth/adapter-mysql";
import { Lucia, TimeSpan, type Session, type User } from "lucia";
import { cookies, headers } from "next/headers";
import { cache } from "react";
import type { Role } from "@/lib/roles";
import { pool } from "./db";


interface DatabaseUserAttributes {
  email: string;
  name: string;
  role: Role;
  licence_number: string | null;
  licence_expires_on: Date | string | null;
  status: "invited" | "active" | "deactivated";
}

function createLucia() {
  return new Lucia(new Mysql2Adapter(pool(), { user: "users", session: "user_sessions" }), {
    // A shift and then some; lucia extends a session that is used in its second half.
    sessionExpiresIn: new TimeSpan(12, "h"),
    sessionCookie: {
      name: "threadline_session",
      expires: true,
      attributes: { sameSite: "lax", secure: false },
    },
    getUserAttributes: (attributes) => ({
      email: attributes.email,
      name: attributes.name,
      role: attributes.role,
      licenceNumber: attributes.licence_number,
      licenceExpiresOn: toIsoDate(attributes.licence_expires_on),
      status: attributes.status,
    }),
  });
}

const globalForAuth = globalThis as unknown as { threadlineLucia?: ReturnType<typeof createLucia> };

export function lucia() {
  globalForAuth.threadlineLucia ??= createLucia();
  return globalForAuth.threadlineLucia;
}

function toIsoDate(value: Date | string | null): string | null {
  if (value === null) return null;
  if (value instanceof Date) return value.toISOString().slice(0, 10);
  return String(value).slice(0, 10);
}

declare module "lucia" {
  interface Register {
    Lucia: ReturnType<typeof createLucia>;
    DatabaseUserAttributes: DatabaseUserAttributes;
  }
}

export type SessionUser = User;

/** Secure cookies everywhere except plain-http loopback, where browsers would drop them. */
async function cookieIsSecure(): Promise<boolean> {
  const h = await headers();
  const proto = h.get("x-forwarded-proto") ?? (process.env.APP_URL?.startsWith("https:") ? "https" : "http");
  const host = (h.get("host") ?? "").replace(/:\d+$/, "").replace(/^\[|\]$/g, "");
  const loopback = host === "localhost" || host === "127.0.0.1" || host === "::1";
  return proto === "https" || !loopback;
}

export async function setSessionCookie(sessionId: string): Promise<void> {
  const cookie = lucia().createSessionCookie(sessionId);
  (await cookies()).set(cookie.name, cookie.value, { ...cookie.attributes, secure: await cookieIsSecure() });
}

export async function clearSessionCookie(): Promise<void> {
  const cookie = lucia().createBlankSessionCookie();
  (await cookies()).set(cookie.name, cookie.value, { ...cookie.attributes, secure: await cookieIsSecure() });
}

/**
 * The signed-in user of this request, or null. Loaded once per request (React cache).
 * A deactivated user's sessions are ended here, on their next request.
 */
export const validateRequest = cache(async (): Promise<{ user: User; session: Session } | { user: null; session: null }> => {
  const sessionId = (await cookies()).get(lucia().sessionCookieName)?.value ?? null;
  if (!sessionId) return { user: null, session: null };
  const result = await lucia().validateSession(sessionId);
  if (result.user && result.user.status !== "active") {
    await lucia().invalidateUserSessions(result.user.id);
    await clearSessionCookieIfAllowed();
    return { user: null, session: null };
  }
  try {
    if (result.session?.fresh) await setSessionCookie(result.session.id);
    if (!result.session) await clearSessionCookie();
  } catch {
    // Server components may not set cookies; the next route handler or action will.
  }
  return result;
});

async function clearSessionCookieIfAllowed() {
  try {
    await clearSessionCookie();
  } catch {
    // as above
  }
}
