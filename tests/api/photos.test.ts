import fs from 'node:fs';
import path from 'node:path';
import { afterAll, afterEach, beforeAll, describe, expect, it, vi } from 'vitest';
import request from 'supertest';
import sharp from 'sharp';
import { makeTestApp, signedIn, type Client, type TestApp } from './test-app';
import { Photo } from '../../server/db/models/photo';
import { Need } from '../../server/db/models/need';
import { Recipient } from '../../server/db/models/recipient';
import { BlanketEvent } from '../../server/db/models/blanket-event';
import { MAX_PHOTO_BYTES } from '@shared/schemas/blanket-log';
import type { BlanketDetail, PhotoView } from '@shared/schemas/blanket-log';

let t: TestApp;
let vol: Client;
let maren: Client;
let organiser: Client;
let coordinator: Client;

const image = (format: 'jpeg' | 'png' | 'webp', width = 800, height = 600) =>
  sharp({ create: { width, height, channels: 3, background: { r: 140, g: 110, b: 170 } } })
    .toFormat(format)
    .toBuffer();

/** Every file under the upload folder, so a test can see that a refused upload left nothing. */
function filesIn(dir: string): string[] {
  if (!fs.existsSync(dir)) return [];
  return fs.readdirSync(dir, { recursive: true, withFileTypes: true }).filter((d) => d.isFile()).map((d) => path.join(d.parentPath, d.name)).sort();
}

async function newBlanket(c: Client): Promise<BlanketDetail> {
  const needs = (await Need.findAll({ include: [{ model: Recipient, as: 'recipient' }] })) as Array<Need & { recipient: Recipient }>;
  const n = needs.find((x) => x.recipient.kind === 'neonatal-unit')!;
  const p = await c.post('/api/pledges', { needId: n.id, quantity: 1, sizeCategory: 'preemie', dueDate: n.deadline });
  const b = await c.post('/api/blankets', {
    pledgeId: p.body.pledge.id,
    widthCm: 45,
    lengthCm: 48,
    yarnWeight: 3,
    fibres: ['acrylic'],
    machineWashable: true,
    dryerSafe: true,
    smokeFree: true,
    petFree: true,
  });
  expect(b.status).toBe(201);
  return b.body.blanket;
}

function upload(c: Client, blanketId: number, files: Array<{ data: Buffer; name: string; type?: string }>, field = 'photos') {
  let req = c.agent.post(`/api/blankets/${blanketId}/photos`).set('X-CSRF-Token', c.token);
  for (const f of files) {
    // form-data trims a plain filename to its base name; `filepath` sends it as given, as a tampered client could.
    const name = /[\\/]/.test(f.name) ? { filepath: f.name } : { filename: f.name };
    req = req.attach(field, f.data, { ...name, contentType: f.type ?? 'image/jpeg' } as never);
  }
  return req;
}

beforeAll(async () => {
  t = await makeTestApp();
  vol = await signedIn(t.app, 'volunteer');
  maren = await signedIn(t.app, 'maren@example.org');
  organiser = await signedIn(t.app, 'organiser');
  coordinator = await signedIn(t.app, 'coordinator');
});
afterAll(async () => t.close());
afterEach(() => vi.restoreAllMocks());

