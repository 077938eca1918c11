"use server";

import { z } from "zod";
import { PasswordResetRequestSchema } from "@/lib/schemas/people";
import { actionClientAddress } from "@/server/client-address";
import { AppError } from "@/server/errors";
import { requestPasswordReset, RESET_REQUEST_ANSWER } from "@/server/password-resets";

export interface RequestResetState {
  sent?: string;
  message?: string;
  errors?: { email?: string };
  email?: string;
}

// Public: anyone may ask; the answer is the same whether or not the address has an account.
export async function requestResetAction(_prev: RequestResetState, formData: FormData): Promise<RequestResetState> {
  const email = String(formData.get("email") ?? "");
  const parsed = PasswordResetRequestSchema.safeParse({ email });
  if (!parsed.success) return { email, errors: { email: z.flattenError(parsed.error).fieldErrors.email?.[0] } };
  try {
    await requestPasswordReset({ email: parsed.data.email, ip: await actionClientAddress() });
  } catch (error) {
    if (error instanceof AppError) return { email, message: error.message };
    throw error;
  }
  return { sent: RESET_REQUEST_ANSWER.message };
}
