import { Site } from '../models/site';
import { Blanket } from '../models/blanket';
import { Booking, BookingBlanket } from '../models/booking';
import { addSeedStep } from './demo';
import { EMPTY_HOURS, type Closure, type OpeningHours } from '@shared/schemas/schedule';
import { addDays, slotsBetween, todayIn } from '@shared/scheduling/slots';
import { DEFAULT_TIME_ZONE } from '../../modules/bookings/drive-clock';
import { reminderDueAt } from '../../modules/bookings/bookings.service';

/** Demo opening hours: invented for the fictional town. The yarn shop's counter is a small desk. */
const SCHEDULES: Record<string, { openingHours: OpeningHours; slotMinutes: number; slotCapacity: number; closures: (today: string) => Closure[] }> = {
  'Thimbleford Library': {
    openingHours: (() => {
      const day = [{ from: '10:00', to: '12:30' }, { from: '14:00', to: '17:00' }];
      return { ...EMPTY_HOURS, tue: day, wed: day, thu: day, fri: day, sat: [{ from: '10:00', to: '13:00' }] };
    })(),
    slotMinutes: 30,
    slotCapacity: 3,
    closures: (today) => [{ from: addDays(today, 24), to: addDays(today, 24), note: 'Library closed for staff training' }],
  },
  'Millrace Community Hall': {
    openingHours: { ...EMPTY_HOURS, wed: [{ from: '18:00', to: '20:00' }], sat: [{ from: '09:00', to: '12:00' }] },
    slotMinutes: 20,
    slotCapacity: 4,
    closures: (today) => [{ from: addDays(today, 15), to: addDays(today, 17), note: 'The hall hosts the winter fair; bring blankets to the library instead' }],
  },
  "Hollyhock Yarn Parlour": {
    openingHours: (() => {
      const day = [{ from: '10:00', to: '13:00' }, { from: '14:00', to: '16:00' }];
      return { ...EMPTY_HOURS, tue: day, wed: day, thu: day, fri: day, sat: day };
    })(),
    slotMinutes: 30,
    slotCapacity: 1,
    closures: (today) => [{ from: addDays(today, 20), to: addDays(today, 23), note: 'Stocktaking: the counter is closed' }],
  },
};

/**
 * Opening hours for the demo sites, and a booking for each blanket the demo has as "booked":
 * the makers' visits spread over the coming days so the organisers' day view has people in it.
 */
addSeedStep(async (ctx) => {
  const { transaction } = ctx;
  const zone = DEFAULT_TIME_ZONE;
  const today = todayIn(zone, ctx.today.getTime());
  const sites = await Site.findAll({ order: [['id', 'ASC']], transaction });
  for (const site of sites) {
    const s = SCHEDULES[site.name];
    if (!s) continue;
    site.set({ openingHours: s.openingHours, slotMinutes: s.slotMinutes, slotCapacity: s.slotCapacity, closures: s.closures(today) });
    await site.save({ transaction });
  }
  const booked = await Blanket.findAll({ where: { status: 'booked' }, order: [['id', 'ASC']], transaction });
  // One visit per maker, at the site the demo already has them bound for, spread from two days ahead.
  const byMaker = new Map<number, Blanket[]>();
  for (const b of booked) byMaker.set(b.userId, [...(byMaker.get(b.userId) ?? []), b]);
  let i = 0;
  for (const blankets of byMaker.values()) {
    const site = sites.find((x) => x.id === blankets[0].siteId) ?? sites[0];
    const slots = slotsBetween(
      { openingHours: site.openingHours ?? EMPTY_HOURS, closures: site.closures ?? [], slotMinutes: site.slotMinutes, slotCapacity: site.slotCapacity },
      zone,
      addDays(today, 2),
      addDays(today, 16),
    );
    const slot = slots[(i * 3) % Math.max(1, slots.length)];
    i++;
    if (!slot) continue;
    const startsAt = new Date(slot.startMs);
    const booking = await Booking.create(
      { userId: blankets[0].userId, siteId: site.id, startsAt, endsAt: new Date(slot.endMs), reminderDueAt: reminderDueAt(startsAt, zone, ctx.today.getTime()) },
      { transaction },
    );
    await BookingBlanket.bulkCreate(blankets.map((b) => ({ bookingId: booking.id, blanketId: b.id })), { transaction });
    await Blanket.update({ siteId: site.id }, { where: { id: blankets.map((b) => b.id) }, transaction });
  }
});
