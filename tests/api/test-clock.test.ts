import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeTestApp, signedIn, type TestApp } from './test-app';
import { setClock } from '../../server/lib/clock';
import { loadConfig } from '../../server/config/env';
import { addDays, todayIn } from '@shared/scheduling/slots';

/** The browser tests' server may set the product clock; nothing else may. */
const D = addDays(todayIn('UTC'), 4);
let test: TestApp;
beforeAll(async () => {
  test = await makeTestApp({ env: { TEST_CLOCK: '1' } });
});
afterAll(async () => {
  setClock(null);
  await test.close();
});

describe('the settable clock', () => {
  it('on a TEST_CLOCK server lets a coordinator set it and give it back', async () => {
    const boss = await signedIn(test.app, 'coordinator');
    const set = await boss.put('/api/drive/clock/now', { now: `${D}T23:30:00Z` });
    expect(set.status, JSON.stringify(set.body)).toBe(200);
    expect(set.body).toMatchObject({ today: todayIn('Europe/London', Date.parse(`${D}T23:30:00Z`)), set: true });
    expect(Date.parse(set.body.now)).toBe(Date.parse(`${D}T23:30:00Z`));
    expect((await boss.put('/api/drive/clock/now', { now: 'soon' })).status).toBe(400);
    const organiser = await signedIn(test.app, 'organiser');
    expect((await organiser.put('/api/drive/clock/now', { now: null })).status).toBe(403);
    const back = await boss.put('/api/drive/clock/now', { now: null });
    expect(back.body).toMatchObject({ set: false, today: todayIn('Europe/London') });
  });

  it('refuses to start in production with one', () => {
    expect(() => loadConfig({ NODE_ENV: 'production', TEST_CLOCK: '1' })).toThrow(/TEST_CLOCK/);
    expect(loadConfig({ NODE_ENV: 'test' }).testClock).toBe(false);
  });
});
