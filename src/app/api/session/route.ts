import { NextResponse } from "next/server";
import { SignInSchema } from "@/lib/schemas/session";
import { clearSessionCookie, lucia, setSessionCookie, validateRequest } from "@/server/auth";
import { AppError } from "@/server/errors";
import { clientIp, publicRoute, readJson } from "@/server/http";
import { signIn } from "@/server/sign-in";

// POST /api/session - sign in with e-mail and password; sets the session cookie
export const POST = publicRoute(async ({ req }) => {
  const input = await readJson(req, SignInSchema);
  const { user, sessionId } = await signIn({ ...input, ip: clientIp(req) });
  await setSessionCookie(sessionId);
  return { user };
});

// GET /api/session - who is signed in
export const GET = publicRoute(async () => {
  const { user } = await validateRequest();
  if (!user) throw new AppError("unauthenticated", "Not signed in.", "unauthenticated");
  return { user: { id: user.id, email: user.email, name: user.name, role: user.role } };
});

// DELETE /api/session - sign out
export const DELETE = publicRoute(async () => {
  const { session } = await validateRequest();
  if (session) await lucia().invalidateSession(session.id);
  await clearSessionCookie();
  return new NextResponse(null, { status: 204 });
});
