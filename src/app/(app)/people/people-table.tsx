"use client";

import { useQuery } from "@tanstack/react-query";
import Link from "next/link";
import { useEffect, useState } from "react";
import { AccountStatusBadge } from "@/components/people/account-status-badge";
import { LicenceBadge } from "@/components/people/licence-badge";
import { formatInstant } from "@/lib/format-instant";
import { usersQuery, type UserFilters, type UsersAnswer } from "@/lib/people-queries";
import { ROLE_LABELS, ROLES } from "@/lib/roles";
import { ACCOUNT_STATUSES } from "@/lib/schemas/people";
import { searchString } from "@/lib/fetch-json";
import { useSearchInAddress } from "@/lib/use-search-in-address";

const STATUS_WORDS = { invited: "Invited", active: "Active", deactivated: "Deactivated" } as const;
const LICENCE_WORDS = { expiring: "Expiring within 30 days", expired: "Expired", valid: "Valid", none: "No expiry on file" } as const;

export function PeopleTable({ initialFilters, initialData, timeZone }: { initialFilters: UserFilters; initialData: UsersAnswer; timeZone: string }) {
  const [filters, setFilters] = useState<UserFilters>(initialFilters);
  const [search, setSearch] = useState(initialFilters.q ?? "");
  const sameAsInitial = JSON.stringify(filters) === JSON.stringify(initialFilters);
  const query = useQuery({ ...usersQuery(filters), initialData: sameAsInitial ? initialData : undefined, placeholderData: (previous) => previous });

  // Typing searches after a short pause rather than on every key.
  useEffect(() => {
    const q = search.trim() || undefined;
    // Unchanged text leaves the filters (and so the address) alone: a needless history update just
    // after the page loads could cut short a link the user is already following.
    const timer = setTimeout(() => setFilters((current) => (current.q === q ? current : { ...current, q })), 250);
    return () => clearTimeout(timer);
  }, [search]);

  useSearchInAddress(searchString({ ...filters }));

  const set = (key: keyof UserFilters) => (event: React.ChangeEvent<HTMLSelectElement>) =>
    setFilters((current) => ({ ...current, [key]: event.target.value || undefined }));

  const data = query.data ?? initialData;
  const users = data.users;
  const expiring = users.filter((user) => user.licenceStatus === "expiring").length;
  const expired = users.filter((user) => user.licenceStatus === "expired").length;

  return (
    <div className="space-y-3">
      <form role="search" aria-label="Filter people" className="panel grid gap-3 p-3 sm:grid-cols-2 lg:grid-cols-5" onSubmit={(event) => event.preventDefault()}>
        <div className="lg:col-span-1">
          <label htmlFor="people-q" className="field-label">
            Search
          </label>
          <input id="people-q" type="search" className="field-input" placeholder="Name, e-mail or licence" value={search} onChange={(event) => setSearch(event.target.value)} />
        </div>
        <div>
          <label htmlFor="people-role" className="field-label">
            Role
          </label>
          <select id="people-role" className="field-input" value={filters.role ?? ""} onChange={set("role")}>
            <option value="">Any role</option>
            {ROLES.map((role) => (
              <option key={role} value={role}>
                {ROLE_LABELS[role]}
              </option>
            ))}
          </select>
        </div>
        <div>
          <label htmlFor="people-status" className="field-label">
            Status
          </label>
          <select id="people-status" className="field-input" value={filters.status ?? ""} onChange={set("status")}>
            <option value="">Any status</option>
            {ACCOUNT_STATUSES.map((status) => (
              <option key={status} value={status}>
                {STATUS_WORDS[status]}
              </option>
            ))}
          </select>
        </div>
        <div>
          <label htmlFor="people-station" className="field-label">
            Station
          </label>
          <select id="people-station" className="field-input" value={filters.station ?? ""} onChange={set("station")}>
            <option value="">Any station</option>
            {data.stations.map((station) => (
              <option key={station.code} value={station.code}>
                {station.code} · {station.name}
              </option>
            ))}
          </select>
        </div>
        <div>
          <label htmlFor="people-licence" className="field-label">
            Licence
          </label>
          <select id="people-licence" className="field-input" value={filters.licence ?? ""} onChange={set("licence")}>
            <option value="">Any licence state</option>
            {Object.entries(LICENCE_WORDS).map(([value, words]) => (
              <option key={value} value={value}>
                {words}
              </option>
            ))}
          </select>
        </div>
      </form>

      {expiring + expired > 0 ? (
        <p role="status" className="rounded-md border-2 border-amber-700 bg-amber-50 p-3 font-semibold text-amber-950 dark:bg-amber-950 dark:text-amber-100">
          <span aria-hidden="true">⚠ </span>
          {expired > 0 ? `${expired} licence${expired === 1 ? " has" : "s have"} expired` : null}
          {expired > 0 && expiring > 0 ? "; " : null}
          {expiring > 0 ? `${expiring} expire${expiring === 1 ? "s" : ""} within 30 days` : null}. People with an expired licence cannot sign or countersign swaps.
        </p>
      ) : null}

      <p aria-live="polite" className="text-sm font-semibold">
        {query.isFetching ? "Updating… " : null}
        {users.length} {users.length === 1 ? "person" : "people"}
        {query.isError ? ` · could not refresh: ${query.error.message}` : null}
      </p>

      <div className="panel max-h-[70vh] overflow-auto">
        <table className="w-full border-collapse text-left">
          <thead className="sticky top-0 z-10 bg-[var(--panel)] shadow-[0_1px_0_var(--rule)]">
            <tr>
              <th scope="col" className="p-2">Name</th>
              <th scope="col" className="p-2">E-mail</th>
              <th scope="col" className="p-2">Role</th>
              <th scope="col" className="p-2">Licence / authorisation</th>
              <th scope="col" className="p-2">Station</th>
              <th scope="col" className="p-2">Status</th>
              <th scope="col" className="p-2">Last sign-in</th>
            </tr>
          </thead>
          <tbody>
            {users.map((user) => (
              <tr key={user.id} className="border-t border-[var(--rule)] align-top">
                <td className="p-2">
                  <Link href={`/people/${encodeURIComponent(user.id)}`} className="inline-flex min-h-touch items-center font-semibold text-[var(--accent)] underline">
                    {user.name}
                  </Link>
                </td>
                <td className="p-2 break-all">{user.email}</td>
                <td className="p-2">{ROLE_LABELS[user.role]}</td>
                <td className="p-2">
                  {user.licenceNumber ? <span className="num block">{user.licenceNumber}</span> : <span className="block">No number on file</span>}
                  {user.licenceExpiresOn ? <span className="num block text-sm">until {user.licenceExpiresOn}</span> : null}
                  <LicenceBadge status={user.licenceStatus} daysLeft={user.licenceDaysLeft} />
                </td>
                <td className="p-2">{user.station ? <span title={user.station.name}>{user.station.code}</span> : "—"}</td>
                <td className="p-2">
                  <AccountStatusBadge status={user.status} />
                  {user.invitation ? (
                    <span className="block text-sm">{user.invitation.expired ? "Link expired" : `Link until ${formatInstant(user.invitation.expiresAt, timeZone)}`}</span>
                  ) : null}
                </td>
                <td className="p-2 num text-sm">{user.lastSignInAt ? formatInstant(user.lastSignInAt, timeZone) : "Never"}</td>
              </tr>
            ))}
            {users.length === 0 ? (
              <tr>
                <td colSpan={7} className="p-4">
                  Nobody matches these filters.
                </td>
              </tr>
            ) : null}
          </tbody>
        </table>
      </div>
    </div>
  );
}
