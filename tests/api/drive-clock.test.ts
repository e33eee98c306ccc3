import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import type { InferCreationAttributes } from 'sequelize';
import { makeTestApp, openEveryDayDesk, signedIn, type Client, type TestApp } from './test-app';
import { Blanket } from '../../server/db/models/blanket';
import { BlanketEvent } from '../../server/db/models/blanket-event';
import { Booking } from '../../server/db/models/booking';
import { MailMessage } from '../../server/db/models/mail-message';
import { Recipient } from '../../server/db/models/recipient';
import { Site } from '../../server/db/models/site';
import { User } from '../../server/db/models/user';
import { setClock } from '../../server/lib/clock';
import { codeFromBytes } from '@shared/blankets/code';
import { addDays, todayIn } from '@shared/scheduling/slots';
import type { BookingView, SiteSlotsView } from '@shared/schemas/booking';
import type { IntakeQueue } from '@shared/schemas/intake-views';
import { plainBlanket } from '../fixtures/blankets';

/**
 * "Today" is the drive's day, read in its zone from the product clock, never the server's zone or UTC.
 * The clock is pinned to half an hour either side of midnight UTC, where the three disagree.
 */

let t: TestApp;
let coordinator: Client;
let organiser: Client;
let volunteer: Client;
let maker: User;
let shelterId: number;
let desk: Site;

// A day a few days ahead (in UTC), so pledges and bookings made against it are still in the future now.
const D = addDays(todayIn('UTC'), 4);
const at = (iso: string) => Date.parse(iso);

let codeCounter = 0;
async function finishedBlanket(userId = maker.id) {
  const n = codeCounter++;
  return Blanket.create({
    code: codeFromBytes(Uint8Array.from([9, 5, (n >> 5) & 31, n & 31])),
    userId,
    recipientId: shelterId,
    status: 'finished',
    ...plainBlanket(),
  } as unknown as InferCreationAttributes<Blanket>);
}

async function setZone(timeZone: string) {
  const res = await coordinator.put('/api/drive/clock', { timeZone });
  expect(res.status, JSON.stringify(res.body)).toBe(200);
}

async function book(day: string, index: number, blanketIds: number[]): Promise<BookingView> {
  const slots = (await volunteer.get(`/api/sites/${desk.id}/slots?from=${day}&to=${day}`)).body as SiteSlotsView;
  const res = await volunteer.post('/api/bookings', { siteId: desk.id, start: slots.slots[index].start, blanketIds });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body.booking as BookingView;
}

beforeAll(async () => {
  t = await makeTestApp();
  coordinator = await signedIn(t.app, 'coordinator');
  organiser = await signedIn(t.app, 'organiser');
  volunteer = await signedIn(t.app, 'volunteer');
  maker = (await User.findOne({ where: { email: 'volunteer@example.org' } }))!;
  shelterId = (await Recipient.findOne({ where: { kind: 'family-shelter' } }))!.id;
  desk = (await Site.findByPk(await openEveryDayDesk(coordinator, { name: 'Clock desk', address: '2 Test Row, Thimbleford' })))!;
});
afterEach(async () => {
  setClock(null);
  await setZone('Europe/London');
});
afterAll(async () => t.close());

