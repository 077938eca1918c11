"use server";

import { headers } from "next/headers";
import { redirect } from "next/navigation";
import { z } from "zod";
import { SignInSchema } from "@/lib/schemas/session";
import { setSessionCookie } from "@/server/auth";
import { AppError } from "@/server/errors";
import { signIn } from "@/server/sign-in";

export interface SignInState {
  message?: string;
  errors?: Partial<Record<"email" | "password", string>>;
  email?: string;
}

/** Only same-site paths may follow a sign-in, never another host. */
function safeNext(value: FormDataEntryValue | null): string {
  const next = typeof value === "string" ? value : "/";
  return next.startsWith("/") && !next.startsWith("//") ? next : "/";
}

export async function signInAction(_prev: SignInState, formData: FormData): Promise<SignInState> {
  const parsed = SignInSchema.safeParse({ email: formData.get("email"), password: formData.get("password") });
  const email = String(formData.get("email") ?? "");
  if (!parsed.success) {
    const fields = z.flattenError(parsed.error).fieldErrors;
    return { email, errors: { email: fields.email?.[0], password: fields.password?.[0] } };
  }
  const h = await headers();
  const ip = (h.get("x-forwarded-for")?.split(",")[0] ?? "local").trim();
  try {
    const { sessionId } = await signIn({ ...parsed.data, ip });
    await setSessionCookie(sessionId);
  } catch (error) {
    if (error instanceof AppError) return { email, message: error.message };
    throw error;
  }
  redirect(safeNext(formData.get("next")));
}
