import "server-only";
import nodemailer, { type Transporter } from "nodemailer";
import { db, type Trx } from "./db";
import { serverEnv } from "./env";
import { asSql, type Sql } from "./sql";

// Mail is written to mail_outbox in the same transaction as the change that causes it, then
// sent after commit. A failed send is retried with backoff, so a change never waits on SMTP
// and no mail is lost when the SMTP server is briefly away.

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
}

/** Queues mail in the caller's transaction; `now` is the caller's clock (the change's own time). */
export async function queueMail(trx: Trx | Sql, mail: OutgoingMail | OutgoingMail[], now: Date = new Date()): Promise<void> {
  const mails = [mail].flat();
  if (mails.length === 0) return;
  await asSql(trx).run(
    `INSERT INTO mail_outbox (to_address, subject, text_body, created_at, next_attempt_at) VALUES ${mails.map(() => "(?, ?, ?, ?, ?)").join(", ")}`,
    mails.flatMap((m) => [m.to, m.subject.slice(0, 255), m.text, now, now]),
  );
}

const globalForMail = globalThis as unknown as { threadlineMailer?: Transporter; threadlineOutboxTimer?: NodeJS.Timeout; threadlineOutboxBusy?: boolean };

function mailer(): Transporter {
  const env = serverEnv();
  globalForMail.threadlineMailer ??= nodemailer.createTransport({ host: env.SMTP_HOST, port: env.SMTP_PORT, secure: false, ignoreTLS: true });
  return globalForMail.threadlineMailer;
}

const MAX_ATTEMPTS = 10;

/** Sends what is due. Rows are claimed with SKIP LOCKED, so several app processes never send one mail twice. */
export async function sendDueMail(limit = 25): Promise<number> {
  if (globalForMail.threadlineOutboxBusy) return 0;
  globalForMail.threadlineOutboxBusy = true;
  let sent = 0;
  try {
    for (;;) {
      const sentThisRound = await db().transaction(async (trx) => {
        const due = await trx("mail_outbox")
          .whereNull("sent_at")
          .andWhere("next_attempt_at", "<=", new Date())
          .andWhere("attempts", "<", MAX_ATTEMPTS)
          .orderBy("id")
          .limit(limit)
          .forUpdate()
          .skipLocked();
        for (const row of due) {
          try {
            await mailer().sendMail({ from: serverEnv().MAIL_FROM, to: row.to_address, subject: row.subject, text: row.text_body });
            await trx("mail_outbox").where({ id: row.id }).update({ sent_at: new Date(), attempts: row.attempts + 1, last_error: null });
          } catch (error) {
            const delayMs = Math.min(60 * 60_000, 2 ** row.attempts * 30_000);
            await trx("mail_outbox")
              .where({ id: row.id })
              .update({ attempts: row.attempts + 1, last_error: String(error).slice(0, 500), next_attempt_at: new Date(Date.now() + delayMs) });
          }
        }
        return due.length;
      });
      sent += sentThisRound;
      if (sentThisRound < limit) break;
    }
  } finally {
    globalForMail.threadlineOutboxBusy = false;
  }
  return sent;
}

/**
 * Withdraws unsent mail queued after the outbox row `afterId`, without sending it: the rows stay, in
 * the state the outbox leaves a mail in after its last failed attempt, with the reason as the error.
 */
export async function withdrawQueuedMail(input: { afterId: number; reason: string }, trx: Trx = db()): Promise<number> {
  return trx("mail_outbox")
    .where("id", ">", input.afterId)
    .whereNull("sent_at")
    .update({ attempts: MAX_ATTEMPTS, last_error: input.reason.slice(0, 500) });
}

/** The id of the newest outbox row (0 when empty), to withdraw what is queued after it. */
export async function lastOutboxId(trx: Trx = db()): Promise<number> {
  const row = await trx("mail_outbox").max({ id: "id" }).first();
  return Number(row?.id ?? 0);
}

/** Call after the transaction that queued mail has committed. */
export function kickOutbox(): void {
  setImmediate(() => void sendDueMail().catch((error) => console.error("mail outbox", error)));
}

// Retries run on a timer in every process that has loaded this module.
globalForMail.threadlineOutboxTimer ??= setInterval(() => kickOutbox(), 15_000);
globalForMail.threadlineOutboxTimer.unref?.();
