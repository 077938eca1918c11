import { SetPasswordSchema } from "@/lib/schemas/people";
import { startSessionAfterPasswordSet } from "@/server/account-sessions";
import { clientIp, publicRoute, readJson } from "@/server/http";
import { completePasswordReset } from "@/server/password-resets";
import { getUserView } from "@/server/users";

// Tokens are 32 random bytes, so this needs no rate limit of its own: guessing one is hopeless.
// POST /api/password-resets/{token} - set a new password, end every other session, sign in
export const POST = publicRoute<{ token: string }>(async ({ req, params }) => {
  const { password } = await readJson(req, SetPasswordSchema);
  const { userId } = await completePasswordReset({ token: params.token, password, ip: clientIp(req) });
  await startSessionAfterPasswordSet(userId);
  const user = await getUserView(userId);
  return { user: { id: user.id, email: user.email, name: user.name, role: user.role } };
});
