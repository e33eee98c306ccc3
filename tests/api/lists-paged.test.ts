import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeTestApp, signedIn, type Client, type TestApp } from './test-app';
import { Blanket } from '../../server/db/models/blanket';
import { Pledge } from '../../server/db/models/pledge';
import { Site } from '../../server/db/models/site';
import { User } from '../../server/db/models/user';
import { STATUS_ORDER } from '../../server/modules/blankets/blankets.service';
import type { BlanketSummary } from '@shared/schemas/blanket-log';
import type { PledgeView } from '@shared/schemas/pledge';
import type { IntakeQueue } from '@shared/schemas/intake-views';
import { DEFAULT_PAGE_SIZE, MAX_PAGE_SIZE } from '@shared/schemas/page';

let t: TestApp;
let vol: Client;
let organiser: Client;

beforeAll(async () => {
  t = await makeTestApp();
  vol = await signedIn(t.app, 'volunteer');
  organiser = await signedIn(t.app, 'organiser');
});
afterAll(async () => t.close());

async function allPages<T extends { id: number }>(c: Client, url: string, pageSize: number): Promise<{ items: T[]; total: number }> {
  const items: T[] = [];
  let total = 0;
  for (let page = 1; page < 100; page++) {
    const res = await c.get(`${url}${url.includes('?') ? '&' : '?'}page=${page}&pageSize=${pageSize}`);
    expect(res.status).toBe(200);
    expect(res.body.page).toBe(page);
    expect(res.body.pageSize).toBe(pageSize);
    expect(res.body.items.length).toBeLessThanOrEqual(pageSize);
    total = res.body.total;
    items.push(...(res.body.items as T[]));
    if (res.body.items.length < pageSize) break;
  }
  return { items, total };
}

describe('GET /api/blankets, paged on the server', () => {
  it('answers one page of the default size with the total, and the pages together hold every blanket once', async () => {
    const first = await organiser.get('/api/blankets');
    expect(first.body).toMatchObject({ page: 1, pageSize: DEFAULT_PAGE_SIZE, total: await Blanket.count() });
    expect(first.body.items.length).toBe(Math.min(DEFAULT_PAGE_SIZE, first.body.total));
    const { items, total } = await allPages<BlanketSummary>(organiser, '/api/blankets', 4);
    expect(items.length).toBe(total);
    expect(new Set(items.map((b) => b.id)).size).toBe(total);
    // Newest first by default.
    const times = items.map((b) => b.createdAt);
    expect([...times].sort().reverse()).toEqual(times);
  });

  it('sorts by code, status (a blanket’s life), size and maker, both ways', async () => {
    const codes = (await allPages<BlanketSummary>(organiser, '/api/blankets?sort=code&dir=asc', 7)).items.map((b) => b.code);
    expect(codes).toEqual([...codes].sort());
    const down = (await allPages<BlanketSummary>(organiser, '/api/blankets?sort=code&dir=desc', 7)).items.map((b) => b.code);
    expect(down).toEqual([...codes].reverse());
    const ranks = (await allPages<BlanketSummary>(organiser, '/api/blankets?sort=status', 7)).items.map((b) => STATUS_ORDER.indexOf(b.status));
    expect(ranks).toEqual([...ranks].sort((a, b) => a - b));
    const areas = (await allPages<BlanketSummary>(organiser, '/api/blankets?sort=size&dir=desc', 7)).items.map((b) => b.widthCm * b.lengthCm);
    expect(areas).toEqual([...areas].sort((a, b) => b - a));
    const makers = (await allPages<BlanketSummary>(organiser, '/api/blankets?sort=maker', 7)).items.map((b) => b.makerName);
    expect(makers).toEqual([...makers].sort((a, b) => (a < b ? -1 : a > b ? 1 : 0)));
  });

  it('filters by status and searches code, colour, recipient and maker', async () => {
    const booked = await organiser.get('/api/blankets?status=booked&pageSize=100');
    expect(booked.body.total).toBe(await Blanket.count({ where: { status: 'booked' } }));
    expect((booked.body.items as BlanketSummary[]).every((b) => b.status === 'booked')).toBe(true);

    const maren = await organiser.get('/api/blankets?q=maren&pageSize=100');
    const marenId = (await User.findOne({ where: { email: 'maren@example.org' } }))!.id;
    expect(maren.body.total).toBe(await Blanket.count({ where: { userId: marenId } }));

    const one = (await Blanket.findOne({ order: [['id', 'ASC']] }))!;
    const byCode = await organiser.get(`/api/blankets?q=${encodeURIComponent(one.code.toLowerCase())}`);
    expect((byCode.body.items as BlanketSummary[]).map((b) => b.id)).toContain(one.id);

    const lilac = await organiser.get('/api/blankets?q=LILAC');
    expect((lilac.body.items as BlanketSummary[]).every((b) => b.colours.toLowerCase().includes('lilac'))).toBe(true);
    expect(lilac.body.total).toBeGreaterThan(0);

    // A search is plain text: % and _ match themselves, not everything.
    const wild = await organiser.get('/api/blankets?q=%25');
    expect(wild.status).toBe(200);
    expect(wild.body.total).toBe(0);
    expect(wild.body.items).toEqual([]);
  });

  it("keeps a volunteer's list to their own blankets, paged the same way", async () => {
    const me = (await User.findOne({ where: { email: 'volunteer@example.org' } }))!;
    const { items, total } = await allPages<BlanketSummary>(vol, '/api/blankets', 2);
    expect(total).toBe(await Blanket.count({ where: { userId: me.id } }));
    expect(items.every((b) => b.userId === me.id)).toBe(true);
    // Searching for someone else's blanket finds nothing of theirs.
    const maren = await vol.get('/api/blankets?q=maren');
    expect(maren.body.total).toBe(0);
  });

  it('refuses pages that are not pages with a 400 naming the field', async () => {
    for (const q of ['page=0', 'page=x', `pageSize=${MAX_PAGE_SIZE + 1}`, 'pageSize=0', 'sort=colour', 'dir=up', `q=${'x'.repeat(101)}`]) {
      const res = await organiser.get(`/api/blankets?${q}`);
      expect(res.status, q).toBe(400);
      expect(res.body.error.issues.length, q).toBeGreaterThan(0);
    }
    const past = await organiser.get('/api/blankets?page=999');
    expect(past.status).toBe(200);
    expect(past.body.items).toEqual([]);
  });
});

