import { Op, type Sequelize, type Transaction } from 'sequelize';
import { DateTime } from 'luxon';
import { Booking, BookingBlanket } from '../../db/models/booking';
import { Blanket } from '../../db/models/blanket';
import { Site } from '../../db/models/site';
import { User } from '../../db/models/user';
import { HttpError, notFound } from '../../lib/http-error';
import { enqueueMail, type OutgoingMail } from '../../mail/outbox';
import type { Actor } from '../../auth/actor';
import { moveBlanket } from '../blankets/move-blanket';
import { STATUS_LABELS } from '@shared/blankets/status';
import type { BlanketStatus } from '@shared/schemas/blanket';
import type { BookingCreate, BookingListQuery, BookingUpdate, BookingView } from '@shared/schemas/booking';
import { addDays, dayIn, isoIn } from '@shared/scheduling/slots';
import { driveZone } from './drive-clock';
import { bookedCounts, nextFree, slotAt } from './slots.service';
import { calendarAttachment, parseMailbox } from './invitation';
import { bookingCancelledMail, bookingConfirmedMail, bookingMissedMail, bookingMovedMail, whenText, type BookingMailFacts } from './booking-mail';
import { nowMs } from '../../lib/clock';
import { appLinks } from '../../mail/links';

export interface BookingContext {
  sequelize: Sequelize;
  publicUrl: string;
  mailFrom: string;
  /** The clock, so tests can book "tomorrow" on any day. */
  now?: () => number;
}

/** When the day-before reminder is due: 09:00 on the day before, in the drive's zone. */
export const REMINDER_HOUR = 9;

/** Null when that moment has already passed: someone booking for tomorrow evening needs no reminder. */
export function reminderDueAt(startsAt: Date, zone: string, now: number): Date | null {
  const due = DateTime.fromJSDate(startsAt, { zone }).minus({ days: 1 }).set({ hour: REMINDER_HOUR, minute: 0, second: 0, millisecond: 0 });
  return due.toMillis() > now ? due.toJSDate() : null;
}

type LoadedBooking = Booking & { site: Site; maker: User; blankets: Blanket[]; missedBy?: User | null };

async function loadBooking(id: number, transaction?: Transaction): Promise<LoadedBooking | null> {
  return (await Booking.findByPk(id, {
    include: [
      { model: Site, as: 'site' },
      { model: User, as: 'maker', attributes: ['id', 'name', 'email', 'bookingReminders'] },
      { model: Blanket, as: 'blankets', attributes: ['id', 'code', 'status', 'userId'], through: { attributes: [] } },
      { model: User, as: 'missedBy', attributes: ['id', 'name'] },
    ],
    transaction,
  })) as LoadedBooking | null;
}

export function bookingView(b: LoadedBooking, zone: string, now: number): BookingView {
  const blankets = [...b.blankets].sort((x, y) => x.code.localeCompare(y.code)).map((x) => ({ id: x.id, code: x.code, status: x.status }));
  const live = b.status === 'booked';
  const stillBooked = blankets.some((x) => x.status === 'booked');
  return {
    id: b.id,
    status: b.status,
    siteId: b.siteId,
    siteName: b.site.name,
    siteAddress: b.site.address,
    start: isoIn(b.startsAt.getTime(), zone),
    end: isoIn(b.endsAt.getTime(), zone),
    timeZone: zone,
    maker: { id: b.maker.id, name: b.maker.name },
    blankets,
    arrival:
      b.status === 'missed' ? 'missed' : !live ? 'cancelled' : !stillBooked ? 'arrived' : b.endsAt.getTime() <= now ? 'not_arrived' : 'expected',
    missed: b.missedAt ? { at: isoIn(b.missedAt.getTime(), zone), by: b.missedBy?.name ?? null } : null,
  };
}

