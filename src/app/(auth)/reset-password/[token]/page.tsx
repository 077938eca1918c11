import type { Metadata } from "next";
import { AuthCard } from "@/components/auth/auth-card";
import { LinkRefusal } from "@/components/auth/link-refusal";
import { SetPasswordForm } from "@/components/auth/set-password-form";
import { linkRefusal } from "@/server/account-links";
import { resetForPage } from "@/server/password-resets";
import { completeResetAction } from "./complete-reset-action";

// The token is in the address: never send it on to another site.
export const metadata: Metadata = { title: "Choose a new password", referrer: "no-referrer" };

export default async function ResetPasswordPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const reset = await resetForPage(token);
  if (reset.state !== "usable" || !reset.email) {
    return (
      <LinkRefusal
        {...linkRefusal("password_reset", reset.state === "usable" ? "unknown" : reset.state)}
        retryHref="/reset-password"
        retryLabel="Ask for a new link"
      />
    );
  }
  return (
    <AuthCard
      title="Choose a new password"
      intro={
        <p>
          For <span className="num">{reset.email}</span>. Saving it signs out every other session of this account.
        </p>
      }
    >
      <SetPasswordForm action={completeResetAction.bind(null, token)} email={reset.email} submitLabel="Save new password and sign in" />
    </AuthCard>
  );
}
