import { AccountEventQuerySchema } from "@/lib/schemas/people";
import { AREA_ROLES } from "@/lib/roles";
import { listAccountEvents } from "@/server/account-events";
import { readQuery, route } from "@/server/http";

// GET /api/account-events - the account audit trail, newest first; filters kind, user, q, from, to; paged by `before`
export const GET = route(AREA_ROLES["account-audit"], async ({ req }) => {
  const { events, nextBefore } = await listAccountEvents(readQuery(req, AccountEventQuerySchema));
  return { events, nextBefore };
});
