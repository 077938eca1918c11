// Reads what the app sent from the mail fake's REST inbox (maildev: GET /api/email).
import { testEnv } from "./api";

export interface InboxMail {
  subject: string;
  text?: string;
  to: Array<{ address: string }>;
}

export async function inbox(): Promise<InboxMail[]> {
  const response = await fetch(`${testEnv().MAIL_INBOX_URL}/api/email`);
  if (!response.ok) throw new Error(`mail inbox answered ${response.status}`);
  return (await response.json()) as InboxMail[];
}

/** Waits (bounded) for a mail whose subject matches; the outbox sends after commit, so it may lag a little. */
export async function waitForMail(match: (mail: InboxMail) => boolean, timeoutMs = 20_000): Promise<InboxMail> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const found = (await inbox()).find(match);
    if (found) return found;
    if (Date.now() > deadline) throw new Error("the expected mail did not arrive");
    await new Promise((resolve) => setTimeout(resolve, 250));
  }
}
