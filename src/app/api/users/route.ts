import { UserListQuerySchema } from "@/lib/schemas/people";
import { readQuery, route } from "@/server/http";
import { listStations, listUsers } from "@/server/users";

// GET /api/users - people with role, licence, station, status and last sign-in; filters role, status, station, licence, q
export const GET = route(["admin"], async ({ req }) => {
  const filters = readQuery(req, UserListQuerySchema);
  const [users, stations] = await Promise.all([listUsers(filters), listStations()]);
  return { users, stations };
});