/** The site to book at, open, with the slot starting at `start`; a 400 naming the field otherwise. */
async function chooseSlot(siteId: number, start: string, zone: string, now: number, transaction: Transaction) {
  const site = await Site.findByPk(siteId, { transaction });
  if (!site || !site.active) throw new HttpError(400, 'siteId: choose one of the open drop-off sites', [{ path: 'siteId', message: 'Choose one of the open drop-off sites' }]);
  const startMs = Date.parse(start);
  const slot = slotAt(site, zone, startMs, dayIn(startMs, zone));
  if (!slot) {
    throw new HttpError(400, `start: ${site.name} has no slot starting then; pick one of its free slots`, [{ path: 'start', message: 'Not one of this site\'s slots' }]);
  }
  if (slot.startMs <= now) throw new HttpError(409, 'That slot has already begun; pick a later one', [{ path: 'start', message: 'That slot has already begun' }]);
  return { site, slot };
}

/**
 * Capacity is counted inside the caller's write transaction, which holds SQLite's write lock from its
 * first statement (docs/decisions/0005), so of any number of simultaneous bookings for the last places
 * exactly the places left are taken and the rest see a full slot.
 */
async function ensureRoom(site: Site, startMs: number, endMs: number, zone: string, now: number, transaction: Transaction, exceptBookingId?: number) {
  const taken = (await bookedCounts(site.id, startMs, startMs + 1, transaction, exceptBookingId)).get(startMs) ?? 0;
  if (taken < site.slotCapacity) return;
  const free = await nextFree(site, zone, now, 3, transaction);
  const hint = free.length
    ? ` Free soon at ${site.name}: ${free.map((s) => DateTime.fromISO(s.start, { zone }).setLocale('en-GB').toFormat('ccc d LLL HH:mm')).join(', ')}.`
    : ` ${site.name} has no free slot in the next four weeks; try another site.`;
  throw new HttpError(409, `That slot is full (${whenText(new Date(startMs), new Date(endMs), zone)}).${hint}`, [
    { path: 'start', message: 'That slot is full' },
    ...free.map((s) => ({ path: 'nextFree', message: s.start })),
  ]);
}

/** The maker's own blankets by id; someone else's is "not found" (never "forbidden"). */
async function ownBlankets(actor: Actor, ids: number[], transaction: Transaction): Promise<Blanket[]> {
  const rows = await Blanket.findAll({ where: { id: ids }, transaction });
  for (const id of ids) {
    const b = rows.find((r) => r.id === id);
    if (!b || b.userId !== actor.id) throw new HttpError(404, `Blanket ${id} was not found among your blankets`, [{ path: 'blanketIds', message: `Blanket ${id} is not one of yours` }]);
  }
  return ids.map((id) => rows.find((r) => r.id === id)!);
}

function mustBeFinished(blankets: Blanket[]) {
  const wrong = blankets.find((b) => b.status !== 'finished');
  if (wrong) {
    throw new HttpError(409, `Blanket ${wrong.code} is ${STATUS_LABELS[wrong.status as BlanketStatus].toLowerCase()}; only finished blankets can be booked for a drop-off`, [
      { path: 'blanketIds', message: `${wrong.code} is not finished` },
    ]);
  }
}

function facts(ctx: BookingContext, b: { startsAt: Date; endsAt: Date }, site: Site, maker: User, codes: string[], zone: string): BookingMailFacts {
  return {
    name: maker.name,
    siteName: site.name,
    siteAddress: site.address,
    siteNotes: site.notes ?? null,
    startsAt: b.startsAt,
    endsAt: b.endsAt,
    timeZone: zone,
    blanketCodes: codes,
    appUrl: appLinks.dropOff(ctx.publicUrl),
  };
}

