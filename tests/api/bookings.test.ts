import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { AddressInfo } from 'node:net';
import type { InferCreationAttributes } from 'sequelize';
import ical from 'node-ical';
import { DateTime } from 'luxon';
import { makeTestApp, openEveryDayDesk, signedIn, type Client, type TestApp } from './test-app';
import { Blanket } from '../../server/db/models/blanket';
import { BlanketEvent } from '../../server/db/models/blanket-event';
import { Booking } from '../../server/db/models/booking';
import { CaughtMail } from '../../server/db/models/caught-mail';
import { MailMessage } from '../../server/db/models/mail-message';
import { Recipient } from '../../server/db/models/recipient';
import { Site } from '../../server/db/models/site';
import { User } from '../../server/db/models/user';
import { sendDueReminders } from '../../server/modules/bookings/reminders';
import { catcherCredentials, startMailCatcher } from '../../server/mail/catcher';
import { createTransport } from '../../server/mail/transport';
import { deliverDue } from '../../server/mail/worker';
import { codeFromBytes } from '@shared/blankets/code';
import { addDays, todayIn } from '@shared/scheduling/slots';
import type { BookingView, SiteSlotsView } from '@shared/schemas/booking';
import { plainBlanket } from '../fixtures/blankets';

const ZONE = 'Europe/London';
const RACERS = 20;

let t: TestApp;
let coordinator: Client;
let organiser: Client;
let volunteer: Client;
let maker: User;
let shelterId: number;
let desk: Site;

let codeCounter = 0;
async function finishedBlanket(userId = maker.id) {
  const n = codeCounter++;
  return Blanket.create({
    code: codeFromBytes(Uint8Array.from([7, 3, (n >> 5) & 31, n & 31])),
    userId,
    recipientId: shelterId,
    status: 'finished',
    ...plainBlanket(),
  } as unknown as InferCreationAttributes<Blanket>);
}

/** The calendar attachment of the newest message to someone, parsed by node-ical (the independent reference parser). */
async function lastInvitation(to: string) {
  const m = await MailMessage.findOne({ where: { to }, order: [['id', 'DESC']] });
  const a = m?.attachments?.[0];
  if (!m || !a) throw new Error(`no invitation to ${to}`);
  const parsed = ical.sync.parseICS(a.content);
  const event = Object.values(parsed).find((c) => c?.type === 'VEVENT') as ical.VEvent & { sequence: string | number; method?: string };
  return { mail: m, attachment: a, raw: a.content, event, calendar: parsed.vcalendar as unknown as { method: string; prodid: string } };
}

const day = (n: number) => addDays(todayIn(ZONE), n);

async function slotsOn(siteId: number, d: string) {
  const res = await volunteer.get(`/api/sites/${siteId}/slots?from=${d}&to=${d}`);
  expect(res.status).toBe(200);
  return res.body as SiteSlotsView;
}

beforeAll(async () => {
  t = await makeTestApp();
  coordinator = await signedIn(t.app, 'coordinator');
  organiser = await signedIn(t.app, 'organiser');
  volunteer = await signedIn(t.app, 'volunteer');
  maker = (await User.findOne({ where: { email: 'volunteer@example.org' } }))!;
  shelterId = (await Recipient.findOne({ where: { kind: 'family-shelter' } }))!.id;
  desk = (await Site.findByPk(
    await openEveryDayDesk(coordinator, { name: 'Test desk', address: '1 Test Row, Thimbleford', closures: [{ from: day(10), to: day(12), note: 'Closed for painting' }] }),
  ))!;
});
afterAll(async () => t.close());

