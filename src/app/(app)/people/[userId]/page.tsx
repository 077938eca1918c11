import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { AccountEventTable } from "@/components/people/account-event-list";
import { AccountStatusBadge } from "@/components/people/account-status-badge";
import { LicenceBadge } from "@/components/people/licence-badge";
import { formatInstant } from "@/lib/format-instant";
import { ROLE_LABELS } from "@/lib/roles";
import { AccountEventQuerySchema } from "@/lib/schemas/people";
import { listAccountEvents } from "@/server/account-events";
import { AppError } from "@/server/errors";
import { requireUserFor } from "@/server/page-guard";
import { getUserView, listStations, stationTimeZoneOf } from "@/server/users";
import { ManageAccount } from "./manage-account";

export const metadata: Metadata = { title: "Person" };

export default async function PersonPage({ params }: { params: Promise<{ userId: string }> }) {
  const { userId } = await params;
  const admin = await requireUserFor("people", `/people/${userId}`);
  const person = await getUserView(userId).catch((error) => {
    if (error instanceof AppError && error.kind === "not_found") notFound();
    throw error;
  });
  const [stations, timeZone, history] = await Promise.all([
    listStations(),
    stationTimeZoneOf(admin.id),
    listAccountEvents(AccountEventQuerySchema.parse({ user: userId, limit: 20 })),
  ]);
  return (
    <div className="space-y-5">
      <p>
        <Link href="/people" className="inline-flex min-h-touch items-center font-semibold text-[var(--accent)] underline">
          ← People
        </Link>
      </p>
      <div className="flex flex-wrap items-center gap-3">
        <h1 className="text-2xl font-bold">{person.name}</h1>
        <AccountStatusBadge status={person.status} />
      </div>
      <dl className="panel grid gap-x-6 gap-y-2 p-4 sm:grid-cols-[max-content_1fr]">
        <dt className="font-semibold">E-mail</dt>
        <dd className="break-all">{person.email}</dd>
        <dt className="font-semibold">Role</dt>
        <dd>{ROLE_LABELS[person.role]}</dd>
        <dt className="font-semibold">Licence / authorisation</dt>
        <dd className="flex flex-wrap items-center gap-2">
          <span className="num">{person.licenceNumber ?? "No number on file"}</span>
          {person.licenceExpiresOn ? <span className="num">valid until {person.licenceExpiresOn}</span> : null}
          <LicenceBadge status={person.licenceStatus} daysLeft={person.licenceDaysLeft} />
        </dd>
        <dt className="font-semibold">Station</dt>
        <dd>{person.station ? `${person.station.code} · ${person.station.name}` : "None"}</dd>
        <dt className="font-semibold">Last sign-in</dt>
        <dd className="num">{person.lastSignInAt ? formatInstant(person.lastSignInAt, timeZone) : "Never"}</dd>
        <dt className="font-semibold">Account created</dt>
        <dd className="num">{formatInstant(person.createdAt, timeZone)}</dd>
      </dl>
      <ManageAccount person={person} stations={stations} isSelf={person.id === admin.id} timeZone={timeZone} />
      <section aria-labelledby="history-heading" className="space-y-2">
        <div className="flex flex-wrap items-center justify-between gap-2">
          <h2 id="history-heading" className="text-lg font-semibold">
            Account history
          </h2>
          <Link href={`/people/audit?user=${encodeURIComponent(person.id)}`} className="btn btn-secondary">
            All events for {person.name}
          </Link>
        </div>
        <AccountEventTable events={history.events} timeZone={timeZone} caption={`Latest account events for ${person.name}`} />
      </section>
    </div>
  );
}
