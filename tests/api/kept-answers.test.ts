import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { QueryTypes } from 'sequelize';
import request from 'supertest';
import sqlite3 from 'sqlite3';
import { makeTestApp, signedIn, type Client, type TestApp } from './test-app';
import { Need } from '../../server/db/models/need';
import { Recipient } from '../../server/db/models/recipient';
import { KEPT_MAX_MS, OTHER_WRITERS_EVERY_MS, keptUntilWrite, mayWrite, writeGeneration, writeKind } from '../../server/db/kept';
import { setClock } from '../../server/lib/clock';
import type { OpenNeed } from '@shared/schemas/pledge';
import type { RecipientView } from '@shared/schemas/recipient';

/**
 * Read routes keep their serialised answer until anything is written (server/db/kept.ts,
 * server/lib/kept-json.ts). These are the cases where keeping it would be wrong.
 */
let t: TestApp;
let vol: Client;
let otherVol: Client;
let organiser: Client;

beforeAll(async () => {
  t = await makeTestApp();
  vol = await signedIn(t.app, 'volunteer');
  otherVol = await signedIn(t.app, 'priya@example.org');
  organiser = await signedIn(t.app, 'organiser');
});
afterAll(async () => {
  setClock(null);
  await t.close();
});

const needs = async (c: Client) => (await c.get('/api/needs')).body.needs as OpenNeed[];