describe('site schedules', () => {
  it('lets a coordinator set opening hours, slot length, visits per slot and closures', async () => {
    const res = await coordinator.patch(`/api/sites/${desk.id}`, { slotCapacity: 3, closures: [{ from: day(10), to: day(12), note: 'Closed for painting' }] });
    expect(res.status).toBe(200);
    expect(res.body.site).toMatchObject({ slotMinutes: 30, slotCapacity: 3, closures: [{ from: day(10), to: day(12), note: 'Closed for painting' }] });
    expect(res.body.site.openingHours.sun).toHaveLength(2);
  });

  it('refuses overlapping spans and nonsense with 400s that name the field, and keeps the old hours', async () => {
    const overlap = await coordinator.patch(`/api/sites/${desk.id}`, { openingHours: { mon: [{ from: '09:00', to: '12:00' }, { from: '11:00', to: '13:00' }] } });
    expect(overlap.status).toBe(400);
    expect(overlap.body.error.issues[0].path).toMatch(/^openingHours\.mon/);
    expect((await coordinator.patch(`/api/sites/${desk.id}`, { slotMinutes: 5 })).status).toBe(400);
    expect((await coordinator.patch(`/api/sites/${desk.id}`, { slotCapacity: 0 })).status).toBe(400);
    expect((await coordinator.patch(`/api/sites/${desk.id}`, { closures: [{ from: day(3), to: day(1) }] })).status).toBe(400);
    expect((await organiser.patch(`/api/sites/${desk.id}`, { slotCapacity: 9 })).status).toBe(403);
    await desk.reload();
    expect(desk.openingHours!.mon).toHaveLength(2);
  });

  it('answers slots with the drive offset, capacity and room, and none on closed days', async () => {
    const d = day(3);
    const { slots, timeZone } = await slotsOn(desk.id, d);
    expect(timeZone).toBe(ZONE);
    expect(slots).toHaveLength(14);
    const offset = DateTime.fromISO(d, { zone: ZONE }).toFormat('ZZ');
    expect(slots[0]).toEqual({ start: `${d}T09:00:00${offset}`, end: `${d}T09:30:00${offset}`, capacity: 3, remaining: 3 });
    expect((await slotsOn(desk.id, day(11))).slots).toEqual([]);
    expect((await slotsOn(desk.id, day(10))).closures[0].note).toBe('Closed for painting');
    expect((await volunteer.get(`/api/sites/${desk.id}/slots?from=${day(0)}&to=${day(90)}`)).status).toBe(400);
    expect((await volunteer.get(`/api/sites/${desk.id}/slots?from=tomorrow&to=${day(2)}`)).status).toBe(400);
  });

  it('lists the soonest slots with room across sites, and each site\'s next one', async () => {
    const res = await volunteer.get('/api/slots/soonest?limit=5');
    expect(res.status).toBe(200);
    const starts = (res.body.soonest as Array<{ start: string }>).map((s) => Date.parse(s.start));
    expect(starts).toEqual([...starts].sort((a, b) => a - b));
    expect(starts[0]).toBeGreaterThan(Date.now());
    expect(res.body.nextBySite[desk.id]).not.toBeNull();
  });
});

