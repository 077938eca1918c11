// Licence/authorisation validity on a calendar day. The expiry date is the last day the licence is
// valid; a licence expiring within LICENCE_WARNING_DAYS is flagged so it can be renewed in time.

export const LICENCE_WARNING_DAYS = 30;

export type LicenceStatus = "valid" | "expiring" | "expired" | "none";

const ISO_DATE = /^\d{4}-\d{2}-\d{2}$/;

function dayNumber(isoDate: string): number {
  if (!ISO_DATE.test(isoDate)) throw new RangeError(`not an ISO date (YYYY-MM-DD): ${isoDate}`);
  const [year, month, day] = isoDate.split("-").map(Number);
  return Date.UTC(year, month - 1, day) / 86_400_000;
}

/** Whole days from `today` to `expiresOn`: 0 on the expiry day itself, negative once it has passed. */
export function daysUntil(expiresOn: string, today: string): number {
  return dayNumber(expiresOn) - dayNumber(today);
}

export function licenceStatus(expiresOn: string | null, today: string): LicenceStatus {
  if (!expiresOn) return "none";
  const days = daysUntil(expiresOn, today);
  if (days < 0) return "expired";
  if (days <= LICENCE_WARNING_DAYS) return "expiring";
  return "valid";
}

// Building an Intl.DateTimeFormat costs far more than using one; keep one per zone.
const dayFormats = new Map<string, Intl.DateTimeFormat>();

/** The calendar date (YYYY-MM-DD) of an instant in an IANA time zone. */
export function dateInZone(instant: Date, timeZone = "UTC"): string {
  // UTC needs no time-zone data: the ISO form already starts with the date (and formatToParts is
  // a noticeable part of a swap's CPU).
  if (timeZone === "UTC" && !Number.isNaN(instant.getTime())) {
    const iso = instant.toISOString();
    if (iso.length === 24) return iso.slice(0, 10); // years 0000-9999; others as Intl writes them
  }
  let format = dayFormats.get(timeZone);
  if (!format) {
    format = new Intl.DateTimeFormat("en-CA", { timeZone, year: "numeric", month: "2-digit", day: "2-digit" });
    dayFormats.set(timeZone, format);
  }
  const parts = format.formatToParts(instant);
  const get = (type: string) => parts.find((part) => part.type === type)?.value ?? "";
  return `${get("year")}-${get("month")}-${get("day")}`;
}

/** Roles whose signature on a swap is a certifying signature and so needs a licence number on file. */
export const CERTIFYING_ROLES = ["technician", "inspector"] as const;

export interface LicenceHolder {
  role: string;
  licenceNumber: string | null;
  licenceExpiresOn: string | null;
}

export type LicenceProblem = { code: "licence_expired" | "licence_missing"; message: string };

/**
 * Why this person may not sign or countersign a swap today, or null when they may.
 * An expiry date that has passed refuses anyone; technicians and inspectors also need a number on file.
 */
export function licenceSigningProblem(holder: LicenceHolder, today: string): LicenceProblem | null {
  if (holder.licenceExpiresOn && licenceStatus(holder.licenceExpiresOn, today) === "expired") {
    return {
      code: "licence_expired",
      message: `Your licence/authorisation${holder.licenceNumber ? ` ${holder.licenceNumber}` : ""} expired on ${holder.licenceExpiresOn}: you cannot sign or countersign until an administrator records its renewal.`,
    };
  }
  if ((CERTIFYING_ROLES as readonly string[]).includes(holder.role) && !holder.licenceNumber) {
    return {
      code: "licence_missing",
      message: "No licence/authorisation number is on file for you: ask an administrator to record it before you sign or countersign.",
    };
  }
  return null;
}
