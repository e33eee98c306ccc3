import { DateTime } from 'luxon';
import { WEEKDAYS, minutesOfDay, type SiteSchedule } from '../schemas/schedule';

/** One bookable slot: ISO 8601 with the drive's offset for people, epoch ms for comparisons. */
export interface SlotTime {
  start: string;
  end: string;
  startMs: number;
  endMs: number;
}

/** Longest range one request may ask slots for. */
export const MAX_SLOT_RANGE_DAYS = 62;

const iso = (dt: DateTime) => dt.toISO({ suppressMilliseconds: true })!;

/** Whether a closure (single day or range, both ends included) covers this day. */
export function closedOn(schedule: Pick<SiteSchedule, 'closures'>, day: string) {
  return schedule.closures.find((c) => c.from <= day && day <= c.to) ?? null;
}

/** The wall-clock time on a day in a zone, or null when that time does not exist there (the hour skipped when clocks go forward). */
function wallClock(day: DateTime, minutes: number): DateTime | null {
  const dt = day.set({ hour: Math.floor(minutes / 60), minute: minutes % 60, second: 0, millisecond: 0 });
  return dt.hour * 60 + dt.minute === minutes && dt.hasSame(day, 'day') ? dt : null;
}

/**
 * The slots a site offers on each day from `fromDay` to `toDay` (both included, days in `zone`).
 * Slots are laid on the wall clock from each span's start, as long as a whole slot fits before the
 * span's end; days covered by a closure have none. Around a clock change a slot is offered only if
 * it starts and ends at times that exist that day and lasts exactly its length in real time, so
 * a slot never spans the skipped hour in spring or the repeated hour in autumn (in the repeated
 * hour the first pass, the one still on summer time, is the one offered).
 */
export function slotsBetween(schedule: SiteSchedule, zone: string, fromDay: string, toDay: string): SlotTime[] {
  const first = DateTime.fromISO(fromDay, { zone });
  const last = DateTime.fromISO(toDay, { zone });
  if (!first.isValid || !last.isValid) throw new RangeError(`Bad day or zone: ${fromDay}..${toDay} in ${zone}`);
  const out: SlotTime[] = [];
  const len = schedule.slotMinutes;
  for (let day = first.startOf('day'); day <= last; day = day.plus({ days: 1 }).startOf('day')) {
    const dayIso = day.toISODate()!;
    if (closedOn(schedule, dayIso)) continue;
    const spans = [...schedule.openingHours[WEEKDAYS[day.weekday - 1]]].sort((a, b) => minutesOfDay(a.from) - minutesOfDay(b.from));
    for (const span of spans) {
      const spanEnd = minutesOfDay(span.to);
      for (let m = minutesOfDay(span.from); m + len <= spanEnd; m += len) {
        const start = wallClock(day, m);
        const end = wallClock(day, m + len);
        if (!start || !end || end.toMillis() - start.toMillis() !== len * 60_000) continue;
        out.push({ start: iso(start), end: iso(end), startMs: start.toMillis(), endMs: end.toMillis() });
      }
    }
  }
  return out;
}

/** The day (YYYY-MM-DD) an instant falls on in a zone. */
export const dayIn = (ms: number, zone: string): string => DateTime.fromMillis(ms, { zone }).toISODate()!;

/** Today's date in a zone, for "today" on every page that means the drive's day. */
export const todayIn = (zone: string, now = Date.now()): string => dayIn(now, zone);

/** A day plus n days, as YYYY-MM-DD. */
export const addDays = (day: string, n: number): string => DateTime.fromISO(day, { zone: 'utc' }).plus({ days: n }).toISODate()!;

/** The number of days from one day to another (to − from). */
export const daysBetween = (from: string, to: string): number =>
  Math.round(DateTime.fromISO(to, { zone: 'utc' }).diff(DateTime.fromISO(from, { zone: 'utc' }), 'days').days);

/** An instant as ISO 8601 with the zone's offset, e.g. 2027-03-27T10:30:00+01:00. */
export const isoIn = (ms: number, zone: string): string => iso(DateTime.fromMillis(ms, { zone }));