describe('booking a drop-off', () => {
  let booking: BookingView;
  let blankets: Blanket[];

  it('books finished blankets into a slot, moves them through the booking door and mails an invitation', async () => {
    blankets = [await finishedBlanket(), await finishedBlanket()];
    const { slots } = await slotsOn(desk.id, day(4));
    const res = await volunteer.post('/api/bookings', { siteId: desk.id, start: slots[2].start, blanketIds: blankets.map((b) => b.id) });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    booking = res.body.booking;
    expect(booking).toMatchObject({ status: 'booked', siteId: desk.id, start: slots[2].start, end: slots[2].end, arrival: 'expected' });
    for (const b of blankets) {
      await b.reload();
      expect(b.status).toBe('booked');
      expect(b.siteId).toBe(desk.id);
      const ev = await BlanketEvent.findOne({ where: { blanketId: b.id }, order: [['id', 'DESC']] });
      expect(ev).toMatchObject({ kind: 'booking', fromStatus: 'finished', toStatus: 'booked' });
    }
    expect((await slotsOn(desk.id, day(4))).slots[2].remaining).toBe(2);
  });

  it('attaches an RFC 5545 invitation that node-ical reads back with UID, DTSTAMP, DTSTART, DTEND, SUMMARY and LOCATION', async () => {
    const inv = await lastInvitation('volunteer@example.org');
    expect(inv.mail.subject).toMatch(/^Drop-off booked: Test desk/);
    expect(inv.attachment.contentType).toBe('text/calendar; charset=utf-8; method=REQUEST');
    // RFC 5545 §3.1: content lines end in CRLF; §3.6: VCALENDAR needs VERSION and PRODID.
    expect(inv.raw.split('\r\n').length).toBeGreaterThan(10);
    expect(inv.raw).toMatch(/^BEGIN:VCALENDAR\r\nVERSION:2\.0\r\n/);
    expect(inv.calendar.method).toBe('REQUEST');
    expect(inv.calendar.prodid).toBe('-//Kindloop//Drop-off booking//EN');
    expect(inv.event.uid).toBe(`drop-off-${booking.id}@127.0.0.1`);
    expect(inv.event.dtstamp).toBeInstanceOf(Date);
    expect(inv.event.start.toISOString()).toBe(new Date(booking.start).toISOString());
    expect(inv.event.end?.toISOString()).toBe(new Date(booking.end).toISOString());
    expect(inv.event.summary).toBe('Blanket drop-off at Test desk');
    expect(inv.event.location).toBe('Test desk, 1 Test Row, Thimbleford');
    expect(Number(inv.event.sequence)).toBe(0);
    expect(inv.event.status).toBe('CONFIRMED');
  });

  it('moves the booking to another slot: the same UID with a higher SEQUENCE updates the calendar entry', async () => {
    const { slots } = await slotsOn(desk.id, day(5));
    const res = await volunteer.patch(`/api/bookings/${booking.id}`, { start: slots[0].start });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.booking.start).toBe(slots[0].start);
    const inv = await lastInvitation('volunteer@example.org');
    expect(inv.mail.subject).toMatch(/^Drop-off changed/);
    expect(inv.event.uid).toBe(`drop-off-${booking.id}@127.0.0.1`);
    expect(Number(inv.event.sequence)).toBe(1);
    expect(inv.event.start.toISOString()).toBe(new Date(slots[0].start).toISOString());
    expect((await slotsOn(desk.id, day(4))).slots[2].remaining).toBe(3);
  });

  it('changes which blankets come: one left out goes back to finished, with the reason in its history', async () => {
    const extra = await finishedBlanket();
    const res = await volunteer.patch(`/api/bookings/${booking.id}`, { blanketIds: [blankets[0].id, extra.id] });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect((res.body.booking as BookingView).blankets.map((b) => b.id).sort()).toEqual([blankets[0].id, extra.id].sort());
    await blankets[1].reload();
    expect(blankets[1].status).toBe('finished');
    const ev = await BlanketEvent.findOne({ where: { blanketId: blankets[1].id }, order: [['id', 'DESC']] });
    expect(ev).toMatchObject({ kind: 'booking', toStatus: 'finished', reason: 'Left out of the drop-off' });
    blankets = [blankets[0], extra];
  });

  it('shows the booking in the organisers\' day at the site, and refuses that view to makers', async () => {
    const d = day(5);
    const res = await organiser.get(`/api/bookings?siteId=${desk.id}&day=${d}`);
    expect(res.status).toBe(200);
    const mine = (res.body.bookings as BookingView[]).find((b) => b.id === booking.id)!;
    expect(mine.maker.name).toBe(maker.name);
    expect(mine.blankets).toHaveLength(2);
    expect((await volunteer.get(`/api/bookings?siteId=${desk.id}&day=${d}`)).status).toBe(403);
    expect((await volunteer.get(`/api/bookings?siteId=${desk.id}`)).status).toBe(400);
    const own = (await volunteer.get('/api/bookings')).body.bookings as BookingView[];
    expect(own.map((b) => b.id)).toContain(booking.id);
  });

  it("answers someone else's booking with 404 and leaves it alone", async () => {
    const other = await signedIn(t.app, 'maren@example.org');
    expect((await other.delete(`/api/bookings/${booking.id}`)).status).toBe(404);
    expect((await other.patch(`/api/bookings/${booking.id}`, { start: booking.start })).status).toBe(404);
    expect((await other.post('/api/bookings', { siteId: desk.id, start: booking.start, blanketIds: [blankets[0].id] })).status).toBe(404);
  });

  it('refuses a bare status change to booked or back: those go through the booking', async () => {
    const b = await finishedBlanket();
    const res = await volunteer.patch(`/api/blankets/${b.id}`, { status: 'booked' });
    expect(res.status).toBe(409);
    expect(res.body.error.message).toMatch(/drop-off booking page/);
    const back = await volunteer.patch(`/api/blankets/${blankets[0].id}`, { status: 'finished', reason: 'Changed my mind' });
    expect(back.status).toBe(409);
  });

  it('refuses blankets that are not finished, starts that are not slots, and slots in the past', async () => {
    const { slots } = await slotsOn(desk.id, day(6));
    const again = await volunteer.post('/api/bookings', { siteId: desk.id, start: slots[0].start, blanketIds: [blankets[0].id] });
    expect(again.status).toBe(409);
    expect(again.body.error.message).toMatch(/only finished blankets/);
    const b = await finishedBlanket();
    const odd = await volunteer.post('/api/bookings', { siteId: desk.id, start: slots[0].start.replace(':00:00', ':07:00'), blanketIds: [b.id] });
    expect(odd.status).toBe(400);
    expect(odd.body.error.issues[0].path).toBe('start');
    const closed = await volunteer.post('/api/bookings', { siteId: desk.id, start: `${day(11)}T09:00:00Z`, blanketIds: [b.id] });
    expect(closed.status).toBe(400);
    const past = await volunteer.post('/api/bookings', { siteId: desk.id, start: `${day(-1)}T09:00:00${DateTime.fromISO(day(-1), { zone: ZONE }).toFormat('ZZ')}`, blanketIds: [b.id] });
    expect(past.status).toBe(409);
    expect((await volunteer.post('/api/bookings', { siteId: desk.id, start: slots[0].start, blanketIds: [] })).status).toBe(400);
    expect((await Blanket.findByPk(b.id))!.status).toBe('finished');
  });

  it('cancels: METHOD:CANCEL with the same UID, blankets finished again, the place free again', async () => {
    const res = await volunteer.delete(`/api/bookings/${booking.id}`);
    expect(res.status).toBe(200);
    expect(res.body.booking).toMatchObject({ status: 'cancelled', arrival: 'cancelled' });
    const inv = await lastInvitation('volunteer@example.org');
    expect(inv.mail.subject).toMatch(/^Drop-off cancelled/);
    expect(inv.calendar.method).toBe('CANCEL');
    expect(inv.event.uid).toBe(`drop-off-${booking.id}@127.0.0.1`);
    expect(inv.event.status).toBe('CANCELLED');
    expect(Number(inv.event.sequence)).toBe(3);
    for (const b of blankets) expect((await Blanket.findByPk(b.id))!.status).toBe('finished');
    expect((await slotsOn(desk.id, day(5))).slots[0].remaining).toBe(3);
    expect((await volunteer.delete(`/api/bookings/${booking.id}`)).status).toBe(409);
    expect((await volunteer.patch(`/api/bookings/${booking.id}`, { start: booking.start })).status).toBe(409);
  });
});

