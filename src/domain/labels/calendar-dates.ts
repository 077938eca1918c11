// Calendar checks for the fixed-length date fields. No clock is read: two-digit years are
// checked as 20YY, which gives the right leap years for 1901-2099.

function daysInMonth(year: number, month: number): number {
  if (month === 2) return year % 4 === 0 && (year % 100 !== 0 || year % 400 === 0) ? 29 : 28;
  return [4, 6, 9, 11].includes(month) ? 30 : 31;
}

function isValidDay(year: number, month: number, day: number, allowDayZero: boolean): boolean {
  if (month < 1 || month > 12) return false;
  if (day === 0) return allowDayZero;
  return day <= daysInMonth(year, month);
}

/** YYMMDD. GS1 allows day "00" meaning the end of the month (gs1.dk, trade-facts 1.4). */
export function isValidYymmdd(value: string, allowDayZero: boolean): boolean {
  if (!/^\d{6}$/.test(value)) return false;
  const [yy, mm, dd] = [value.slice(0, 2), value.slice(2, 4), value.slice(4, 6)].map(Number);
  return isValidDay(2000 + yy, mm, dd, allowDayZero);
}

/** YYYYMMDD. */
export function isValidYyyymmdd(value: string): boolean {
  if (!/^\d{8}$/.test(value)) return false;
  return isValidDay(Number(value.slice(0, 4)), Number(value.slice(4, 6)), Number(value.slice(6, 8)), false);
}
