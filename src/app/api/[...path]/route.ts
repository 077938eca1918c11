import { AppError } from "@/server/errors";
import { publicRoute } from "@/server/http";

// Any /api path no route matches (a mistyped address, or "." / ".." segments that the URL resolved
// away): the JSON error every API client expects, not the HTML not-found page. Needs no session:
// it says nothing about data, as the HTML page would not either.
const noSuchRoute = publicRoute<{ path: string[] }>(async ({ req }) => {
  throw new AppError("not_found", `There is no API route ${req.method} ${req.nextUrl.pathname}.`, "no_such_route");
});

// GET /api/{anything else} - 404 in JSON
export const GET = noSuchRoute;
// POST /api/{anything else} - 404 in JSON
export const POST = noSuchRoute;
// PATCH /api/{anything else} - 404 in JSON
export const PATCH = noSuchRoute;
// PUT /api/{anything else} - 404 in JSON
export const PUT = noSuchRoute;
// DELETE /api/{anything else} - 404 in JSON
export const DELETE = noSuchRoute;