describe('20 makers booking the last places at once', () => {
  it('a slot with room for 3 takes exactly 3; the other 17 get 409 naming the next free slots, never 5xx', async () => {
    const { slots } = await slotsOn(desk.id, day(7));
    const slot = slots[5];
    expect(slot.remaining).toBe(3);
    const hash = maker.passwordHash;
    const racers = await Promise.all(
      Array.from({ length: RACERS }, async (_, i) => {
        const u = await User.create({ name: `Racer ${i}`, email: `racer${i}@example.org`, passwordHash: hash });
        const b = await finishedBlanket(u.id);
        return { client: await signedIn(t.app, u.email), blanketId: b.id };
      }),
    );
    const results = await Promise.all(racers.map((r) => r.client.post('/api/bookings', { siteId: desk.id, start: slot.start, blanketIds: [r.blanketId] })));
    const statuses = results.map((r) => r.status);
    expect(statuses.filter((s) => s >= 500)).toEqual([]);
    expect(statuses.filter((s) => s === 201)).toHaveLength(3);
    expect(statuses.filter((s) => s === 409)).toHaveLength(RACERS - 3);
    for (const r of results.filter((x) => x.status === 409)) {
      expect(r.body.error.message).toMatch(/^That slot is full .*Free soon at Test desk: /);
      expect(r.body.error.issues.filter((i: { path: string }) => i.path === 'nextFree')).toHaveLength(3);
    }
    expect(await Booking.count({ where: { siteId: desk.id, startsAt: new Date(slot.start), status: 'booked' } })).toBe(3);
    // The losers' blankets are untouched.
    const losers = racers.filter((_, i) => results[i].status === 409).map((r) => r.blanketId);
    expect(await Blanket.count({ where: { id: losers, status: 'finished' } })).toBe(RACERS - 3);
    expect((await slotsOn(desk.id, day(7))).slots[5].remaining).toBe(0);
  });
});

