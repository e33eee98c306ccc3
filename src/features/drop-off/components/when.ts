/** Times are shown in the drive's zone, whatever zone the browser is in. */
export function timeIn(iso: string, zone: string): string {
  return new Intl.DateTimeFormat('en-GB', { timeZone: zone, hour: '2-digit', minute: '2-digit', hour12: false }).format(new Date(iso));
}

export function dayIn(iso: string, zone: string, opts: { weekday?: 'long' | 'short'; year?: boolean } = {}): string {
  return new Intl.DateTimeFormat('en-GB', {
    timeZone: zone,
    weekday: opts.weekday ?? 'long',
    day: 'numeric',
    // The app's one date format: "6 Jan 2027" (see components/ui/format-day), here in the drive's zone.
    month: 'short',
    ...(opts.year ? { year: 'numeric' } : {}),
  }).format(new Date(iso));
}

/** YYYY-MM-DD of an instant in the zone. */
export function isoDayIn(iso: string, zone: string): string {
  return new Intl.DateTimeFormat('en-CA', { timeZone: zone }).format(new Date(iso));
}

export function slotLabel(s: { start: string; end: string }, zone: string): string {
  return `${dayIn(s.start, zone)}, ${timeIn(s.start, zone)}–${timeIn(s.end, zone)}`;
}

/** A plain-date string plus n days (no zone involved: it is a calendar date). */
export function plusDays(day: string, n: number): string {
  const d = new Date(`${day}T12:00:00Z`);
  d.setUTCDate(d.getUTCDate() + n);
  return d.toISOString().slice(0, 10);
}
