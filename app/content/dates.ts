// Calendar days, shared by server and client. Deadlines, target dates and validity are whole days
// (YYYY-MM-DD) in UTC, so "today", "overdue" and "days since award" read the same on every server and browser.

const DAY_MS = 86_400_000;
const ISO_DAY = /^(\d{4})-(\d{2})-(\d{2})$/;

/** The UTC calendar day of a moment, as YYYY-MM-DD. */
export const isoDay = (moment: Date) => moment.toISOString().slice(0, 10);

/** Today's calendar day in UTC, the "today" every deadline and target is judged against. */
export const todayUtc = () => isoDay(new Date());

/** Whether text is a real calendar day written YYYY-MM-DD (not 2026-02-30). */
export function isIsoDay(text: string) {
  const match = ISO_DAY.exec(text);
  if (!match) return false;
  const date = new Date(Date.UTC(Number(match[1]), Number(match[2]) - 1, Number(match[3])));
  return isoDay(date) === text;
}

export function addDays(day: string, days: number) {
  return isoDay(new Date(Date.parse(`${day}T00:00:00Z`) + days * DAY_MS));
}

/** Whole days from one calendar day to another (negative when `to` is earlier). */
export function daysBetween(from: string, to: string) {
  return Math.round((Date.parse(`${to}T00:00:00Z`) - Date.parse(`${from}T00:00:00Z`)) / DAY_MS);
}

const dayFormat = new Intl.DateTimeFormat("en-GB", { day: "numeric", month: "short", year: "numeric", timeZone: "UTC" });
const momentFormat = new Intl.DateTimeFormat("en-GB", {
  day: "numeric",
  month: "short",
  year: "numeric",
  hour: "2-digit",
  minute: "2-digit",
  timeZone: "UTC",
});

/**
 * The one way a day is shown, on pages, in e-mails and in workbooks: "2026-03-14" → "14 Mar 2026".
 * Takes a calendar day, an ISO timestamp (its UTC day) or a Date.
 */
export const formatDay = (day: string | Date) => dayFormat.format(typeof day === "string" ? new Date(`${day.slice(0, 10)}T00:00:00Z`) : day);

/** An ISO timestamp → "14 Mar 2026, 09:12 UTC". */
export const formatMoment = (iso: string) => `${momentFormat.format(new Date(iso))} UTC`;
