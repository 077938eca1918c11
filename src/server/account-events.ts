import "server-only";
import type { AccountEventKind, AccountEventView } from "@/lib/account-events";
import type { AccountEventQuery } from "@/lib/schemas/people";
import { db, type Trx } from "./db";

// The account audit trail. Rows are only ever inserted: triggers in the database refuse UPDATE
// and DELETE, and nothing in the app offers to edit them.

export interface NewAccountEvent {
  kind: AccountEventKind;
  actorId?: string | null;
  subjectUserId?: string | null;
  subjectEmail?: string | null;
  ip?: string | null;
  details?: Record<string, unknown> | null;
  occurredAt?: Date;
}

export async function recordAccountEvent(trx: Trx, event: NewAccountEvent): Promise<void> {
  await trx("account_events").insert({
    occurred_at: event.occurredAt ?? new Date(),
    kind: event.kind,
    actor_id: event.actorId ?? null,
    subject_user_id: event.subjectUserId ?? null,
    subject_email: event.subjectEmail ?? null,
    ip: event.ip?.slice(0, 64) ?? null,
    details: event.details ? JSON.stringify(event.details) : null,
  });
}

export interface AccountEventPage {
  events: AccountEventView[];
  /** Pass as `before` to read the next (older) page; null on the last page. */
  nextBefore: number | null;
}

/** Newest first, paged by id so a page never shifts while new events arrive. */
export async function listAccountEvents(query: AccountEventQuery, trx: Trx = db()): Promise<AccountEventPage> {
  const rows: Record<string, any>[] = await trx("account_events as e")
    .leftJoin("users as actor", "actor.id", "e.actor_id")
    .leftJoin("users as subject", "subject.id", "e.subject_user_id")
    .modify((q) => {
      if (query.kind) q.where("e.kind", query.kind);
      if (query.user) q.where((w) => w.where("e.subject_user_id", query.user!).orWhere("e.actor_id", query.user!));
      if (query.q) {
        const like = `%${query.q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
        q.where((w) =>
          w
            .where("e.subject_email", "like", like)
            .orWhere("subject.name", "like", like)
            .orWhere("actor.name", "like", like)
            .orWhere("actor.email", "like", like)
            .orWhere("e.ip", "like", like),
        );
      }
      if (query.from) q.where("e.occurred_at", ">=", new Date(`${query.from}T00:00:00.000Z`));
      if (query.to) q.where("e.occurred_at", "<", new Date(new Date(`${query.to}T00:00:00.000Z`).getTime() + 86_400_000));
      if (query.before) q.where("e.id", "<", query.before);
    })
    .orderBy("e.id", "desc")
    .limit(query.limit + 1)
    .select(
      "e.id",
      "e.occurred_at",
      "e.kind",
      "e.subject_email",
      "e.ip",
      "e.details",
      "actor.id as actor_id",
      "actor.name as actor_name",
      "actor.email as actor_email",
      "subject.id as subject_id",
      "subject.name as subject_name",
      "subject.email as subject_email_now",
    );
  const page = rows.slice(0, query.limit);
  return {
    events: page.map((row) => ({
      id: Number(row.id),
      occurredAt: new Date(row.occurred_at).toISOString(),
      kind: row.kind,
      actor: row.actor_id ? { id: row.actor_id, name: row.actor_name, email: row.actor_email } : null,
      subject: row.subject_id ? { id: row.subject_id, name: row.subject_name, email: row.subject_email_now } : null,
      subjectEmail: row.subject_email,
      ip: row.ip,
      details: row.details ? (JSON.parse(row.details) as Record<string, unknown>) : null,
    })),
    nextBefore: rows.length > query.limit ? Number(page[page.length - 1].id) : null,
  };
}
