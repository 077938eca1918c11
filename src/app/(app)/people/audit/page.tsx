import type { Metadata } from "next";
import { AccountEventQuerySchema } from "@/lib/schemas/people";
import { listAccountEvents } from "@/server/account-events";
import { requireUserFor } from "@/server/page-guard";
import { stationTimeZoneOf } from "@/server/users";
import { AccountAuditTable } from "./account-audit-table";

export const metadata: Metadata = { title: "Account audit" };

export default async function AccountAuditPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const viewer = await requireUserFor("account-audit", "/people/audit");
  const raw = await searchParams;
  const first = (value: string | string[] | undefined) => (Array.isArray(value) ? value[0] : value);
  const parsed = AccountEventQuerySchema.safeParse({ kind: first(raw.kind), user: first(raw.user), q: first(raw.q), from: first(raw.from), to: first(raw.to) });
  const query = parsed.success ? parsed.data : AccountEventQuerySchema.parse({});
  const [page, timeZone] = await Promise.all([listAccountEvents(query), stationTimeZoneOf(viewer.id)]);
  const { kind, user, q, from, to } = query;
  return (
    <div className="space-y-4">
      <div>
        <h1 className="text-2xl font-bold">Account audit</h1>
        <p className="text-[var(--ink-soft)]">
          Every invitation, acceptance, role change, deactivation, password reset and sign-in lock, newest first. The record is append-only:
          nothing here can be edited or deleted, in the app or in the database.
        </p>
      </div>
      <AccountAuditTable initialFilters={{ kind, user, q, from, to }} initialPage={page} timeZone={timeZone} />
    </div>
  );
}
