import { Op, type Transaction } from 'sequelize';
import { Booking } from '../../db/models/booking';
import { Site } from '../../db/models/site';
import { HttpError, notFound } from '../../lib/http-error';
import { EMPTY_HOURS, type SiteSchedule } from '@shared/schemas/schedule';
import type { SiteSlotsView, SlotView, SoonestSlotView } from '@shared/schemas/booking';
import { MAX_SLOT_RANGE_DAYS, addDays, daysBetween, slotsBetween, todayIn, type SlotTime } from '@shared/scheduling/slots';
import { driveZone } from './drive-clock';
import { nowMs } from '../../lib/clock';

/** How far ahead the soonest-slot search and the "next free" hints look. */
export const LOOKAHEAD_DAYS = 28;

export function scheduleOf(site: Site): SiteSchedule {
  return {
    openingHours: site.openingHours ?? EMPTY_HOURS,
    closures: site.closures ?? [],
    slotMinutes: site.slotMinutes,
    slotCapacity: site.slotCapacity,
  };
}

/** Live bookings per slot start (epoch ms) at a site between two instants. */
export async function bookedCounts(siteId: number, fromMs: number, toMs: number, transaction?: Transaction, exceptBookingId?: number) {
  const rows = await Booking.findAll({
    attributes: ['id', 'startsAt'],
    where: {
      siteId,
      status: 'booked',
      startsAt: { [Op.gte]: new Date(fromMs), [Op.lt]: new Date(toMs) },
      ...(exceptBookingId ? { id: { [Op.ne]: exceptBookingId } } : {}),
    },
    transaction,
  });
  const counts = new Map<number, number>();
  for (const r of rows) counts.set(r.startsAt.getTime(), (counts.get(r.startsAt.getTime()) ?? 0) + 1);
  return counts;
}

/** The site's slots from one day to another with what is left in each; past slots are left out. */
export async function slotsWithRoom(site: Site, zone: string, from: string, to: string, now: number, transaction?: Transaction): Promise<SlotView[]> {
  const times = slotsBetween(scheduleOf(site), zone, from, to).filter((s) => s.startMs > now);
  if (times.length === 0) return [];
  const counts = await bookedCounts(site.id, times[0].startMs, times.at(-1)!.startMs + 1, transaction);
  return times.map((s) => ({ start: s.start, end: s.end, capacity: site.slotCapacity, remaining: Math.max(0, site.slotCapacity - (counts.get(s.startMs) ?? 0)) }));
}

export async function siteSlots(siteId: number, from: string, to: string, now = nowMs()): Promise<SiteSlotsView> {
  if (daysBetween(from, to) > MAX_SLOT_RANGE_DAYS) {
    throw new HttpError(400, `Ask for at most ${MAX_SLOT_RANGE_DAYS} days of slots at a time`, [{ path: 'to', message: `At most ${MAX_SLOT_RANGE_DAYS} days after from` }]);
  }
  const site = await Site.findByPk(siteId);
  if (!site) throw notFound('That drop-off site');
  const zone = await driveZone();
  const slots = site.active ? await slotsWithRoom(site, zone, from, to, now) : [];
  const closures = (site.closures ?? []).filter((c) => c.to >= from && c.from <= to);
  return { siteId, timeZone: zone, slots, closures };
}

/** The next few slots with room at one site, for a "full" answer and the map's popups. */
export async function nextFree(site: Site, zone: string, now: number, limit: number, transaction?: Transaction): Promise<SlotView[]> {
  const today = todayIn(zone, now);
  const out: SlotView[] = [];
  // A week at a time, so a busy week does not cost the whole lookahead.
  for (let d = 0; d < LOOKAHEAD_DAYS && out.length < limit; d += 7) {
    const week = await slotsWithRoom(site, zone, addDays(today, d), addDays(today, Math.min(d + 6, LOOKAHEAD_DAYS)), now, transaction);
    out.push(...week.filter((s) => s.remaining > 0).slice(0, limit - out.length));
  }
  return out;
}

/** The soonest slots with room across every open site, and each site's next free slot. */
export async function soonestSlots(limit: number, now = nowMs()) {
  const zone = await driveZone();
  const sites = await Site.findAll({ where: { active: true }, order: [['name', 'ASC']] });
  const soonest: SoonestSlotView[] = [];
  const nextBySite: Record<number, SlotView | null> = {};
  for (const site of sites) {
    const free = await nextFree(site, zone, now, limit);
    nextBySite[site.id] = free[0] ?? null;
    soonest.push(...free.map((s) => ({ ...s, siteId: site.id, siteName: site.name })));
  }
  soonest.sort((a, b) => Date.parse(a.start) - Date.parse(b.start) || a.siteName.localeCompare(b.siteName));
  return { timeZone: zone, soonest: soonest.slice(0, limit), nextBySite };
}

/** The slot of this site that starts at this instant, or null when the site offers none then. */
export function slotAt(site: Site, zone: string, startMs: number, day: string): SlotTime | null {
  return slotsBetween(scheduleOf(site), zone, day, day).find((s) => s.startMs === startMs) ?? null;
}
