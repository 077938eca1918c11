import { NextResponse } from "next/server";
import { IdempotencyKeySchema, SwapSchema } from "@/lib/schemas/swaps";
import { AppError } from "@/server/errors";
import { route } from "@/server/http";
import { recordSwap } from "@/server/swaps";

/** Licensed staff sign maintenance records; admins administer, they do not sign work. */
export const SWAP_SIGNERS = ["technician", "inspector"] as const;

// POST /api/swaps - record one off/on change at one position
export const POST = route(SWAP_SIGNERS, async ({ req, user }) => {
  const key = IdempotencyKeySchema.safeParse(req.headers.get("idempotency-key") ?? undefined);
  if (!key.success) {
    throw new AppError("invalid", key.error.issues[0].message, "invalid", { "Idempotency-Key": key.error.issues[0].message });
  }
  const text = await req.text();
  let raw: unknown;
  try {
    raw = JSON.parse(text);
  } catch {
    throw new AppError("malformed", "The request body is not valid JSON.", "malformed");
  }
  const swap = SwapSchema.parse(raw);
  const result = await recordSwap({ swap, rawBody: raw, idempotencyKey: key.data, actor: user });
  return NextResponse.json(result.body, { status: result.status });
});
