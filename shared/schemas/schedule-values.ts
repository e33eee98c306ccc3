/**
 * The week's days, their names and an empty week, without zod or the date library: a page that
 * only lists or edits opening hours loads neither until it validates. ./schedule.ts re-exports
 * them, so the server and the schemas keep importing from there.
 */
import type { OpeningHours } from './schedule';

/** ISO weekdays in order, Monday first (ISO 8601 numbers them 1–7 the same way). */
export const WEEKDAYS = ['mon', 'tue', 'wed', 'thu', 'fri', 'sat', 'sun'] as const;
export type Weekday = (typeof WEEKDAYS)[number];
export const WEEKDAY_LABELS: Record<Weekday, string> = {
  mon: 'Monday', tue: 'Tuesday', wed: 'Wednesday', thu: 'Thursday', fri: 'Friday', sat: 'Saturday', sun: 'Sunday',
};

export const minutesOfDay = (hhmm: string): number => Number(hhmm.slice(0, 2)) * 60 + Number(hhmm.slice(3, 5));

export const EMPTY_HOURS: OpeningHours = { mon: [], tue: [], wed: [], thu: [], fri: [], sat: [], sun: [] };
