import fs from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import sharp from 'sharp';
import { DEMO_PASSWORD, makeTestApp, signedIn, type TestApp } from './test-app';
import { seedDemo } from '../../server/db/seed/demo';
import { Photo } from '../../server/db/models/photo';
import { shadesFor } from '../../server/db/seed/photos';

let t: TestApp;
beforeAll(async () => {
  t = await makeTestApp({ seed: false });
  await seedDemo(t.sequelize, DEMO_PASSWORD, t.config.scryptLogN, new Date(), { uploadDir: t.config.uploadDir });
});
afterAll(async () => t.close());

describe('demo photos', () => {
  it('gives the finished demo blankets a real photo and thumbnail on disk', async () => {
    const photos = await Photo.findAll();
    expect(photos.length).toBeGreaterThan(3);
    for (const p of photos) {
      const full = path.join(t.config.uploadDir, 'photos', p.fileName);
      const thumb = path.join(t.config.uploadDir, 'photos', p.thumbName);
      expect(fs.existsSync(full) && fs.existsSync(thumb)).toBe(true);
      expect((await sharp(thumb).metadata()).format).toBe('webp');
    }
  });

  it('serves them to the maker through the authorised route', async () => {
    const c = await signedIn(t.app, 'volunteer@example.org');
    const list = (await c.get('/api/blankets?mine=true')).body.items as Array<{ coverPhoto: { thumbUrl: string } | null }>;
    const withPhoto = list.find((b) => b.coverPhoto);
    expect(withPhoto).toBeTruthy();
    const res = await c.get(withPhoto!.coverPhoto!.thumbUrl);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('image/webp');
  });

  it('draws each blanket in the colours its maker named', () => {
    expect(shadesFor('pale mint and cream')).toEqual(['#b9dcc6', '#f3ead2']);
    expect(shadesFor('something unnamed')).toHaveLength(4);
  });
});
