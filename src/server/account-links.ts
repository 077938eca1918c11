import "server-only";
import { AppError } from "./errors";
import type { TokenPurpose, TokenState } from "./account-tokens";

// What a person is told about a mailed link that cannot be used, on the page and in the API.

const WHAT: Record<TokenPurpose, { noun: string; again: string }> = {
  invitation: { noun: "invitation link", again: "Ask your administrator to send the invitation again." },
  password_reset: { noun: "password reset link", again: "Ask for a new link from the sign-in page (Forgot password?)." },
};

export function linkRefusal(purpose: TokenPurpose, state: Exclude<TokenState, "usable">): { title: string; message: string } {
  const { noun, again } = WHAT[purpose];
  switch (state) {
    case "used":
      return {
        title: "This link has already been used",
        message:
          purpose === "invitation"
            ? `Each ${noun} works once, and this one has been used. Sign in with the password you chose; if you have forgotten it, use "Forgot password?" on the sign-in page.`
            : `Each ${noun} works once, and this one has been used. Sign in with your new password. ${again}`,
      };
    case "expired":
      return { title: "This link has expired", message: `This ${noun} is no longer valid. ${again}` };
    case "superseded":
      return {
        title: "This link has been replaced",
        message: `A newer ${noun} was sent, or this one was withdrawn. Use the link in the most recent mail. ${again}`,
      };
    case "unknown":
      return { title: "This link is not valid", message: `This ${noun} is not one Threadline sent, or it was copied incompletely. ${again}` };
  }
}

export function linkRefusalError(purpose: TokenPurpose, state: Exclude<TokenState, "usable">): AppError {
  const { message } = linkRefusal(purpose, state);
  if (state === "unknown") return new AppError("not_found", message, "link_unknown");
  return new AppError("conflict", message, `link_${state}`);
}
