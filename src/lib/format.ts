// Display formatting shared by server and client components.
import { formatFlightTime } from "@/domain/flight-time";

export { formatFlightTime };

const cyclesFormat = new Intl.NumberFormat("en-GB");

/** Cycles as an integer with thousands separators. */
export function formatCycles(cycles: number | null | undefined): string {
  return cycles === null || cycles === undefined ? "—" : cyclesFormat.format(cycles);
}

export function formatMinutes(minutes: number | null | undefined): string {
  return minutes === null || minutes === undefined ? "—" : formatFlightTime(minutes);
}

/** An instant in a station's zone, with the zone named (stored and sent in UTC). */
export function formatInstant(iso: string | null | undefined, timeZone = "UTC"): string {
  if (!iso) return "—";
  const date = new Date(iso);
  const text = new Intl.DateTimeFormat("en-GB", {
    timeZone,
    year: "numeric",
    month: "short",
    day: "2-digit",
    hour: "2-digit",
    minute: "2-digit",
    hourCycle: "h23",
  }).format(date);
  const zone = new Intl.DateTimeFormat("en-GB", { timeZone, timeZoneName: "short" })
    .formatToParts(date)
    .find((part) => part.type === "timeZoneName")?.value;
  return `${text} ${zone ?? timeZone}`;
}

export function formatDate(iso: string | null | undefined): string {
  if (!iso) return "—";
  return new Intl.DateTimeFormat("en-GB", { timeZone: "UTC", year: "numeric", month: "short", day: "2-digit" }).format(new Date(iso));
}
