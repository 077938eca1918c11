// Instants are stored in UTC and shown in a station's zone, with the zone named.
export function formatInstant(iso: string | null, timeZone = "UTC"): string {
  if (!iso) return "—";
  const text = new Intl.DateTimeFormat("en-GB", {
    timeZone,
    year: "numeric",
    month: "short",
    day: "2-digit",
    hour: "2-digit",
    minute: "2-digit",
    hourCycle: "h23",
  }).format(new Date(iso));
  return `${text} ${timeZone}`;
}
