// The kinds of account event in the audit trail, with the words people read for each.
export const ACCOUNT_EVENT_KINDS = [
  "invitation_sent",
  "invitation_resent",
  "invitation_accepted",
  "role_changed",
  "details_changed",
  "deactivated",
  "reactivated",
  "password_reset_requested",
  "password_reset_completed",
  "sign_in_locked",
] as const;
export type AccountEventKind = (typeof ACCOUNT_EVENT_KINDS)[number];

export const ACCOUNT_EVENT_LABELS: Record<AccountEventKind, string> = {
  invitation_sent: "Invitation sent",
  invitation_resent: "Invitation sent again",
  invitation_accepted: "Invitation accepted",
  role_changed: "Role changed",
  details_changed: "Details changed",
  deactivated: "Deactivated",
  reactivated: "Reactivated",
  password_reset_requested: "Password reset asked for",
  password_reset_completed: "Password reset",
  sign_in_locked: "Sign-in locked after failures",
};

export interface AccountEventPerson {
  id: string;
  name: string;
  email: string;
}

export interface AccountEventView {
  id: number;
  occurredAt: string;
  kind: AccountEventKind;
  actor: AccountEventPerson | null;
  subject: AccountEventPerson | null;
  subjectEmail: string | null;
  ip: string | null;
  details: Record<string, unknown> | null;
}
