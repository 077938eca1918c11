import { clientIp, route } from "@/server/http";
import { resendInvitation } from "@/server/invitations";

// POST /api/users/{id}/invitation/resend - mail a new invitation link; the previous one stops working
export const POST = route<{ userId: string }>(["admin"], async ({ req, params, user }) => ({
  user: await resendInvitation({ actor: user, userId: params.userId, ip: clientIp(req) }),
}));