describe("the drive's clock", () => {
  it("answers today in the drive's zone: at 23:30 UTC a zone an hour ahead is already on the next day", async () => {
    setClock(at(`${D}T23:30:00Z`));
    await setZone('Europe/Berlin');
    const ahead = (await volunteer.get('/api/drive/clock')).body;
    expect(ahead).toMatchObject({ timeZone: 'Europe/Berlin', today: addDays(D, 1), set: true });
    expect(ahead.now).toBe(`${addDays(D, 1)}T00:30:00+01:00`);
    await setZone('Europe/London');
    expect((await volunteer.get('/api/drive/clock')).body.today).toBe(D);
  });

  it('and the reverse: at 02:30 UTC a zone five hours behind is still on the day before', async () => {
    setClock(at(`${D}T02:30:00Z`));
    await setZone('America/New_York');
    const behind = (await volunteer.get('/api/drive/clock')).body;
    expect(behind).toMatchObject({ timeZone: 'America/New_York', today: addDays(D, -1) });
    expect(behind.now).toBe(`${addDays(D, -1)}T21:30:00-05:00`);
  });

  it('lets only a coordinator set the zone, to an IANA name, and refuses anything else with a 400 that keeps the old zone', async () => {
    expect((await coordinator.put('/api/drive/clock', { timeZone: 'Mars/Olympus' })).status).toBe(400);
    expect((await coordinator.put('/api/drive/clock', { timeZone: '' })).status).toBe(400);
    expect((await coordinator.put('/api/drive/clock', { timeZone: 42 })).status).toBe(400);
    expect((await organiser.put('/api/drive/clock', { timeZone: 'Asia/Tokyo' })).status).toBe(403);
    expect((await volunteer.get('/api/drive/clock')).body.timeZone).toBe('Europe/London');
    const ok = await coordinator.put('/api/drive/clock', { timeZone: 'Asia/Tokyo' });
    expect(ok.status).toBe(200);
    expect(ok.body.timeZone).toBe('Asia/Tokyo');
    expect((await volunteer.get('/api/drive/clock')).body.timeZone).toBe('Asia/Tokyo');
  });

  it('keeps the product clock unsettable over HTTP unless the server was started with TEST_CLOCK', async () => {
    const res = await coordinator.put('/api/drive/clock/now', { now: `${D}T10:00:00Z` });
    expect(res.status).toBe(404);
    expect((await volunteer.get('/api/drive/clock')).body.set).toBe(false);
  });
});

describe('a pledge due "today" around midnight', () => {
  it("is late once the drive's day has moved past its date, whatever UTC says", async () => {
    const made = await volunteer.post('/api/pledges', { needId: null, quantity: 1, sizeCategory: 'baby', dueDate: D });
    expect(made.status, JSON.stringify(made.body)).toBe(201);
    const id = made.body.pledge.id as number;
    const late = async () => (await volunteer.get(`/api/pledges/${id}`)).body.pledge.late as boolean;

    // 23:30 UTC on its day: in Berlin it is 00:30 the next day, so the pledge is late there.
    setClock(at(`${D}T23:30:00Z`));
    await setZone('Europe/Berlin');
    expect(await late()).toBe(true);
    // The same moment in London (UTC+0 in winter, +1 in summer) is still the due day or just past it.
    await setZone('Europe/London');
    expect(await late()).toBe(todayIn('Europe/London', at(`${D}T23:30:00Z`)) > D);

    // 02:30 UTC the next day: already the day after in UTC, but still the due day in New York.
    setClock(at(`${addDays(D, 1)}T02:30:00Z`));
    await setZone('America/New_York');
    expect(await late()).toBe(false);
    // An hour past New York's midnight it is late there too.
    setClock(at(`${addDays(D, 1)}T06:00:00Z`));
    expect(await late()).toBe(true);
  });

  it('takes "today" as the earliest due date by the drive\'s day, not UTC\'s', async () => {
    // 02:30 UTC: in New York it is still yesterday, so a pledge due yesterday (UTC's) is due today there.
    setClock(at(`${D}T02:30:00Z`));
    await setZone('America/New_York');
    const ok = await volunteer.post('/api/pledges', { needId: null, quantity: 1, sizeCategory: 'baby', dueDate: addDays(D, -1) });
    expect(ok.status, JSON.stringify(ok.body)).toBe(201);
    await setZone('Europe/London');
    const refused = await volunteer.post('/api/pledges', { needId: null, quantity: 1, sizeCategory: 'baby', dueDate: addDays(D, -1) });
    expect(refused.status).toBe(400);
    expect(refused.body.error.issues[0].path).toBe('dueDate');
  });
});

