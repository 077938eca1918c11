import type { Metadata } from "next";
import { AuthCard } from "@/components/auth/auth-card";
import { LinkRefusal } from "@/components/auth/link-refusal";
import { SetPasswordForm } from "@/components/auth/set-password-form";
import { ROLE_LABELS, type Role } from "@/lib/roles";
import { linkRefusal } from "@/server/account-links";
import { invitationForPage } from "@/server/invitations";
import { acceptInvitationAction } from "./accept-invitation-action";

// The token is in the address: never send it on to another site.
export const metadata: Metadata = { title: "Accept your invitation", referrer: "no-referrer" };

export default async function InvitationPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const invitation = await invitationForPage(token);
  if (invitation.state !== "usable" || !invitation.user) {
    return <LinkRefusal {...linkRefusal("invitation", invitation.state === "usable" ? "unknown" : invitation.state)} />;
  }
  const { user } = invitation;
  return (
    <AuthCard
      title="Choose your password"
      intro={
        <p>
          Welcome, {user.name}. You have been invited as <strong>{ROLE_LABELS[user.role as Role] ?? user.role}</strong>; you will sign in
          as <span className="num">{user.email}</span>.
        </p>
      }
    >
      <SetPasswordForm action={acceptInvitationAction.bind(null, token)} email={user.email} submitLabel="Set password and sign in" />
    </AuthCard>
  );
}
