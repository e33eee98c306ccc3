import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeTestApp, type TestApp } from './test-app';
import { findAllPlain } from '../../server/db/plain-rows';
import { Blanket } from '../../server/db/models/blanket';
import { Pledge } from '../../server/db/models/pledge';
import { Need } from '../../server/db/models/need';
import { Recipient } from '../../server/db/models/recipient';
import { User } from '../../server/db/models/user';

let t: TestApp;
beforeAll(async () => {
  t = await makeTestApp();
});
afterAll(async () => t.close());

describe('findAllPlain', () => {
  it('answers what model instances hold, with booleans, JSON and dates typed, across one-row includes', async () => {
    const options = {
      include: [
        { model: User, as: 'maker', attributes: ['id', 'name', 'active'] },
        { model: Recipient, as: 'recipient' },
        { model: Pledge, as: 'pledge', include: [{ model: Need, as: 'need' }] },
      ],
      order: [['id', 'ASC']] as [string, string][],
    };
    const instances = (await Blanket.findAll(options)).map((b) => b.get({ plain: true }) as Record<string, unknown>);
    const plain = await findAllPlain(Blanket, options);
    expect(plain.length).toBeGreaterThan(3);
    expect(plain).toEqual(instances);
    // The demo holds both: blankets with no recipient yet (an empty LEFT JOIN answers null) and with one.
    expect(instances.some((b) => b.recipient === null)).toBe(true);
    expect(instances.some((b) => b.recipient !== null)).toBe(true);
    const one = plain[0] as { machineWashable: unknown; fibres: unknown; createdAt: unknown };
    expect(typeof one.machineWashable).toBe('boolean');
    expect(Array.isArray(one.fibres)).toBe(true);
    expect(one.createdAt).toBeInstanceOf(Date);
  });

  it('refuses an include of many rows rather than answer repeated parents', async () => {
    await expect(findAllPlain(Recipient, { include: [{ model: Need, as: 'needs' }] })).rejects.toThrow(/one-row associations/);
  });
});
