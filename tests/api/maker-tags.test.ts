import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeTestApp, signedIn, type Client, type TestApp } from './test-app';
import { Blanket } from '../../server/db/models/blanket';
import { User } from '../../server/db/models/user';

let t: TestApp;
let vol: Client;
let organiser: Client;
let mine: Blanket[];
let theirs: Blanket;

beforeAll(async () => {
  t = await makeTestApp();
  vol = await signedIn(t.app, 'volunteer');
  organiser = await signedIn(t.app, 'organiser');
  const me = (await User.findOne({ where: { email: 'volunteer@example.org' } }))!;
  const other = (await User.findOne({ where: { email: 'maren@example.org' } }))!;
  mine = await Blanket.findAll({ where: { userId: me.id }, order: [['id', 'ASC']] });
  theirs = (await Blanket.findOne({ where: { userId: other.id } }))!;
  expect(mine.length).toBeGreaterThan(1);
});
afterAll(async () => t.close());

/** A refusal a person can read: a sentence, not a field name and a colon, and no internal ids. */
function expectWorded(message: string, ids: number[]) {
  expect(message).toMatch(/^[A-Z]/);
  expect(message).not.toMatch(/^\w+:/);
  expect(message).not.toMatch(/\bids\b/);
  for (const id of ids) expect(message).not.toMatch(new RegExp(`\\b${id}\\b`));
}

describe('makers print their own tags', () => {
  it('prints several of a maker’s own blankets at once, in the order asked', async () => {
    const ids = mine.map((b) => b.id).reverse();
    const res = await vol.get(`/api/blankets/tags?ids=${ids.join(',')}`);
    expect(res.status).toBe(200);
    expect(res.body.tags.map((x: { id: number }) => x.id)).toEqual(ids);
    expect(res.body.tags[0].qrSvg).toContain('<svg');
  });

  it('refuses someone else’s blanket in words a person reads, without saying whose it is', async () => {
    const res = await vol.get(`/api/blankets/tags?ids=${mine[0]!.id},${theirs.id}`);
    expect(res.status).toBe(404);
    expectWorded(res.body.error.message, [mine[0]!.id, theirs.id]);
    expect(res.body.error.message).toMatch(/not among yours/);
    expect(res.body.error.message).toMatch(/My blankets/);
    // The same words for a blanket that does not exist at all.
    const none = await vol.get(`/api/blankets/tags?ids=${mine[0]!.id},999999`);
    expect(none.body.error.message).toBe(res.body.error.message);
  });

  it('words a broken tag-sheet link for people too', async () => {
    for (const url of ['/api/blankets/tags?ids=1;2', '/api/blankets/tags', `/api/blankets/tags?ids=${Array.from({ length: 61 }, (_, i) => i + 1).join(',')}`]) {
      const res = await organiser.get(url);
      expect(res.status, url).toBe(400);
      expect(res.body.error.issues[0].path).toBe('ids');
      expectWorded(res.body.error.issues[0].message, []);
    }
  });
});