describe('POST /api/blankets/:id/photos', () => {
  it('stores a JPEG under a generated name with a small WebP thumbnail, and records the row', async () => {
    const b = await newBlanket(vol);
    const res = await upload(vol, b.id, [{ data: await image('jpeg', 1200, 900), name: 'my sofa.jpg' }]);
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const [photo] = res.body.photos as PhotoView[];
    expect(photo).toMatchObject({ mime: 'image/jpeg', width: 1200, height: 900 });
    expect(photo!.url).toBe(`/api/blankets/${b.id}/photos/${photo!.id}`);

    const row = (await Photo.findByPk(photo!.id))!;
    expect(row.fileName).toMatch(/^[a-f0-9]{32}\.jpg$/);
    expect(row.thumbName).toMatch(/^[a-f0-9]{32}-thumb\.webp$/);
    expect(row.fileName).not.toContain('sofa');
    const stored = path.join(t.config.uploadDir, 'photos', row.fileName);
    expect(fs.statSync(stored).size).toBe(row.bytes);
    const thumb = await sharp(path.join(t.config.uploadDir, 'photos', row.thumbName)).metadata();
    expect(thumb.format).toBe('webp');
    expect(Math.max(thumb.width!, thumb.height!)).toBe(320);

    const detail = (await vol.get(`/api/blankets/${b.id}`)).body.blanket as BlanketDetail;
    expect(detail.photos.map((p) => p.id)).toEqual([photo!.id]);
    expect(detail.photoCount).toBe(1);
    expect(detail.events.at(-1)!.kind).toBe('photos-added');
  });

  it('takes PNG and WebP too, several at once', async () => {
    const b = await newBlanket(vol);
    const res = await upload(vol, b.id, [
      { data: await image('png'), name: 'a.png', type: 'image/png' },
      { data: await image('webp'), name: 'b.webp', type: 'image/webp' },
    ]);
    expect(res.status).toBe(201);
    expect((res.body.photos as PhotoView[]).map((p) => p.mime)).toEqual(['image/png', 'image/webp']);
  });

  it('decides the type from the bytes, not the name or the header', async () => {
    const b = await newBlanket(vol);
    const res = await upload(vol, b.id, [{ data: await image('png'), name: 'holiday.jpg', type: 'image/jpeg' }]);
    expect(res.status).toBe(201);
    expect(res.body.photos[0].mime).toBe('image/png');
  });

  it('strips the metadata (such as a GPS position) from the photo it keeps', async () => {
    const b = await newBlanket(vol);
    const withExif = await sharp(await image('jpeg'))
      .withExif({ IFD0: { Copyright: 'Someone at home', ImageDescription: 'Living room, 12 Example Street' } })
      .jpeg()
      .toBuffer();
    expect((await sharp(withExif).metadata()).exif).toBeDefined();
    const res = await upload(vol, b.id, [{ data: withExif, name: 'x.jpg' }]);
    expect(res.status).toBe(201);
    const row = (await Photo.findByPk(res.body.photos[0].id))!;
    const kept = await sharp(path.join(t.config.uploadDir, 'photos', row.fileName)).metadata();
    expect(kept.exif).toBeUndefined();
  });

  describe('refuses bad uploads with a 4xx naming the field, and leaves nothing on disk or in the database', () => {
    let blanket: BlanketDetail;
    beforeAll(async () => {
      blanket = await newBlanket(vol);
    });

    async function expectRefused(
      res: request.Response,
      status: number,
      before: { files: string[]; photos: number; events: number },
      message?: RegExp,
    ) {
      expect(res.status, JSON.stringify(res.body)).toBe(status);
      expect(res.body.error.issues[0].path).toBe('photos');
      if (message) expect(res.body.error.message).toMatch(message);
      expect(filesIn(t.config.uploadDir)).toEqual(before.files);
      expect(await Photo.count()).toBe(before.photos);
      expect(await BlanketEvent.count()).toBe(before.events);
    }
    const snapshot = async () => ({ files: filesIn(t.config.uploadDir), photos: await Photo.count(), events: await BlanketEvent.count() });

    it('a text file named .jpg (415)', async () => {
      const before = await snapshot();
      const res = await upload(vol, blanket.id, [{ data: Buffer.from('hello, not a picture at all'), name: 'photo.jpg' }]);
      await expectRefused(res, 415, before, /not a JPEG, PNG or WebP/);
    });

    it('a GIF, which is a real image but not one we take (415)', async () => {
      const before = await snapshot();
      const gif = await sharp({ create: { width: 10, height: 10, channels: 3, background: '#888' } }).gif().toBuffer();
      const res = await upload(vol, blanket.id, [{ data: gif, name: 'a.gif', type: 'image/gif' }]);
      await expectRefused(res, 415, before, /image\/gif/);
    });

    it('JPEG magic bytes with nothing readable after them (400)', async () => {
      const before = await snapshot();
      const fake = Buffer.concat([Buffer.from([0xff, 0xd8, 0xff, 0xe0, 0x00, 0x10]), Buffer.from('JFIF\0'), Buffer.alloc(2000, 7)]);
      const res = await upload(vol, blanket.id, [{ data: fake, name: 'broken.jpg' }]);
      await expectRefused(res, 400, before, /could not be read/);
    });

    it('an empty file (400)', async () => {
      const before = await snapshot();
      const res = await upload(vol, blanket.id, [{ data: Buffer.alloc(0), name: 'empty.jpg' }]);
      await expectRefused(res, 400, before, /empty/);
    });

    it('a path in the file name (400)', async () => {
      const before = await snapshot();
      const res = await upload(vol, blanket.id, [{ data: await image('jpeg'), name: '../../../etc/evil.jpg' }]);
      await expectRefused(res, 400, before, /folder path/);
      expect(fs.existsSync(path.resolve(t.config.uploadDir, '../../../etc/evil.jpg'))).toBe(false);
    });

    it('a good photo sent with a bad one: neither is kept', async () => {
      const before = await snapshot();
      const res = await upload(vol, blanket.id, [
        { data: await image('jpeg'), name: 'good.jpg' },
        { data: Buffer.from('not an image'), name: 'bad.jpg' },
      ]);
      await expectRefused(res, 415, before, /photo 2/);
    });

    it('five photos in one request (400)', async () => {
      const before = await snapshot();
      const one = await image('jpeg', 40, 40);
      const res = await upload(vol, blanket.id, Array.from({ length: 5 }, (_, i) => ({ data: one, name: `${i}.jpg` })));
      await expectRefused(res, 400, before, /at most 4/);
    });

    it('a file over 8 MB (413)', async () => {
      const before = await snapshot();
      const big = Buffer.concat([await image('jpeg', 40, 40), Buffer.alloc(MAX_PHOTO_BYTES)]);
      const res = await upload(vol, blanket.id, [{ data: big, name: 'big.jpg' }]);
      await expectRefused(res, 413, before, /8 MB/);
    });

    it('photos in the wrong field (400)', async () => {
      const before = await snapshot();
      const res = await upload(vol, blanket.id, [{ data: await image('jpeg'), name: 'a.jpg' }], 'picture');
      expect(res.status).toBe(400);
      expect(res.body.error.issues[0].path).toBe('picture');
      expect(filesIn(t.config.uploadDir)).toEqual(before.files);
    });

    it('no file at all (400)', async () => {
      const before = await snapshot();
      const res = await vol.post(`/api/blankets/${blanket.id}/photos`, { photos: 'nothing' });
      await expectRefused(res, 400, before, /at least one/);
    });

    it('a database failure after the files were written: the files are removed again', async () => {
      const before = await snapshot();
      vi.spyOn(Photo, 'create').mockRejectedValueOnce(new Error('disk full'));
      vi.spyOn(console, 'error').mockImplementation(() => {});
      const res = await upload(vol, blanket.id, [{ data: await image('jpeg'), name: 'a.jpg' }]);
      expect(res.status).toBe(500);
      expect(filesIn(t.config.uploadDir)).toEqual(before.files);
      expect(await Photo.count()).toBe(before.photos);
    });
  });

  it('allows four photos per blanket in all: a fifth is refused and the four stay', async () => {
    const b = await newBlanket(vol);
    const one = await image('jpeg', 60, 60);
    expect((await upload(vol, b.id, [1, 2, 3].map((i) => ({ data: one, name: `${i}.jpg` })))).status).toBe(201);
    const before = filesIn(t.config.uploadDir);
    const two = await upload(vol, b.id, [
      { data: one, name: '4.jpg' },
      { data: one, name: '5.jpg' },
    ]);
    expect(two.status).toBe(409);
    expect(two.body.error.message).toMatch(/at most 1 more/);
    expect(filesIn(t.config.uploadDir)).toEqual(before);
    expect((await upload(vol, b.id, [{ data: one, name: '4.jpg' }])).status).toBe(201);
    const fifth = await upload(vol, b.id, [{ data: one, name: '5.jpg' }]);
    expect(fifth.status).toBe(409);
    expect(fifth.body.error.message).toMatch(/remove one first/);
    expect(await Photo.count({ where: { blanketId: b.id } })).toBe(4);
  });

  it("answers 404 to a volunteer adding photos to someone else's blanket, and 403 to an organiser", async () => {
    const b = await newBlanket(vol);
    const one = await image('jpeg', 60, 60);
    expect((await upload(maren, b.id, [{ data: one, name: 'a.jpg' }])).status).toBe(404);
    expect((await upload(organiser, b.id, [{ data: one, name: 'a.jpg' }])).status).toBe(403);
    expect(await Photo.count({ where: { blanketId: b.id } })).toBe(0);
  });
});

