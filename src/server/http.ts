import "server-only";
import { NextResponse, type NextRequest } from "next/server";
import { ZodError, type ZodType } from "zod";
import type { User } from "lucia";
import type { Role } from "@/lib/roles";
import { validateRequest } from "./auth";
import { DomainInputError } from "@/domain/errors";
import { AppError } from "./errors";

type ErrorBody = { error: { code: string; message: string; fields?: Record<string, string> } };

export function errorResponse(error: unknown): NextResponse<ErrorBody> {
  if (error instanceof AppError) {
    return NextResponse.json(
      { error: { code: error.code, message: error.message, ...(error.fields ? { fields: error.fields } : {}) } },
      { status: error.status, headers: error.headers },
    );
  }
  if (error instanceof DomainInputError) {
    const field = error.field ?? "body";
    return NextResponse.json({ error: { code: "invalid", message: error.message, fields: { [field]: error.message } } }, { status: 422 });
  }
  if (error instanceof ZodError) {
    const fields = zodFields(error);
    const message = Object.entries(fields)
      .map(([field, problem]) => `${field}: ${problem}`)
      .join("; ");
    return NextResponse.json({ error: { code: "invalid", message, fields } }, { status: 422 });
  }
  console.error("unexpected error in a route handler", error);
  return NextResponse.json(
    { error: { code: "internal", message: "Something went wrong on the server. Nothing was saved; try again." } },
    { status: 500 },
  );
}

export function zodFields(error: ZodError): Record<string, string> {
  const fields: Record<string, string> = {};
  for (const issue of error.issues) {
    const key = issue.path.length ? issue.path.join(".") : "body";
    fields[key] ??= issue.message;
  }
  return fields;
}

/** Reads a JSON body: 400 when it is not JSON, 422 (naming each field) when it does not fit the schema. */
export async function readJson<T>(req: Request, schema: ZodType<T>): Promise<T> {
  let body: unknown;
  const text = await req.text();
  try {
    body = text.length ? JSON.parse(text) : undefined;
  } catch {
    throw new AppError("malformed", "The request body is not valid JSON.", "malformed");
  }
  if (body === undefined) throw new AppError("malformed", "The request needs a JSON body.", "malformed");
  return schema.parse(body);
}

export function readQuery<T>(req: NextRequest, schema: ZodType<T>): T {
  return schema.parse(Object.fromEntries(req.nextUrl.searchParams.entries()));
}

const MUTATIONS = new Set(["POST", "PUT", "PATCH", "DELETE"]);

/**
 * Cookie sessions make cross-site forms a risk: a mutation whose Origin names another site is refused.
 * Clients that send no Origin (scripts, curl) are not browsers acting for someone else, so they pass.
 */
export function checkOrigin(req: NextRequest): void {
  if (!MUTATIONS.has(req.method)) return;
  const origin = req.headers.get("origin");
  if (!origin) return;
  const host = req.headers.get("x-forwarded-host") ?? req.headers.get("host");
  let originHost: string;
  try {
    originHost = new URL(origin).host;
  } catch {
    throw new AppError("forbidden", "The request's Origin header is not a valid origin.", "bad_origin");
  }
  if (!host || originHost !== host) {
    throw new AppError("forbidden", "Cross-site requests are refused: this request came from another origin.", "bad_origin");
  }
}

export function clientIp(req: NextRequest): string {
  return (req.headers.get("x-forwarded-for")?.split(",")[0] ?? req.headers.get("x-real-ip") ?? "local").trim().slice(0, 64);
}

interface Context<P> {
  req: NextRequest;
  params: P;
}
interface AuthedContext<P> extends Context<P> {
  user: User;
}

type Result = Response | Record<string, unknown> | unknown[];

/**
 * Every route handler goes through here: await params, refuse foreign origins on mutations,
 * require a session and one of the roles, and turn any error into the contract's JSON error.
 */
export function route<P = Record<string, string>>(
  roles: readonly Role[],
  handler: (ctx: AuthedContext<P>) => Promise<Result>,
): (req: NextRequest, segment: { params: Promise<P> }) => Promise<Response> {
  return async (req, segment) => {
    try {
      checkOrigin(req);
      const params = await segment.params;
      const { user } = await validateRequest();
      if (!user) throw new AppError("unauthenticated", "Sign in first: this needs a signed-in user.", "unauthenticated");
      if (!roles.includes(user.role)) {
        throw new AppError("forbidden", `The ${user.role} role may not do this.`, "forbidden");
      }
      return toResponse(await handler({ req, params, user }));
    } catch (error) {
      return errorResponse(error);
    }
  };
}

/** For the few routes that work without a session (sign-in, password reset). */
export function publicRoute<P = Record<string, string>>(
  handler: (ctx: Context<P>) => Promise<Result>,
): (req: NextRequest, segment: { params: Promise<P> }) => Promise<Response> {
  return async (req, segment) => {
    try {
      checkOrigin(req);
      return toResponse(await handler({ req, params: await segment.params }));
    } catch (error) {
      return errorResponse(error);
    }
  };
}

function toResponse(result: Result): Response {
  return result instanceof Response ? result : NextResponse.json(result);
}
