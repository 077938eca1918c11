import { NextResponse } from "next/server";
import { InviteUserSchema } from "@/lib/schemas/people";
import { clientIp, readJson, route } from "@/server/http";
import { inviteUser } from "@/server/invitations";

// POST /api/users/invitations - create an invited account and mail its single-use link (48 h)
export const POST = route(["admin"], async ({ req, user }) => {
  const invite = await readJson(req, InviteUserSchema);
  const invited = await inviteUser({ actor: user, invite, ip: clientIp(req) });
  return NextResponse.json({ user: invited }, { status: 201 });
});