describe('GET /api/blankets/:id/photos/:photoId', () => {
  let b: BlanketDetail;
  let photo: PhotoView;
  beforeAll(async () => {
    b = await newBlanket(vol);
    const res = await upload(vol, b.id, [{ data: await image('jpeg'), name: 'a.jpg' }]);
    photo = res.body.photos[0];
  });

  it('serves the photo to its maker with its type and nosniff', async () => {
    const res = await vol.get(photo.url).buffer(true);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('image/jpeg');
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['cache-control']).toMatch(/private/);
    expect((await sharp(res.body as Buffer).metadata()).width).toBe(800);
  });

  it('serves the WebP thumbnail with ?size=thumb', async () => {
    const res = await vol.get(photo.thumbUrl).buffer(true);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('image/webp');
    expect((await sharp(res.body as Buffer).metadata()).width).toBe(320);
    expect((await vol.get(`${photo.url}?size=huge`)).status).toBe(400);
  });

  it('serves organisers and coordinators, but not another volunteer (404) or nobody (401)', async () => {
    expect((await organiser.get(photo.url)).status).toBe(200);
    expect((await coordinator.get(photo.thumbUrl)).status).toBe(200);
    const theirs = await maren.get(photo.url);
    expect(theirs.status).toBe(404);
    expect(theirs.headers['content-type']).toMatch(/json/);
    expect((await request(t.app).get(photo.url)).status).toBe(401);
  });

  it('answers 404 for a photo id under the wrong blanket', async () => {
    const other = await newBlanket(vol);
    expect((await vol.get(`/api/blankets/${other.id}/photos/${photo.id}`)).status).toBe(404);
    expect((await vol.get(`/api/blankets/${b.id}/photos/99999`)).status).toBe(404);
  });
});

describe('DELETE /api/blankets/:id/photos/:photoId', () => {
  it('removes the row and both files, for the maker only', async () => {
    const b = await newBlanket(vol);
    const res = await upload(vol, b.id, [{ data: await image('jpeg'), name: 'a.jpg' }]);
    const photo = res.body.photos[0] as PhotoView;
    const row = (await Photo.findByPk(photo.id))!;
    const files = [row.fileName, row.thumbName].map((n) => path.join(t.config.uploadDir, 'photos', n));
    expect(files.every((f) => fs.existsSync(f))).toBe(true);
    expect((await maren.delete(photo.url)).status).toBe(404);
    expect((await organiser.delete(photo.url)).status).toBe(403);
    expect((await vol.delete(photo.url)).status).toBe(204);
    expect(await Photo.findByPk(photo.id)).toBeNull();
    expect(files.some((f) => fs.existsSync(f))).toBe(false);
  });
});