describe('an answer kept until a write', () => {
  it('is the same bytes on the second read, with an ETag that a client can send back for a 304', async () => {
    const first = await vol.get('/api/recipients');
    const second = await vol.get('/api/recipients');
    expect(second.status).toBe(200);
    expect(second.text).toBe(first.text);
    expect(second.headers['content-type']).toBe('application/json; charset=utf-8');
    const etag = second.headers.etag as string;
    expect(etag).toMatch(/^W\/"/);
    const again = await vol.get('/api/recipients').set('If-None-Match', etag);
    expect(again.status).toBe(304);
  });

  it('sends the kept body gzipped to a client that accepts it, and plain to one that does not', async () => {
    const plain = await vol.get('/api/needs').set('Accept-Encoding', 'identity');
    expect(plain.headers['content-encoding']).toBeUndefined();
    expect(plain.headers.vary).toMatch(/Accept-Encoding/);
    const zipped = await vol.get('/api/needs').set('Accept-Encoding', 'gzip, deflate');
    expect(zipped.headers['content-encoding']).toBe('gzip');
    expect(zipped.text).toBe(plain.text);
    expect(Number(zipped.headers['content-length'])).toBeLessThan(Buffer.byteLength(plain.text));
  });

  it("shows another person's pledge on the next read", async () => {
    const before = await needs(vol);
    const need = before.find((n) => n.stillWanted >= 2)!;
    const res = await otherVol.post('/api/pledges', { needId: need.id, quantity: 2, sizeCategory: need.sizeCategory, dueDate: need.deadline });
    expect(res.status).toBe(201);
    const after = (await needs(vol)).find((n) => n.id === need.id)!;
    expect(after.pledged).toBe(need.pledged + 2);
    // Kept per person: the other volunteer's own figure is theirs, not the first reader's.
    expect(after.myPledged).toBe(need.myPledged);
    expect((await needs(otherVol)).find((n) => n.id === need.id)!.myPledged).toBe(2);
  });

  it('shows a change written past the models, in plain SQL, on the next read', async () => {
    const [need] = await needs(vol);
    await t.sequelize.query('UPDATE needs SET quantity = quantity + 7 WHERE id = ?', { replacements: [need!.id], type: QueryTypes.UPDATE });
    expect((await needs(vol)).find((n) => n.id === need!.id)!.quantity).toBe(need!.quantity + 7);
  });

  it("shows an organiser's change to a recipient to every volunteer on their next read", async () => {
    const list = (await vol.get('/api/recipients')).body.recipients as RecipientView[];
    const r = list[0]!;
    const res = await organiser.patch(`/api/recipients/${r.id}`, { name: `${r.name} (east wing)`, version: r.version });
    expect(res.status).toBe(200);
    for (const c of [vol, otherVol]) {
      const seen = ((await c.get('/api/recipients')).body.recipients as RecipientView[]).find((x) => x.id === r.id)!;
      expect(seen.name).toBe(`${r.name} (east wing)`);
    }
  });

  it('drops a recipient made inactive from the open needs at once', async () => {
    const before = await needs(vol);
    const recipientId = before[0]!.recipient.id;
    await Recipient.update({ active: false }, { where: { id: recipientId } });
    expect((await needs(vol)).some((n) => n.recipient.id === recipientId)).toBe(false);
    await Recipient.update({ active: true }, { where: { id: recipientId } });
    expect((await needs(vol)).some((n) => n.recipient.id === recipientId)).toBe(true);
  });

  it("is read again when the drive's day changes, with nothing written", async () => {
    const today = await needs(vol);
    const latest = today.reduce((a, n) => (n.deadline > a ? n.deadline : a), '');
    // The day after the latest deadline: no need is open any more.
    setClock(Date.parse(`${latest}T12:00:00Z`) + 36 * 3600_000);
    expect(await needs(vol)).toEqual([]);
    setClock(null);
    expect((await needs(vol)).length).toBe(today.length);
  });

  it('does not keep an answer read while a write was committing', async () => {
    const need = (await Need.findOne())!;
    let reads = 0;
    const read = () =>
      keptUntilWrite(t.sequelize, 'test-need-quantity', async () => {
        reads += 1;
        const value = (await Need.findByPk(need.id))!.quantity;
        // A write commits while this answer is being read.
        if (reads === 1) await Need.update({ quantity: value + 1 }, { where: { id: need.id } });
        return value;
      });
    const stale = await read();
    expect(await read()).toBe(stale + 1);
    expect(reads).toBe(2);
    expect(await read()).toBe(stale + 1);
    expect(reads).toBe(2);
  });

  it('hands out an old answer with nothing written since at once, reading a fresh one behind it', async () => {
    // The earlier cases' commits are seen again by the quarter-second poll of other connections'
    // commits (server/db/kept.ts), which moves the generation on; wait that out before counting reads.
    await new Promise((r) => setTimeout(r, OTHER_WRITERS_EVERY_MS * 3));
    let reads = 0;
    let release: () => void = () => undefined;
    const read = () =>
      keptUntilWrite(t.sequelize, 'test-aged', async () => {
        reads += 1;
        if (reads === 2) await new Promise<void>((r) => (release = r));
        return reads;
      });
    expect(await read()).toBe(1);
    const realNow = Date.now;
    const now = vi.spyOn(Date, 'now').mockImplementation(() => realNow() + KEPT_MAX_MS + 1);
    try {
      // Past the age limit: the kept answer comes back at once while the second read waits.
      expect(await read()).toBe(1);
      expect(await read()).toBe(1);
      expect(reads).toBe(2);
      release();
      await vi.waitFor(async () => expect(await read()).toBe(2));
      expect(reads).toBe(2);
    } finally {
      now.mockRestore();
    }
    // A write still drops it at once: the next caller waits for a fresh read.
    await Need.update({ preferences: 'Any colours, aged' }, { where: { id: (await Need.findOne())!.id } });
    expect(await read()).toBe(3);
  });
});

describe('which statements count as writes', () => {
  it('counts data changes and commits, not reads or session renewals', () => {
    for (const sql of ['INSERT INTO `pledges` (`id`) VALUES (1)', 'UPDATE needs SET quantity = 2', 'DELETE FROM `blankets` WHERE id = 1', 'COMMIT;', 'WITH x AS (SELECT 1) DELETE FROM needs']) {
      expect({ sql, write: mayWrite(sql) }).toEqual({ sql, write: true });
    }
    for (const sql of ['SELECT * FROM needs', '  select 1', 'PRAGMA table_info(`needs`)', 'BEGIN IMMEDIATE TRANSACTION;', 'WITH x AS (SELECT 1) SELECT * FROM x', 'UPDATE `sessions` SET `data`=? WHERE `sid` = ?']) {
      expect({ sql, write: mayWrite(sql) }).toEqual({ sql, write: false });
    }
    for (const sql of ['UPDATE `sessions` SET `data`=? WHERE `sid` = ?', 'DELETE FROM `sessions` WHERE `sid` = ?', 'INSERT INTO `sessions` (`sid`) VALUES (?)']) {
      expect({ sql, kind: writeKind(sql) }).toEqual({ sql, kind: 'sessions' });
    }
  });

  it('moves the generation on for a transaction that writes', async () => {
    const before = writeGeneration();
    await t.sequelize.transaction(async (transaction) => {
      await Need.update({ preferences: 'warm colours' }, { where: { id: (await Need.findOne({ transaction }))!.id }, transaction });
    });
    expect(writeGeneration()).toBeGreaterThan(before);
  });
});

describe('sessions kept until a session is written', () => {
  it('refuses a cookie replayed after its session signed out', async () => {
    const c = await signedIn(t.app, 'coordinator');
    expect((await c.get('/api/auth/me')).status).toBe(200);
    const cookie = (await c.get('/api/auth/me')).request.cookies;
    expect((await c.post('/api/auth/logout')).status).toBeLessThan(300);
    const replay = await request(t.app).get('/api/auth/me').set('Cookie', cookie);
    expect(replay.status).toBe(401);
  });

  it('refuses a session deleted by another process, within a moment', async () => {
    const c = await signedIn(t.app, 'organiser@example.org');
    expect((await c.get('/api/auth/me')).status).toBe(200);
    expect((await c.get('/api/auth/me')).status).toBe(200);
    const other = new sqlite3.Database(t.config.databasePath);
    await new Promise<void>((resolve, reject) =>
      other.run('DELETE FROM sessions WHERE userId = (SELECT id FROM users WHERE email = ?)', ['organiser@example.org'], (err) => (err ? reject(err) : resolve())),
    );
    await new Promise<void>((resolve) => other.close(() => resolve()));
    await new Promise((r) => setTimeout(r, OTHER_WRITERS_EVERY_MS * 3));
    expect((await c.get('/api/auth/me')).status).toBe(401);
  });
});