describe("the intake queue's day", () => {
  it("is the drive's today when no day is asked for, and shows that day's booked arrivals beside the walk-ins", async () => {
    // A visit booked for the day after D (at 09:00 desk time), made now by the real clock.
    const target = addDays(D, 1);
    const blankets = [await finishedBlanket(), await finishedBlanket()];
    const visit = await book(target, 0, blankets.map((b) => b.id));

    // 23:30 UTC on D: in Berlin the queue is already the next day's, with the visit in it.
    setClock(at(`${D}T23:30:00Z`));
    await setZone('Europe/Berlin');
    const ahead = (await organiser.get(`/api/intake/queue?siteId=${desk.id}`)).body.queue as IntakeQueue;
    expect(ahead.date).toBe(target);
    expect(ahead.timeZone).toBe('Europe/Berlin');
    const arrival = ahead.bookedArrivals.find((a) => a.bookingId === visit.id);
    expect(arrival).toMatchObject({ makerName: maker.name, arrival: 'expected' });
    expect(arrival!.blankets.map((b) => b.code).sort()).toEqual(blankets.map((b) => b.code).sort());
    // The day's times carry Berlin's offset.
    expect(arrival!.start).toMatch(/\+01:00$|\+02:00$/);

    // The same moment in London is still D: the visit is not in today's queue.
    await setZone('Europe/London');
    const london = (await organiser.get(`/api/intake/queue?siteId=${desk.id}`)).body.queue as IntakeQueue;
    expect(london.date).toBe(D);
    expect(london.bookedArrivals.some((a) => a.bookingId === visit.id)).toBe(false);
    // An explicit day is still answered as asked.
    const asked = (await organiser.get(`/api/intake/queue?siteId=${desk.id}&date=${target}`)).body.queue as IntakeQueue;
    expect(asked.bookedArrivals.some((a) => a.bookingId === visit.id)).toBe(true);
  });

  it('says which arrivals came with their booking and which walked in', async () => {
    const today = todayIn('Europe/London');
    const walkIn = await finishedBlanket();
    const bookedOne = await finishedBlanket();
    const visit = await book(addDays(today, 2), 1, [bookedOne.id]);
    for (const b of [walkIn, bookedOne]) {
      const fresh = (await Blanket.findByPk(b.id))!;
      const res = await organiser.post(`/api/blankets/${b.id}/intake`, { siteId: desk.id, widthCm: 80, lengthCm: 100, version: fresh.version });
      expect(res.status, JSON.stringify(res.body)).toBe(200);
    }
    const queue = (await organiser.get(`/api/intake/queue?siteId=${desk.id}&date=${today}`)).body.queue as IntakeQueue;
    expect(queue.arrived.find((i) => i.id === walkIn.id)?.arrivedAs).toBe('walk-in');
    expect(queue.arrived.find((i) => i.id === bookedOne.id)?.arrivedAs).toBe('booked');
    // Its booking now reads as arrived on its day.
    const day = (await organiser.get(`/api/intake/queue?siteId=${desk.id}&date=${addDays(today, 2)}`)).body.queue as IntakeQueue;
    expect(day.bookedArrivals.find((a) => a.bookingId === visit.id)?.arrival).toBe('arrived');
  });
});

