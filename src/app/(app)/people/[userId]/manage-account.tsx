"use client";

import { useMutation, useQueryClient } from "@tanstack/react-query";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { FormField } from "@/components/people/form-field";
import { ApiError, fetchJson } from "@/lib/fetch-json";
import { formatInstant } from "@/lib/format-instant";
import { ROLE_LABELS, ROLES } from "@/lib/roles";
import type { StationView, UserView } from "@/lib/schemas/people";

type Answer = { user: UserView };

function useAccountMutation(person: UserView, onDone: (user: UserView) => string) {
  const router = useRouter();
  const queryClient = useQueryClient();
  const [notice, setNotice] = useState<string | null>(null);
  const mutation = useMutation({
    mutationFn: (request: { path: string; method: "PATCH" | "POST"; body?: Record<string, unknown> }) =>
      fetchJson<Answer>(request.path, { method: request.method, json: request.body ?? {} }),
    onMutate: () => setNotice(null),
    onSuccess: ({ user }) => {
      setNotice(onDone(user));
      void queryClient.invalidateQueries({ queryKey: ["users"] });
      void queryClient.invalidateQueries({ queryKey: ["account-events"] });
      router.refresh();
    },
  });
  const patch = (body: Record<string, unknown>) => mutation.mutate({ path: `/api/users/${encodeURIComponent(person.id)}`, method: "PATCH", body });
  return { mutation, patch, notice };
}

function Outcome({ notice, error }: { notice: string | null; error: Error | null }) {
  if (error && !(error instanceof ApiError && Object.keys(error.fields).length > 0)) {
    return (
      <p role="alert" className="rounded-md border-2 border-red-700 bg-red-50 p-3 font-semibold text-red-900">
        <span aria-hidden="true">✕ </span>
        {error.message}
      </p>
    );
  }
  return (
    <p role="status" className="min-h-6 font-semibold">
      {notice ? (
        <>
          <span aria-hidden="true">✓ </span>
          {notice}
        </>
      ) : null}
    </p>
  );
}

export function ManageAccount({ person, stations, isSelf, timeZone }: { person: UserView; stations: StationView[]; isSelf: boolean; timeZone: string }) {
  return (
    <div className="grid gap-4 lg:grid-cols-2">
      <RoleSection person={person} isSelf={isSelf} />
      <AccessSection person={person} isSelf={isSelf} />
      <DetailsSection person={person} stations={stations} />
      {person.status === "invited" ? <InvitationSection person={person} timeZone={timeZone} /> : null}
    </div>
  );
}

function RoleSection({ person, isSelf }: { person: UserView; isSelf: boolean }) {
  const [role, setRole] = useState(person.role);
  const { mutation, patch, notice } = useAccountMutation(person, (user) => `Role is now ${ROLE_LABELS[user.role]}.`);
  return (
    <section aria-labelledby="role-heading" className="panel space-y-3 p-4">
      <h2 id="role-heading" className="text-lg font-semibold">
        Role
      </h2>
      <form
        className="space-y-3"
        onSubmit={(event) => {
          event.preventDefault();
          patch({ role });
        }}
      >
        <FormField id="role" label="Role" hint={isSelf ? "You cannot change your own role: ask another administrator." : undefined}>
          {(props) => (
            <select {...props} className="field-input" value={role} disabled={isSelf} onChange={(event) => setRole(event.target.value as typeof role)}>
              {ROLES.map((value) => (
                <option key={value} value={value}>
                  {ROLE_LABELS[value]}
                </option>
              ))}
            </select>
          )}
        </FormField>
        <button type="submit" className="btn btn-primary" disabled={isSelf || mutation.isPending || role === person.role}>
          Change role
        </button>
      </form>
      <Outcome notice={notice} error={mutation.error} />
    </section>
  );
}

