import { z } from 'zod';
import { IANAZone } from 'luxon';
import { EMPTY_HOURS, WEEKDAYS, WEEKDAY_LABELS, minutesOfDay, type Weekday } from './schedule-values';

export { EMPTY_HOURS, WEEKDAYS, WEEKDAY_LABELS, minutesOfDay, type Weekday };

/** A wall-clock time in the drive's zone, 24-hour "HH:MM". */
export const ClockTimeSchema = z
  .string({ error: 'A time must be text like 09:30' })
  .regex(/^([01]\d|2[0-3]):[0-5]\d$/, 'A time looks like 09:30 (24-hour clock)');

export const OpeningSpanSchema = z
  .object({ from: ClockTimeSchema, to: ClockTimeSchema })
  .refine((s) => minutesOfDay(s.from) < minutesOfDay(s.to), { message: 'A span must end after it starts', path: ['to'] });
export type OpeningSpan = z.infer<typeof OpeningSpanSchema>;

const daySpans = z
  .array(OpeningSpanSchema)
  .max(6, 'At most six opening spans a day')
  .default([])
  .superRefine((spans, ctx) => {
    const sorted = [...spans].sort((a, b) => minutesOfDay(a.from) - minutesOfDay(b.from));
    for (let i = 1; i < sorted.length; i++) {
      if (minutesOfDay(sorted[i].from) < minutesOfDay(sorted[i - 1].to)) {
        ctx.addIssue({ code: 'custom', message: `${sorted[i - 1].from}–${sorted[i - 1].to} and ${sorted[i].from}–${sorted[i].to} overlap` });
      }
    }
  });

/** Several spans a day per weekday; a weekday with no spans is closed. */
export const OpeningHoursSchema = z.object(
  Object.fromEntries(WEEKDAYS.map((d) => [d, daySpans])) as Record<Weekday, typeof daySpans>,
);
export type OpeningHours = z.infer<typeof OpeningHoursSchema>;

export const IsoDaySchema = z
  .string({ error: 'A day must be text like 2027-03-27' })
  .regex(/^\d{4}-\d{2}-\d{2}$/, 'A day looks like 2027-03-27')
  .refine((d) => !Number.isNaN(Date.parse(`${d}T00:00:00Z`)) && new Date(`${d}T00:00:00Z`).toISOString().startsWith(d), 'Not a real date');

/** A single day (from = to) or a range of days the site is closed, both ends included. */
export const ClosureSchema = z
  .object({
    from: IsoDaySchema,
    to: IsoDaySchema,
    note: z.string().trim().max(200, 'Note: at most 200 characters').default(''),
  })
  .refine((c) => c.from <= c.to, { message: 'A closure must end on or after the day it starts', path: ['to'] });
export type Closure = z.infer<typeof ClosureSchema>;

export const SlotMinutesSchema = z
  .number({ error: 'Slot length must be a number of minutes' })
  .int('Slot length: whole minutes')
  .min(10, 'Slot length: at least 10 minutes')
  .max(240, 'Slot length: at most 240 minutes');
export const SlotCapacitySchema = z
  .number({ error: 'Visits per slot must be a number' })
  .int('Visits per slot: a whole number')
  .min(1, 'Visits per slot: at least 1')
  .max(50, 'Visits per slot: at most 50');

/** What the slot engine needs to know about a site. */
export interface SiteSchedule {
  openingHours: OpeningHours;
  closures: Closure[];
  slotMinutes: number;
  slotCapacity: number;
}

/** An IANA time-zone name that the date library (and so the tz database it reads) knows. */
export const TimeZoneSchema = z
  .string({ error: 'The time zone must be text like Europe/London' })
  .trim()
  .min(1, 'Choose a time zone')
  .max(64)
  .refine((z) => IANAZone.isValidZone(z) && z.includes('/'), 'Not a time zone we know: use an IANA name like Europe/London');

export const DriveClockUpdateSchema = z.object({ timeZone: TimeZoneSchema });

/** GET /api/drive/clock: the drive's zone, its date today and the moment, with the zone's offset. */
export interface DriveClockView {
  timeZone: string;
  today: string;
  now: string;
  /** True while a test has set the clock (TEST_CLOCK servers only). */
  set: boolean;
}

/** PUT /api/drive/clock/now (TEST_CLOCK servers only): a moment with its offset, or null for the real time. */
export const TestClockSchema = z.object({
  now: z
    .string({ error: 'now must be a time like 2027-03-27T10:30:00+01:00, or null' })
    .regex(/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}(:\d{2}(\.\d{1,3})?)?(Z|[+-]\d{2}:\d{2})$/, 'now must be a time with its offset, like 2027-03-27T10:30:00+01:00')
    .refine((s) => !Number.isNaN(Date.parse(s)), 'now is not a real time')
    .nullable(),
});