describe('GET /api/pledges, paged on the server', () => {
  it('pages every pledge once, soonest due first, with the total', async () => {
    const { items, total } = await allPages<PledgeView>(organiser, '/api/pledges', 4);
    expect(total).toBe(await Pledge.count());
    expect(new Set(items.map((p) => p.id)).size).toBe(total);
    const due = items.map((p) => p.dueDate);
    expect(due).toEqual([...due].sort());
  });

  it('sorts by quantity and maker, filters by status and searches the maker', async () => {
    const qty = (await allPages<PledgeView>(organiser, '/api/pledges?sort=quantity&dir=desc', 5)).items.map((p) => p.quantity);
    expect(qty).toEqual([...qty].sort((a, b) => b - a));
    const makers = (await allPages<PledgeView>(organiser, '/api/pledges?sort=maker', 5)).items.map((p) => p.makerName ?? '');
    expect(makers).toEqual([...makers].sort((a, b) => (a < b ? -1 : a > b ? 1 : 0)));
    const fulfilled = await organiser.get('/api/pledges?status=fulfilled&pageSize=100');
    expect(fulfilled.body.total).toBe(await Pledge.count({ where: { status: 'fulfilled' } }));
    expect((fulfilled.body.items as PledgeView[]).every((p) => p.status === 'fulfilled')).toBe(true);
    const oona = await organiser.get('/api/pledges?q=OONA');
    expect(oona.body.total).toBe(2);
    expect((oona.body.items as PledgeView[]).every((p) => p.makerName === 'Oona Castell')).toBe(true);
  });

  it('refuses a bad sort or page size with a 400', async () => {
    expect((await organiser.get('/api/pledges?sort=recipient')).status).toBe(400);
    expect((await organiser.get('/api/pledges?pageSize=101')).status).toBe(400);
  });
});

describe('GET /api/intake/queue, bounded', () => {
  it('pages the waiting and the booked lists with their totals', async () => {
    const site = (await Site.findOne({ order: [['id', 'ASC']] }))!;
    const today = new Date();
    const iso = `${today.getFullYear()}-${String(today.getMonth() + 1).padStart(2, '0')}-${String(today.getDate()).padStart(2, '0')}`;
    const whole = (await organiser.get(`/api/intake/queue?siteId=${site.id}&date=${iso}&pageSize=100`)).body.queue as IntakeQueue;
    expect(whole.waitingTotal).toBe(whole.waiting.length);
    expect(whole.expectedTotal).toBe(await Blanket.count({ where: { siteId: site.id, status: 'booked' } }));
    expect(whole.expectedTotal).toBeGreaterThanOrEqual(2);
    const seen: number[] = [];
    for (let page = 1; page <= whole.expectedTotal; page++) {
      const q = (await organiser.get(`/api/intake/queue?siteId=${site.id}&date=${iso}&pageSize=1&expectedPage=${page}`)).body.queue as IntakeQueue;
      expect(q.expected).toHaveLength(1);
      expect(q.expectedTotal).toBe(whole.expectedTotal);
      expect(q.pageSize).toBe(1);
      seen.push(q.expected[0]!.id);
    }
    expect(seen).toEqual(whole.expected.map((b) => b.id));
    expect((await organiser.get(`/api/intake/queue?siteId=${site.id}&date=${iso}&waitingPage=0`)).status).toBe(400);
  });
});
