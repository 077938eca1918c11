// Reads what the app mailed from the mail fake's REST inbox (maildev 3: GET /api/email).
import { testEnv } from "./api";

export interface InboxMail {
  id: string;
  subject: string;
  text: string;
  time: string;
  to: { address: string; name?: string }[];
}

export async function mailsTo(address: string): Promise<InboxMail[]> {
  const response = await fetch(`${testEnv().MAIL_INBOX_URL}/api/email?to.address=${encodeURIComponent(address)}&sort=asc`);
  if (!response.ok) throw new Error(`the mail inbox answered ${response.status}`);
  return (await response.json()) as InboxMail[];
}

/** Waits until `count` mails have reached the address (the outbox sends just after commit). */
export async function waitForMails(address: string, count = 1): Promise<InboxMail[]> {
  for (let attempt = 0; attempt < 300; attempt++) {
    const mails = await mailsTo(address);
    if (mails.length >= count) return mails;
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
  throw new Error(`fewer than ${count} mail(s) reached ${address}`);
}

/** The single-use link in a mail, e.g. path "/invitation" or "/reset-password". */
export function linkIn(mail: InboxMail, path: string): { url: string; token: string } {
  const match = mail.text.match(new RegExp(`(https?://\\S+?${path}/([A-Za-z0-9_-]+))\\s`));
  if (!match) throw new Error(`no ${path} link in the mail "${mail.subject}":\n${mail.text}`);
  return { url: match[1], token: match[2] };
}

export async function inbox(): Promise<InboxMail[]> {
  const response = await fetch(`${testEnv().MAIL_INBOX_URL}/api/email`);
  if (!response.ok) throw new Error(`the mail inbox answered ${response.status}`);
  return (await response.json()) as InboxMail[];
}

/** Waits (bounded) for a mail that matches; the outbox sends just after commit, so it may lag a little. */
export async function waitForMail(match: (mail: InboxMail) => boolean, timeoutMs = 20_000): Promise<InboxMail> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const found = (await inbox()).find(match);
    if (found) return found;
    if (Date.now() > deadline) throw new Error("the expected mail did not arrive");
    await new Promise((resolve) => setTimeout(resolve, 250));
  }
}