function invitationMail(
  ctx: BookingContext,
  b: Booking,
  site: Site,
  maker: User,
  codes: string[],
  method: 'REQUEST' | 'CANCEL',
  message: { subject: string; text: string },
): OutgoingMail {
  const attachment = calendarAttachment({
    bookingId: b.id,
    sequence: b.sequence,
    method,
    startsAt: b.startsAt,
    endsAt: b.endsAt,
    siteName: site.name,
    siteAddress: site.address,
    siteNotes: site.notes ?? null,
    lat: site.lat,
    lng: site.lng,
    blanketCodes: codes,
    maker: { name: maker.name, email: maker.email },
    organiser: parseMailbox(ctx.mailFrom),
    host: new URL(ctx.publicUrl).hostname,
    appUrl: appLinks.dropOff(ctx.publicUrl),
  });
  return { to: maker.email, subject: message.subject, text: message.text, attachments: [attachment] };
}

export async function createBooking(ctx: BookingContext, actor: Actor, body: BookingCreate): Promise<BookingView> {
  const now = ctx.now?.() ?? nowMs();
  const id = await ctx.sequelize.transaction(async (transaction) => {
    const zone = await driveZone(transaction);
    const { site, slot } = await chooseSlot(body.siteId, body.start, zone, now, transaction);
    const blankets = await ownBlankets(actor, body.blanketIds, transaction);
    mustBeFinished(blankets);
    await ensureRoom(site, slot.startMs, slot.endMs, zone, now, transaction);
    const startsAt = new Date(slot.startMs);
    const booking = await Booking.create(
      { userId: actor.id, siteId: site.id, startsAt, endsAt: new Date(slot.endMs), reminderDueAt: reminderDueAt(startsAt, zone, now) },
      { transaction },
    );
    await BookingBlanket.bulkCreate(blankets.map((b) => ({ bookingId: booking.id, blanketId: b.id })), { transaction });
    for (const b of blankets) {
      await moveBlanket(
        { blanket: b, to: 'booked', actor, via: 'booking', kind: 'booking', data: { bookingId: booking.id, siteId: site.id, start: slot.start }, changes: { siteId: site.id } },
        transaction,
      );
    }
    const maker = (await User.findByPk(actor.id, { transaction }))!;
    const codes = blankets.map((b) => b.code);
    await enqueueMail(invitationMail(ctx, booking, site, maker, codes, 'REQUEST', bookingConfirmedMail(facts(ctx, booking, site, maker, codes, zone))), transaction);
    return booking.id;
  });
  return (await getBooking(actor, id, now))!;
}

async function ownBooking(actor: Actor, id: number, transaction?: Transaction): Promise<LoadedBooking> {
  const b = await loadBooking(id, transaction);
  if (!b || b.userId !== actor.id) throw notFound('That drop-off booking');
  return b;
}

export async function getBooking(actor: Actor, id: number, now = nowMs()): Promise<BookingView> {
  const b = await loadBooking(id);
  if (!b || (b.userId !== actor.id && actor.role === 'volunteer')) throw notFound('That drop-off booking');
  return bookingView(b, await driveZone(), now);
}

function mustBeLive(b: Booking, now: number) {
  if (b.status !== 'booked') throw new HttpError(409, b.status === 'missed' ? 'This drop-off was marked as not come; book a new one' : 'This drop-off was cancelled; book a new one');
  if (b.startsAt.getTime() <= now) throw new HttpError(409, 'This drop-off has already begun; it can no longer be changed');
}

