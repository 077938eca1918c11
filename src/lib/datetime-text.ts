// DATETIME(3) columns read as text ("YYYY-MM-DD HH:MM:SS.mmm", always UTC here: every connection
// uses timezone "Z") turned into ISO 8601 instants without a Date object. The long readers (the
// ledger check, the CSV export) read dates as text because two Date objects a row were a large part
// of their cost, and a framework that wraps the Date constructor makes each one dearer still.
const DATETIME_3 = /^\d{4}-\d{2}-\d{2} \d{2}:\d{2}:\d{2}\.\d{3}$/;

export function isoFromDatetime(value: Date | string): string {
  if (value instanceof Date) return value.toISOString();
  return DATETIME_3.test(value) ? `${value.slice(0, 10)}T${value.slice(11)}Z` : new Date(`${value.replace(" ", "T")}Z`).toISOString();
}
