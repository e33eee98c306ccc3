/** A calendar day (YYYY-MM-DD) in words, e.g. "Tue 15 Dec 2026"; read as UTC so it never shifts a day. */
export function formatDay(iso: string, withWeekday = false): string {
  const d = new Date(`${iso.slice(0, 10)}T00:00:00Z`);
  if (Number.isNaN(d.getTime())) return iso;
  return d.toLocaleDateString('en-GB', { timeZone: 'UTC', day: 'numeric', month: 'short', year: 'numeric', ...(withWeekday ? { weekday: 'short' } : {}) });
}

/** `days` after a day (YYYY-MM-DD), as YYYY-MM-DD: plain calendar arithmetic, no zone involved. */
export function isoDayFrom(today: string, days = 0): string {
  return new Date(Date.parse(`${today}T00:00:00Z`) + days * 86_400_000).toISOString().slice(0, 10);
}

/** Whole days from `today` (the drive's, from lib/drive-clock) to `iso`; negative when it has passed. */
export function daysUntil(iso: string, today: string): number {
  return Math.round((Date.parse(`${iso}T00:00:00Z`) - Date.parse(`${today}T00:00:00Z`)) / 86_400_000);
}

/** A moment in words with its time in the drive's zone, e.g. "6 Jan 2027, 14:05". */
export function formatMoment(iso: string, timeZone?: string): string {
  const d = new Date(iso);
  if (Number.isNaN(d.getTime())) return iso;
  const day = d.toLocaleDateString('en-GB', { timeZone, day: 'numeric', month: 'short', year: 'numeric' });
  const time = d.toLocaleTimeString('en-GB', { timeZone, hour: '2-digit', minute: '2-digit' });
  return `${day}, ${time}`;
}
