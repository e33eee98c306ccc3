import { z } from 'zod';
import type { BlanketStatus } from './blanket';
import { IsoDaySchema, type Closure, type OpeningHours } from './schedule';

/** 'missed': the slot ended without the maker, and an organiser marked it so. */
export const BOOKING_STATUSES = ['booked', 'cancelled', 'missed'] as const;
export type BookingStatus = (typeof BOOKING_STATUSES)[number];

/** A slot start as sent back by the server: ISO 8601 with an offset (or Z), to the minute. */
export const SlotStartSchema = z
  .string({ error: 'start must be a time like 2027-03-27T10:30:00+01:00' })
  .regex(/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}(:\d{2}(\.\d{1,3})?)?(Z|[+-]\d{2}:\d{2})$/, 'start must be a time with its offset, like 2027-03-27T10:30:00+01:00')
  .refine((s) => !Number.isNaN(Date.parse(s)), 'start is not a real time');

const blanketIds = z
  .array(z.number({ error: 'blanketIds: a list of blanket ids' }).int().positive(), { error: 'blanketIds: a list of blanket ids' })
  .min(1, 'Choose at least one finished blanket to bring')
  .max(20, 'At most 20 blankets in one visit')
  .refine((ids) => new Set(ids).size === ids.length, 'blanketIds: each blanket once');

const siteId = z.number({ error: 'siteId: choose a drop-off site' }).int().positive('siteId: choose a drop-off site');

/** POST /api/bookings */
export const BookingCreateSchema = z.object({ siteId, start: SlotStartSchema, blanketIds });
export type BookingCreate = z.infer<typeof BookingCreateSchema>;

/** PATCH /api/bookings/:id: another slot (at the same site or another), and/or other blankets. */
export const BookingUpdateSchema = z
  .object({ siteId: siteId.optional(), start: SlotStartSchema.optional(), blanketIds: blanketIds.optional() })
  .refine((v) => v.start !== undefined || v.blanketIds !== undefined, 'Send a new start or a new list of blankets')
  .refine((v) => v.siteId === undefined || v.start !== undefined, { message: 'A new site needs a start in one of its slots', path: ['start'] });
export type BookingUpdate = z.infer<typeof BookingUpdateSchema>;

/** GET /api/bookings: your own, or (organisers) a site's day. */
export const BookingListQuerySchema = z
  .object({ siteId: z.coerce.number().int().positive().optional(), day: IsoDaySchema.optional() })
  .refine((q) => (q.siteId === undefined) === (q.day === undefined), 'Ask for a site and a day together');
export type BookingListQuery = z.infer<typeof BookingListQuerySchema>;

/** GET /api/sites/:id/slots */
export const SlotQuerySchema = z.object({ from: IsoDaySchema, to: IsoDaySchema }).refine((q) => q.from <= q.to, { message: 'to must be on or after from', path: ['to'] });

export const SoonestQuerySchema = z.object({ limit: z.coerce.number().int().min(1).max(20).default(6) });

export const ReminderPreferenceSchema = z.object({ bookingReminders: z.boolean({ error: 'bookingReminders must be true or false' }) });

export interface SlotView {
  start: string;
  end: string;
  capacity: number;
  remaining: number;
}

export interface SiteSlotsView {
  siteId: number;
  timeZone: string;
  slots: SlotView[];
  /** Closed days in the range, with their notes. */
  closures: Closure[];
}

export interface SoonestSlotView extends SlotView {
  siteId: number;
  siteName: string;
}

export interface SiteScheduleView {
  openingHours: OpeningHours | null;
  slotMinutes: number;
  slotCapacity: number;
  closures: Closure[];
}

export interface BookingView {
  id: number;
  status: BookingStatus;
  siteId: number;
  siteName: string;
  siteAddress: string;
  start: string;
  end: string;
  timeZone: string;
  maker: { id: number; name: string };
  blankets: Array<{ id: number; code: string; status: BlanketStatus }>;
  /**
   * For the day view: every blanket already received; the slot is over and some never came
   * (not_arrived, which an organiser may mark as missed); or marked "did not come" (missed).
   */
  arrival: 'expected' | 'arrived' | 'not_arrived' | 'missed' | 'cancelled';
  /** Who marked it "did not come", and when (ISO 8601 with the drive's offset). */
  missed?: { at: string; by: string | null } | null;
}
