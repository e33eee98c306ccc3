import fs from 'node:fs';
import path from 'node:path';
import zlib from 'node:zlib';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import sharp from 'sharp';
import { makeTestApp, signedIn, type Client, type TestApp } from './test-app';
import { Need } from '../../server/db/models/need';
import { Recipient } from '../../server/db/models/recipient';
import { Photo } from '../../server/db/models/photo';
import { MAX_INPUT_PIXELS } from '../../server/modules/photos/photo-files';
import { UPLOADS_PER_PERSON } from '../../server/modules/photos/photos.router';

let t: TestApp;
let vol: Client;
let maren: Client;

beforeAll(async () => {
  t = await makeTestApp();
  vol = await signedIn(t.app, 'volunteer');
  maren = await signedIn(t.app, 'maren@example.org');
});
afterAll(async () => t.close());

async function newBlanket(c: Client): Promise<number> {
  const needs = (await Need.findAll({ include: [{ model: Recipient, as: 'recipient' }] })) as Array<Need & { recipient: Recipient }>;
  const n = needs.find((x) => x.recipient.kind === 'neonatal-unit')!;
  const p = await c.post('/api/pledges', { needId: n.id, quantity: 1, sizeCategory: 'preemie', dueDate: n.deadline });
  const b = await c.post('/api/blankets', {
    pledgeId: p.body.pledge.id, widthCm: 45, lengthCm: 48, yarnWeight: 3, fibres: ['acrylic'], machineWashable: true, dryerSafe: true, smokeFree: true, petFree: true,
  });
  expect(b.status, JSON.stringify(b.body)).toBe(201);
  return b.body.blanket.id;
}

const upload = (c: Client, id: number, data: Buffer, name = 'photo.png') =>
  c.agent.post(`/api/blankets/${id}/photos`).set('X-CSRF-Token', c.token).attach('photos', data, { filename: name, contentType: 'image/png' });

/**
 * A real 8 × 8 PNG whose header is rewritten to claim another size: a few hundred bytes that say
 * "decode me into a huge canvas", as a decompression bomb does.
 */
async function pngClaiming(width: number, height: number): Promise<Buffer> {
  const png = Buffer.from(await sharp({ create: { width: 8, height: 8, channels: 3, background: '#8c6eaa' } }).png().toBuffer());
  // Signature (8) + IHDR length (4) + "IHDR" (4): width and height follow, then the chunk's CRC.
  png.writeUInt32BE(width, 16);
  png.writeUInt32BE(height, 20);
  png.writeUInt32BE(zlib.crc32(png.subarray(12, 29)) >>> 0, 29);
  return png;
}

describe('photo size limits', () => {
  it('keeps the limit at what a phone photo needs: 24 megapixels', () => {
    // Phones save 12 MP by default (4032 × 3024); twice that leaves room without opening 60 MP canvases.
    expect(MAX_INPUT_PIXELS).toBe(24_000_000);
    expect(4032 * 3024).toBeLessThan(MAX_INPUT_PIXELS);
  });

  it('refuses a small file that claims 7,740 × 7,740 pixels from its header, before decoding it', async () => {
    const id = await newBlanket(vol);
    const bomb = await pngClaiming(7740, 7740);
    expect(bomb.length).toBeLessThan(1000);
    expect((await sharp(bomb).metadata()).width).toBe(7740);
    const res = await upload(vol, id, bomb);
    expect(res.status).toBe(400);
    // The size named is the header's: a refusal from decoding would call the file damaged instead.
    expect(res.body.error.message).toMatch(/7740 × 7740 pixels \(60 megapixels\)/);
    expect(res.body.error.issues[0].path).toBe('photos');
    expect(await Photo.count({ where: { blanketId: id } })).toBe(0);
    const dir = path.join(t.config.uploadDir, 'photos');
    expect(fs.existsSync(dir) ? fs.readdirSync(dir) : []).toEqual([]);
  });

  it('lets a header of exactly 24 megapixels past the size check', async () => {
    const id = await newBlanket(vol);
    const res = await upload(vol, id, await pngClaiming(6000, 4000));
    // Its pixels are missing, so decoding fails; what matters is that the size was not the reason.
    expect(res.status).toBe(400);
    expect(res.body.error.message).not.toMatch(/megapixels/);
    expect(res.body.error.message).toMatch(/damaged/);
  });

  it('still takes an ordinary photo and keeps both copies', async () => {
    const id = await newBlanket(vol);
    const res = await upload(vol, id, await sharp({ create: { width: 3000, height: 2000, channels: 3, background: '#c8a050' } }).jpeg().toBuffer(), 'a.jpg');
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.photos[0]).toMatchObject({ width: 2560, height: 1707, mime: 'image/jpeg' });
  });
});

describe('uploads per person', () => {
  it(`answers 429 after ${UPLOADS_PER_PERSON} uploads in a quarter of an hour, to that person only`, async () => {
    const id = await newBlanket(maren);
    const statuses: number[] = [];
    // Empty requests are refused (400) but still count: every upload costs the server work.
    for (let i = 0; i < UPLOADS_PER_PERSON; i++) statuses.push((await maren.post(`/api/blankets/${id}/photos`)).status);
    expect(statuses.every((s) => s === 400)).toBe(true);
    const over = await maren.post(`/api/blankets/${id}/photos`);
    expect(over.status).toBe(429);
    expect(over.body.error.message).toMatch(/photos/);
    // Someone else uploads as usual.
    const mine = await newBlanket(vol);
    expect((await vol.post(`/api/blankets/${mine}/photos`)).status).toBe(400);
  });
});