describe('marking a visit "did not come"', () => {
  it('is refused until the slot has ended by the drive clock, then moves its blankets back to finished in one go', async () => {
    const target = addDays(D, 2);
    const blankets = [await finishedBlanket(), await finishedBlanket()];
    const visit = await book(target, 2, blankets.map((b) => b.id));
    const end = Date.parse(visit.end);

    setClock(end - 60_000);
    const early = await organiser.post(`/api/bookings/${visit.id}/missed`, {});
    expect(early.status).toBe(409);
    expect(early.body.error.message).toMatch(/runs until/);
    expect((await Blanket.findByPk(blankets[0].id))!.status).toBe('booked');

    setClock(end + 60_000);
    expect((await volunteer.post(`/api/bookings/${visit.id}/missed`, {})).status).toBe(403);
    const res = await organiser.post(`/api/bookings/${visit.id}/missed`, {});
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.booking).toMatchObject({ status: 'missed', arrival: 'missed', missed: { by: 'Odile Farrant' } });
    for (const b of blankets) {
      const fresh = (await Blanket.findByPk(b.id))!;
      expect(fresh.status).toBe('finished');
      expect(fresh.siteId).toBeNull();
      const event = await BlanketEvent.findOne({ where: { blanketId: b.id }, order: [['id', 'DESC']] });
      expect(event).toMatchObject({ kind: 'booking', fromStatus: 'booked', toStatus: 'finished', reason: 'Did not come to the drop-off' });
    }
    // The maker hears, once, that the blankets are free to book again.
    const notices = await MailMessage.findAll({ where: { to: 'volunteer@example.org', subject: 'We missed you at Clock desk' } });
    expect(notices).toHaveLength(1);
    expect(notices[0].text).toContain(blankets.map((b) => b.code).sort().join(', '));
    expect(notices[0].text).toContain(`${t.config.publicUrl}/drop-off\n`);
    // The day view names who did not come; the maker can no longer move or cancel it, but can book again.
    const dayView = (await organiser.get(`/api/bookings?siteId=${desk.id}&day=${target}`)).body.bookings as BookingView[];
    expect(dayView.find((b) => b.id === visit.id)).toMatchObject({ arrival: 'missed', maker: { name: maker.name } });
    expect((await volunteer.delete(`/api/bookings/${visit.id}`)).status).toBe(409);
    setClock(null);
    const again = await book(addDays(D, 3), 0, blankets.map((b) => b.id));
    expect(again.status).toBe('booked');
  });

  it('leaves blankets that did arrive where intake put them, and refuses a visit whose blankets all came', async () => {
    const target = addDays(todayIn('Europe/London'), 2);
    const came = await finishedBlanket();
    const stayedHome = await finishedBlanket();
    const visit = await book(target, 3, [came.id, stayedHome.id]);
    const fresh = (await Blanket.findByPk(came.id))!;
    expect((await organiser.post(`/api/blankets/${came.id}/intake`, { siteId: desk.id, widthCm: 80, lengthCm: 100, version: fresh.version })).status).toBe(200);
    setClock(Date.parse(visit.end) + 1);
    expect((await organiser.post(`/api/bookings/${visit.id}/missed`, {})).status).toBe(200);
    expect((await Blanket.findByPk(came.id))!.status).toBe('received');
    expect((await Blanket.findByPk(stayedHome.id))!.status).toBe('finished');

    setClock(null);
    const all = await finishedBlanket();
    const full = await book(target, 4, [all.id]);
    const allFresh = (await Blanket.findByPk(all.id))!;
    expect((await organiser.post(`/api/blankets/${all.id}/intake`, { siteId: desk.id, widthCm: 80, lengthCm: 100, version: allFresh.version })).status).toBe(200);
    setClock(Date.parse(full.end) + 1);
    const refused = await organiser.post(`/api/bookings/${full.id}/missed`, {});
    expect(refused.status).toBe(409);
    expect(refused.body.error.message).toMatch(/came/);
    expect((await organiser.post('/api/bookings/999999/missed', {})).status).toBe(404);
  });

  it('20 marks at once from organisers and a coordinator: one wins, 19 get 409, the blankets move back once', async () => {
    const target = addDays(D, 2);
    const blanket = await finishedBlanket();
    const visit = await book(target, 5, [blanket.id]);
    setClock(Date.parse(visit.end) + 1);
    // Both staff roles, each pressing the button ten times at once.
    const clients = Array.from({ length: 20 }, (_, i) => (i % 2 ? coordinator : organiser));
    const answers = await Promise.all(clients.map((c) => c.post(`/api/bookings/${visit.id}/missed`, {})));
    const statuses = answers.map((r) => r.status);
    expect(statuses.filter((s) => s === 200)).toHaveLength(1);
    expect(statuses.filter((s) => s === 409)).toHaveLength(19);
    expect(answers.find((r) => r.status === 409)!.body.error.message).toMatch(/already marked/);
    expect((await Booking.findByPk(visit.id))!.status).toBe('missed');
    expect(await BlanketEvent.count({ where: { blanketId: blanket.id, toStatus: 'finished', reason: 'Did not come to the drop-off' } })).toBe(1);
  });
});