describe('day-before reminders', () => {
  it('sends once at 09:00 the day before in the drive zone, never twice, and survives a restart', async () => {
    const b = await finishedBlanket();
    const { slots } = await slotsOn(desk.id, day(8));
    const res = await volunteer.post('/api/bookings', { siteId: desk.id, start: slots[3].start, blanketIds: [b.id] });
    expect(res.status).toBe(201);
    const dueAt = DateTime.fromISO(`${day(7)}T09:00`, { zone: ZONE }).toJSDate();
    const ctx = { sequelize: t.sequelize, publicUrl: t.config.publicUrl };
    const reminders = () => MailMessage.count({ where: { to: 'volunteer@example.org', subject: 'Tomorrow: blanket drop-off at Test desk' } });
    const before = await reminders();
    await sendDueReminders(ctx, new Date(dueAt.getTime() - 60_000));
    expect(await reminders()).toBe(before);
    await sendDueReminders(ctx, dueAt);
    expect(await reminders()).toBe(before + 1);
    // A second pass, or one after a restart (the state is in the database), sends nothing more.
    await sendDueReminders(ctx, new Date(dueAt.getTime() + 3_600_000));
    expect(await reminders()).toBe(before + 1);
    const text = (await MailMessage.findOne({ where: { subject: 'Tomorrow: blanket drop-off at Test desk' }, order: [['id', 'DESC']] }))!.text;
    expect(text).toContain(b.code);
    expect(text).toContain(`(${ZONE})`);
  });

  it('sends none to a maker who turned reminders off', async () => {
    expect((await volunteer.put('/api/bookings/reminders', { bookingReminders: false })).status).toBe(200);
    expect((await volunteer.get('/api/bookings/reminders')).body.bookingReminders).toBe(false);
    const b = await finishedBlanket();
    const { slots } = await slotsOn(desk.id, day(9));
    const res = await volunteer.post('/api/bookings', { siteId: desk.id, start: slots[1].start, blanketIds: [b.id] });
    expect(res.status).toBe(201);
    const before = await MailMessage.count({ where: { subject: 'Tomorrow: blanket drop-off at Test desk' } });
    const result = await sendDueReminders({ sequelize: t.sequelize, publicUrl: t.config.publicUrl }, DateTime.fromISO(`${day(8)}T09:00`, { zone: ZONE }).toJSDate());
    expect(result.skipped).toBeGreaterThanOrEqual(1);
    expect(await MailMessage.count({ where: { subject: 'Tomorrow: blanket drop-off at Test desk' } })).toBe(before);
    expect((await Booking.findByPk(res.body.booking.id))!.reminderDoneAt).not.toBeNull();
    await volunteer.put('/api/bookings/reminders', { bookingReminders: true });
  });
});

describe('with the mail server down', () => {
  it('still books; every confirmation and its invitation arrive once the mail server is back', async () => {
    await MailMessage.update({ status: 'sent' }, { where: { status: 'pending' } });
    const sender = 'Kindloop <no-reply@example.org>';
    const credentials = catcherCredentials();
    const catcher = await startMailCatcher(0, { sender, credentials });
    const port = (catcher.server.address() as AddressInfo).port;
    await new Promise<void>((r) => catcher.close(() => r()));
    const transport = createTransport(undefined, { port, credentials });
    const made: number[] = [];
    for (let i = 0; i < 3; i++) {
      const b = await finishedBlanket();
      const { slots } = await slotsOn(desk.id, day(13));
      const res = await volunteer.post('/api/bookings', { siteId: desk.id, start: slots[i].start, blanketIds: [b.id] });
      expect(res.status).toBe(201);
      made.push(res.body.booking.id);
    }
    const down = await deliverDue(transport, sender);
    expect(down).toMatchObject({ sent: 0, unreachable: true });
    expect(await MailMessage.count({ where: { status: 'pending' } })).toBe(3);

    const again = await startMailCatcher(port, { sender, credentials });
    try {
      const back = await deliverDue(transport, sender, new Date(Date.now() + 3_600_000));
      expect(back.sent).toBe(3);
      const caught = await CaughtMail.findAll({ where: { to: 'volunteer@example.org' }, order: [['id', 'DESC']], limit: 3 });
      expect(caught).toHaveLength(3);
      const uids = caught.map((c) => (Object.values(ical.sync.parseICS(c.attachments![0].content)).find((x) => x?.type === 'VEVENT') as ical.VEvent).uid);
      expect(uids.sort()).toEqual(made.map((id) => `drop-off-${id}@127.0.0.1`).sort());
    } finally {
      await new Promise<void>((r) => again.close(() => r()));
    }
  });
});
