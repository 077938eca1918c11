import "server-only";
import type { SetPasswordState } from "@/lib/schemas/people";
import { actionClientAddress } from "./client-address";
import { startSessionAfterPasswordSet } from "./account-sessions";
import { AppError } from "./errors";

/**
 * The shared body of the two server actions that set a password from a mailed link: both passwords
 * must match, then `use` checks the link and the password policy. Returns state to show, or null
 * when the person is now signed in (the action then redirects).
 */
export async function setPasswordFromLink(
  formData: FormData,
  use: (input: { password: string; ip: string }) => Promise<{ userId: string }>,
): Promise<SetPasswordState | null> {
  const password = String(formData.get("password") ?? "");
  const confirm = String(formData.get("confirm") ?? "");
  if (!password) return { errors: { password: "Choose a password." } };
  if (password !== confirm) return { errors: { confirm: "The two passwords are not the same: type the new password again." } };
  try {
    const { userId } = await use({ password, ip: await actionClientAddress() });
    await startSessionAfterPasswordSet(userId);
    return null;
  } catch (error) {
    if (error instanceof AppError) {
      if (error.fields?.password) return { errors: { password: error.fields.password } };
      return { message: error.message };
    }
    throw error;
  }
}