export async function moveBooking(ctx: BookingContext, actor: Actor, id: number, body: BookingUpdate): Promise<BookingView> {
  const now = ctx.now?.() ?? nowMs();
  await ctx.sequelize.transaction(async (transaction) => {
    const zone = await driveZone(transaction);
    const b = await ownBooking(actor, id, transaction);
    mustBeLive(b, now);
    let site = b.site;
    if (body.start !== undefined) {
      const chosen = await chooseSlot(body.siteId ?? b.siteId, body.start, zone, now, transaction);
      site = chosen.site;
      if (chosen.slot.startMs !== b.startsAt.getTime() || site.id !== b.siteId) {
        await ensureRoom(site, chosen.slot.startMs, chosen.slot.endMs, zone, now, transaction, b.id);
        b.set({ siteId: site.id, startsAt: new Date(chosen.slot.startMs), endsAt: new Date(chosen.slot.endMs) });
        b.set({ reminderDueAt: reminderDueAt(b.startsAt, zone, now), reminderDoneAt: null });
      }
    }
    let carried = b.blankets.filter((x) => x.status === 'booked');
    if (body.blanketIds !== undefined) {
      const wanted = await ownBlankets(actor, body.blanketIds, transaction);
      const leaving = carried.filter((x) => !body.blanketIds!.includes(x.id));
      const joining = wanted.filter((x) => !carried.some((c) => c.id === x.id));
      mustBeFinished(joining);
      for (const x of leaving) {
        const blanket = (await Blanket.findByPk(x.id, { transaction }))!;
        await moveBlanket({ blanket, to: 'finished', actor, via: 'booking', kind: 'booking', reason: 'Left out of the drop-off', data: { bookingId: b.id }, changes: { siteId: null } }, transaction);
      }
      await BookingBlanket.destroy({ where: { bookingId: b.id, blanketId: leaving.map((x) => x.id) }, transaction });
      for (const x of joining) {
        await moveBlanket({ blanket: x, to: 'booked', actor, via: 'booking', kind: 'booking', data: { bookingId: b.id, siteId: site.id }, changes: { siteId: site.id } }, transaction);
      }
      await BookingBlanket.bulkCreate(joining.map((x) => ({ bookingId: b.id, blanketId: x.id })), { transaction });
      carried = [...carried.filter((c) => !leaving.includes(c)), ...joining];
    }
    // The blankets follow the booking to its site, so the intake queue there expects them.
    await Blanket.update({ siteId: site.id }, { where: { id: carried.map((x) => x.id), status: 'booked' }, transaction });
    b.sequence += 1;
    await b.save({ transaction });
    const codes = carried.map((x) => x.code).sort();
    await enqueueMail(invitationMail(ctx, b, site, b.maker, codes, 'REQUEST', bookingMovedMail(facts(ctx, b, site, b.maker, codes, zone))), transaction);
  });
  return getBooking(actor, id, now);
}

export async function cancelBooking(ctx: BookingContext, actor: Actor, id: number): Promise<BookingView> {
  const now = ctx.now?.() ?? nowMs();
  await ctx.sequelize.transaction(async (transaction) => {
    const zone = await driveZone(transaction);
    const b = await ownBooking(actor, id, transaction);
    if (b.status !== 'booked') throw new HttpError(409, b.status === 'missed' ? 'This drop-off was marked as not come; its blankets are finished again' : 'This drop-off is already cancelled');
    const carried = b.blankets.filter((x) => x.status === 'booked');
    for (const x of carried) {
      const blanket = (await Blanket.findByPk(x.id, { transaction }))!;
      await moveBlanket({ blanket, to: 'finished', actor, via: 'booking', kind: 'booking', reason: 'Drop-off cancelled', data: { bookingId: b.id }, changes: { siteId: null } }, transaction);
    }
    b.status = 'cancelled';
    b.sequence += 1;
    await b.save({ transaction });
    const codes = b.blankets.map((x) => x.code).sort();
    await enqueueMail(invitationMail(ctx, b, b.site, b.maker, codes, 'CANCEL', bookingCancelledMail(facts(ctx, b, b.site, b.maker, codes, zone))), transaction);
  });
  return getBooking(actor, id, now);
}

const LIST_INCLUDE = [
  { model: Site, as: 'site' },
  { model: User, as: 'maker', attributes: ['id', 'name', 'email'] },
  { model: Blanket, as: 'blankets', attributes: ['id', 'code', 'status', 'userId'], through: { attributes: [] } },
  { model: User, as: 'missedBy', attributes: ['id', 'name'] },
];

