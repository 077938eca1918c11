import { ACCOUNT_EVENT_LABELS, type AccountEventView } from "@/lib/account-events";
import { formatInstant } from "@/lib/format-instant";
import { ROLE_LABELS, type Role } from "@/lib/roles";

const FIELD_WORDS: Record<string, string> = {
  name: "name",
  licenceNumber: "licence number",
  licenceExpiresOn: "licence valid until",
  stationCode: "station",
};

const roleWord = (value: unknown) => ROLE_LABELS[value as Role] ?? String(value);
const shown = (value: unknown) => (value === null || value === undefined || value === "" ? "none" : String(value));

/** One line saying what an event changed, from its details. */
export function describeEvent(event: AccountEventView, timeZone: string): string {
  const d = event.details ?? {};
  const until = (value: unknown) => (typeof value === "string" ? formatInstant(value, timeZone) : shown(value));
  switch (event.kind) {
    case "role_changed":
      return `${roleWord(d.from)} → ${roleWord(d.to)}`;
    case "details_changed":
      return Object.entries(d)
        .map(([field, change]) => {
          const { from, to } = change as { from: unknown; to: unknown };
          return `${FIELD_WORDS[field] ?? field}: ${shown(from)} → ${shown(to)}`;
        })
        .join("; ");
    case "invitation_sent":
      return `as ${roleWord(d.role)}${d.licenceNumber ? `, licence ${d.licenceNumber}` : ""}; link valid until ${until(d.expiresAt)}`;
    case "invitation_resent":
      return `earlier link withdrawn; new link valid until ${until(d.expiresAt)}`;
    case "deactivated":
      return `${shown(d.sessionsEnded)} session(s) ended`;
    case "reactivated":
      return d.status === "invited" ? "back to invited (no password set yet)" : "can sign in again";
    case "password_reset_requested":
      return d.mailed ? "link mailed" : `no mail sent: ${shown(d.reason)}`;
    case "password_reset_completed":
      return `new password set; ${shown(d.sessionsEnded)} earlier session(s) ended`;
    case "sign_in_locked":
      return `${shown(d.failures)} failed sign-ins within ${shown(d.windowMinutes)} min, limited by ${shown(d.lockedBy)}; last address tried ${shown(d.lastEmailTried)}`;
    default:
      return "";
  }
}

const person = (p: AccountEventView["actor"]) => (p ? `${p.name} (${p.email})` : null);

export function AccountEventTable({ events, timeZone, caption }: { events: AccountEventView[]; timeZone: string; caption: string }) {
  return (
    <div className="panel max-h-[70vh] overflow-auto">
      <table className="w-full border-collapse text-left">
        <caption className="sr-only">{caption}</caption>
        <thead className="sticky top-0 z-10 bg-[var(--panel)] shadow-[0_1px_0_var(--rule)]">
          <tr>
            <th scope="col" className="p-2">When ({timeZone})</th>
            <th scope="col" className="p-2">What</th>
            <th scope="col" className="p-2">Whose account</th>
            <th scope="col" className="p-2">By</th>
            <th scope="col" className="p-2">From address</th>
            <th scope="col" className="p-2">Details</th>
          </tr>
        </thead>
        <tbody>
          {events.map((event) => (
            <tr key={event.id} className="border-t border-[var(--rule)] align-top" data-event-kind={event.kind}>
              <td className="num p-2 text-sm whitespace-nowrap">{formatInstant(event.occurredAt, timeZone).replace(` ${timeZone}`, "")}</td>
              <td className="p-2 font-semibold">{ACCOUNT_EVENT_LABELS[event.kind] ?? event.kind}</td>
              <td className="p-2 break-all">{person(event.subject) ?? event.subjectEmail ?? "—"}</td>
              <td className="p-2 break-all">{person(event.actor) ?? "No one signed in"}</td>
              <td className="num p-2 text-sm">{event.ip ?? "—"}</td>
              <td className="p-2 text-sm">{describeEvent(event, timeZone)}</td>
            </tr>
          ))}
          {events.length === 0 ? (
            <tr>
              <td colSpan={6} className="p-4">
                No account events match.
              </td>
            </tr>
          ) : null}
        </tbody>
      </table>
    </div>
  );
}
