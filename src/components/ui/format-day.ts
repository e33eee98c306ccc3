/** A calendar day (YYYY-MM-DD) in words, e.g. "Tue 15 Dec 2026"; read as UTC so it never shifts a day. */
export function formatDay(iso: string, withWeekday = false): string {
  const d = new Date(`${iso.slice(0, 10)}T00:00:00Z`);
  if (Number.isNaN(d.getTime())) return iso;
  return d.toLocaleDateString('en-GB', { timeZone: 'UTC', day: 'numeric', month: 'short', year: 'numeric', ...(withWeekday ? { weekday: 'short' } : {}) });
}

/** Today, or `days` from today, as YYYY-MM-DD in UTC (the server's calendar). */
export function isoDayFromToday(days = 0): string {
  return new Date(Date.now() + days * 86_400_000).toISOString().slice(0, 10);
}

/** Whole days from today to `iso`; negative when it has passed. */
export function daysUntil(iso: string): number {
  return Math.round((Date.parse(`${iso}T00:00:00Z`) - Date.parse(`${isoDayFromToday()}T00:00:00Z`)) / 86_400_000);
}

/** A moment in words with its time, e.g. "6 Jan 2027, 14:05", in the reader's own clock. */
export function formatMoment(iso: string): string {
  const d = new Date(iso);
  if (Number.isNaN(d.getTime())) return iso;
  const day = d.toLocaleDateString('en-GB', { day: 'numeric', month: 'short', year: 'numeric' });
  const time = d.toLocaleTimeString('en-GB', { hour: '2-digit', minute: '2-digit' });
  return `${day}, ${time}`;
}
