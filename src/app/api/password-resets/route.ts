import { NextResponse } from "next/server";
import { PasswordResetRequestSchema } from "@/lib/schemas/people";
import { clientIp, publicRoute, readJson } from "@/server/http";
import { requestPasswordReset, RESET_REQUEST_ANSWER } from "@/server/password-resets";

// POST /api/password-resets - mail a reset link (1 h) if the address has an active account; same answer either way
export const POST = publicRoute(async ({ req }) => {
  const { email } = await readJson(req, PasswordResetRequestSchema);
  await requestPasswordReset({ email, ip: clientIp(req) });
  return NextResponse.json(RESET_REQUEST_ANSWER, { status: 202 });
});