/**
 * Every booking at a site on a day of the drive's calendar, in slot order: the organisers' day view
 * and the intake queue's booked arrivals read the same list. A site's day holds a few dozen visits at
 * most (its slots times their places), so it comes whole.
 */
export async function siteDay(siteId: number, day: string, zone: string, now: number): Promise<BookingView[]> {
  const from = DateTime.fromISO(day, { zone }).startOf('day');
  const to = DateTime.fromISO(addDays(day, 1), { zone }).startOf('day');
  const rows = (await Booking.findAll({
    where: { siteId, startsAt: { [Op.gte]: from.toJSDate(), [Op.lt]: to.toJSDate() } },
    include: LIST_INCLUDE,
    order: [['startsAt', 'ASC'], ['id', 'ASC']],
  })) as LoadedBooking[];
  return rows.map((b) => bookingView(b, zone, now));
}

/** A maker's own bookings (newest first), or for organisers a site's day in slot order. */
export async function listBookings(actor: Actor, q: BookingListQuery, now = nowMs()): Promise<BookingView[]> {
  const zone = await driveZone();
  const include = LIST_INCLUDE;
  if (q.siteId !== undefined && q.day !== undefined) {
    if (actor.role === 'volunteer') throw new HttpError(403, "Only organisers and coordinators see a site's day");
    return siteDay(q.siteId, q.day, zone, now);
  }
  const rows = (await Booking.findAll({
    where: { userId: actor.id },
    include,
    order: [['startsAt', 'DESC']],
    limit: 50,
  })) as LoadedBooking[];
  return rows.map((b) => bookingView(b, zone, now));
}

/**
 * An organiser marks a visit "did not come" once its slot has ended by the drive's clock. The blankets
 * it still carried go back from booked to finished through moveBlanket, in the same transaction as the
 * mark, so the maker can book them again; any that did arrive stay where intake put them. Two people
 * marking at once: the write lock (docs/decisions/0005) lets the first through and the rest find it
 * marked already, a 409.
 */
export async function markMissed(ctx: BookingContext, actor: Actor, id: number): Promise<BookingView> {
  const now = ctx.now?.() ?? nowMs();
  await ctx.sequelize.transaction(async (transaction) => {
    const zone = await driveZone(transaction);
    const b = await loadBooking(id, transaction);
    if (!b) throw notFound('That drop-off booking');
    if (b.status === 'missed') throw new HttpError(409, `${b.maker.name}'s visit is already marked as not come${b.missedBy ? ` (by ${b.missedBy.name})` : ''}`);
    if (b.status !== 'booked') throw new HttpError(409, 'This drop-off was cancelled; there is nothing to mark');
    if (b.endsAt.getTime() > now) {
      throw new HttpError(409, `The slot runs until ${DateTime.fromJSDate(b.endsAt, { zone }).toFormat('HH:mm')} (${zone}); mark it after that`);
    }
    const carried = b.blankets.filter((x) => x.status === 'booked');
    if (carried.length === 0) throw new HttpError(409, `Every blanket of this visit was received; ${b.maker.name} came`);
    for (const x of carried) {
      const blanket = (await Blanket.findByPk(x.id, { transaction }))!;
      await moveBlanket(
        { blanket, to: 'finished', actor, via: 'booking', kind: 'booking', reason: 'Did not come to the drop-off', data: { bookingId: b.id, siteId: b.siteId }, changes: { siteId: null } },
        transaction,
      );
    }
    b.set({ status: 'missed', missedAt: new Date(now), missedById: actor.id, reminderDoneAt: b.reminderDoneAt ?? new Date(now) });
    await b.save({ transaction });
    const codes = carried.map((x) => x.code).sort();
    await enqueueMail({ to: b.maker.email, ...bookingMissedMail(facts(ctx, b, b.site, b.maker, codes, zone)) }, transaction);
  });
  return getBooking(actor, id, now);
}
