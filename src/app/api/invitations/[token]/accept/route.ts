import { SetPasswordSchema } from "@/lib/schemas/people";
import { startSessionAfterPasswordSet } from "@/server/account-sessions";
import { getUserView } from "@/server/users";
import { clientIp, publicRoute, readJson } from "@/server/http";
import { acceptInvitation } from "@/server/invitations";

// Tokens are 32 random bytes, so this needs no rate limit of its own: guessing one is hopeless.
// POST /api/invitations/{token}/accept - set the invited person's password and sign them in
export const POST = publicRoute<{ token: string }>(async ({ req, params }) => {
  const { password } = await readJson(req, SetPasswordSchema);
  const { userId } = await acceptInvitation({ token: params.token, password, ip: clientIp(req) });
  await startSessionAfterPasswordSet(userId);
  const user = await getUserView(userId);
  return { user: { id: user.id, email: user.email, name: user.name, role: user.role } };
});