function AccessSection({ person, isSelf }: { person: UserView; isSelf: boolean }) {
  const [confirming, setConfirming] = useState(false);
  const { mutation, patch, notice } = useAccountMutation(person, (user) =>
    user.status === "deactivated" ? `${user.name} is deactivated; their sessions have ended.` : `${user.name} is ${user.status} again.`,
  );
  const deactivated = person.status === "deactivated";
  return (
    <section aria-labelledby="access-heading" className="panel space-y-3 p-4">
      <h2 id="access-heading" className="text-lg font-semibold">
        Access
      </h2>
      {isSelf ? <p>You cannot deactivate your own account: ask another administrator.</p> : null}
      {deactivated ? (
        <>
          <p>This account is deactivated: it cannot sign in. Reactivating lets it sign in again with its existing password.</p>
          <button type="button" className="btn btn-primary" disabled={mutation.isPending} onClick={() => patch({ status: "active" })}>
            Reactivate account
          </button>
        </>
      ) : confirming ? (
        <div className="space-y-2 rounded-md border-2 border-[var(--ink-soft)] p-3">
          <p className="font-semibold">Deactivate {person.name}? Every session of theirs ends at once and they cannot sign in until reactivated.</p>
          <div className="flex flex-wrap gap-2">
            <button
              type="button"
              className="btn btn-primary"
              disabled={mutation.isPending}
              onClick={() => {
                setConfirming(false);
                patch({ status: "deactivated" });
              }}
            >
              Yes, deactivate
            </button>
            <button type="button" className="btn btn-secondary" onClick={() => setConfirming(false)}>
              Keep the account active
            </button>
          </div>
        </div>
      ) : (
        <button type="button" className="btn btn-secondary" disabled={isSelf || mutation.isPending} onClick={() => setConfirming(true)}>
          <span aria-hidden="true">⊘</span> Deactivate account
        </button>
      )}
      <Outcome notice={notice} error={mutation.error} />
    </section>
  );
}

function DetailsSection({ person, stations }: { person: UserView; stations: StationView[] }) {
  const { mutation, patch, notice } = useAccountMutation(person, () => "Details saved.");
  const fields = mutation.error instanceof ApiError ? mutation.error.fields : {};
  return (
    <section aria-labelledby="details-heading" className="panel space-y-3 p-4">
      <h2 id="details-heading" className="text-lg font-semibold">
        Name, licence and station
      </h2>
      <form
        className="space-y-3"
        noValidate
        onSubmit={(event) => {
          event.preventDefault();
          const data = new FormData(event.currentTarget);
          patch({
            name: String(data.get("name") ?? ""),
            licenceNumber: String(data.get("licenceNumber") ?? ""),
            licenceExpiresOn: String(data.get("licenceExpiresOn") ?? ""),
            stationCode: String(data.get("stationCode") ?? ""),
          });
        }}
      >
        <FormField id="name" label="Full name" error={fields.name}>
          {(props) => <input {...props} name="name" className="field-input" defaultValue={person.name} />}
        </FormField>
        <div className="grid gap-3 sm:grid-cols-2">
          <FormField id="licenceNumber" label="Licence or authorisation number" error={fields.licenceNumber}>
            {(props) => <input {...props} name="licenceNumber" className="field-input num" defaultValue={person.licenceNumber ?? ""} />}
          </FormField>
          <FormField id="licenceExpiresOn" label="Valid until" hint="The last day it is valid." error={fields.licenceExpiresOn}>
            {(props) => <input {...props} name="licenceExpiresOn" type="date" className="field-input num" defaultValue={person.licenceExpiresOn ?? ""} />}
          </FormField>
        </div>
        <FormField id="stationCode" label="Station" error={fields.stationCode}>
          {(props) => (
            <select {...props} name="stationCode" className="field-input" defaultValue={person.station?.code ?? ""}>
              <option value="">No station</option>
              {stations.map((station) => (
                <option key={station.code} value={station.code}>
                  {station.code} · {station.name}
                </option>
              ))}
            </select>
          )}
        </FormField>
        <button type="submit" className="btn btn-primary" disabled={mutation.isPending}>
          Save details
        </button>
      </form>
      <Outcome notice={notice} error={mutation.error} />
    </section>
  );
}

function InvitationSection({ person, timeZone }: { person: UserView; timeZone: string }) {
  const { mutation, notice } = useAccountMutation(person, (user) => `A new link is on its way to ${user.email}; the earlier one no longer works.`);
  return (
    <section aria-labelledby="invitation-heading" className="panel space-y-3 p-4">
      <h2 id="invitation-heading" className="text-lg font-semibold">
        Invitation
      </h2>
      <p>
        {person.invitation
          ? person.invitation.expired
            ? "The invitation link has expired without being used."
            : `The invitation link works until ${formatInstant(person.invitation.expiresAt, timeZone)}.`
          : "No usable invitation link is out."}
      </p>
      <button
        type="button"
        className="btn btn-primary"
        disabled={mutation.isPending}
        onClick={() => mutation.mutate({ path: `/api/users/${encodeURIComponent(person.id)}/invitation/resend`, method: "POST" })}
      >
        <span aria-hidden="true">✉</span> Send the invitation again
      </button>
      <Outcome notice={notice} error={mutation.error} />
    </section>
  );
}
