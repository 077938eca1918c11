import type { Metadata } from "next";
import { AuthCard } from "@/components/auth/auth-card";
import { RequestResetForm } from "./request-reset-form";

export const metadata: Metadata = { title: "Forgot password" };

export default function ForgotPasswordPage() {
  return (
    <AuthCard
      title="Forgot your password?"
      intro={<p>Enter the address you sign in with. We will mail you a link to choose a new password; it works once, for one hour.</p>}
    >
      <RequestResetForm />
    </AuthCard>
  );
}
