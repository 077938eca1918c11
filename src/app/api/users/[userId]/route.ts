import { UpdateUserSchema } from "@/lib/schemas/people";
import { updateAccount } from "@/server/account-changes";
import { clientIp, readJson, route } from "@/server/http";
import { getUserView } from "@/server/users";

type Params = { userId: string };

// GET /api/users/{id} - one person as the People page shows them
export const GET = route<Params>(["admin"], async ({ params }) => ({ user: await getUserView(params.userId) }));

// PATCH /api/users/{id} - change role, status (active/deactivated), name, licence or station
export const PATCH = route<Params>(["admin"], async ({ req, params, user }) => {
  const change = await readJson(req, UpdateUserSchema);
  return { user: await updateAccount({ actor: user, userId: params.userId, change, ip: clientIp(req) }) };
});
