import type { Metadata } from "next";
import Link from "next/link";
import { UserListQuerySchema } from "@/lib/schemas/people";
import { requireUserFor } from "@/server/page-guard";
import { listStations, listUsers, stationTimeZoneOf } from "@/server/users";
import { PeopleTable } from "./people-table";

export const metadata: Metadata = { title: "People" };

export default async function PeoplePage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const admin = await requireUserFor("people", "/people");
  const raw = await searchParams;
  const parsed = UserListQuerySchema.safeParse(Object.fromEntries(Object.entries(raw).map(([key, value]) => [key, Array.isArray(value) ? value[0] : value])));
  const filters = parsed.success ? parsed.data : {};
  const [users, stations, timeZone] = await Promise.all([listUsers(filters), listStations(), stationTimeZoneOf(admin.id)]);
  return (
    <div className="space-y-4">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <h1 className="text-2xl font-bold">People</h1>
          <p className="text-[var(--ink-soft)]">Accounts, roles, licences and authorisations. Sign-in times are shown in {timeZone}.</p>
        </div>
        <div className="flex flex-wrap gap-2">
          <Link href="/people/audit" className="btn btn-secondary">
            Account audit
          </Link>
          <Link href="/people/invite" className="btn btn-primary">
            <span aria-hidden="true">+</span> Invite a person
          </Link>
        </div>
      </div>
      <PeopleTable initialFilters={filters} initialData={{ users, stations }} timeZone={timeZone} />
    </div>
  );
}
