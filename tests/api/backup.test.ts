import fs from 'node:fs';
import path from 'node:path';
import { createHash } from 'node:crypto';
import { spawnSync } from 'node:child_process';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import sharp from 'sharp';
import sqlite3 from 'sqlite3';
import { makeTestApp, signedIn, type Client, type TestApp } from './test-app';
import { Need } from '../../server/db/models/need';
import { Recipient } from '../../server/db/models/recipient';
import { describeDatabase, MANIFEST_FILE, restoreBackup, takeBackup, type BackupManifest } from '../../server/db/backup';
import { openDatabase } from '../../server/db/sequelize';
import { initModels } from '../../server/db/models/index';
import { migrate } from '../../server/db/migrate';
import { createApp } from '../../server/app';

let t: TestApp;
let vol: Client;
let photo: { id: number; url: string };
let blanketId: number;

const sha = (b: Buffer) => createHash('sha256').update(b).digest('hex');
const rowsOf = (file: string, sql: string) =>
  new Promise<unknown[]>((resolve, reject) => {
    const db = new sqlite3.Database(file, sqlite3.OPEN_READONLY, (e) => e && reject(e));
    db.all(sql, (err, rows) => db.close(() => (err ? reject(err) : resolve(rows))));
  });

beforeAll(async () => {
  t = await makeTestApp();
  vol = await signedIn(t.app, 'volunteer');
  const needs = (await Need.findAll({ include: [{ model: Recipient, as: 'recipient' }] })) as Array<Need & { recipient: Recipient }>;
  const n = needs.find((x) => x.recipient.kind === 'neonatal-unit')!;
  const p = await vol.post('/api/pledges', { needId: n.id, quantity: 1, sizeCategory: 'preemie', dueDate: n.deadline });
  const b = await vol.post('/api/blankets', {
    pledgeId: p.body.pledge.id, widthCm: 45, lengthCm: 48, yarnWeight: 3, fibres: ['acrylic'], machineWashable: true, dryerSafe: true, smokeFree: true, petFree: true,
  });
  blanketId = b.body.blanket.id;
  const jpeg = await sharp({ create: { width: 640, height: 480, channels: 3, background: '#7a5c99' } }).jpeg().toBuffer();
  const up = await vol.agent.post(`/api/blankets/${blanketId}/photos`).set('X-CSRF-Token', vol.token).attach('photos', jpeg, { filename: 'a.jpg', contentType: 'image/jpeg' });
  expect(up.status).toBe(201);
  photo = up.body.photos[0];
});
afterAll(async () => t.close());

describe('npm run backup and restore', () => {
  let backup: { dir: string; manifest: BackupManifest };

  it('copies the live database while writes go on, consistent and complete, with the photos', async () => {
    // Pledges keep arriving while the copy is taken, as on a drop-off day.
    const writes = Promise.all(
      Array.from({ length: 10 }, (_, i) => vol.post('/api/pledges', { needId: null, quantity: 1, sizeCategory: 'lap', dueDate: new Date(Date.now() + (i + 5) * 86_400_000).toISOString().slice(0, 10) })),
    );
    backup = await takeBackup({ databasePath: t.config.databasePath, uploadDir: t.config.uploadDir, backupsRoot: path.join(t.dir, 'backups'), now: new Date('2026-12-05T09:30:00Z') });
    expect((await writes).every((r) => r.status === 201)).toBe(true);

    expect(path.basename(backup.dir)).toBe('2026-12-05T09-30-00Z');
    expect(fs.existsSync(path.join(backup.dir, MANIFEST_FILE))).toBe(true);
    expect(backup.manifest.database.integrity).toBe('ok');
    expect(backup.manifest.database.rows.blankets).toBeGreaterThan(0);
    expect(backup.manifest.database.rows.photos).toBeGreaterThanOrEqual(1);
    expect(backup.manifest.uploads.missingPhotoFiles).toEqual([]);
  });

  it('runs as `npm run backup` against the configured database', () => {
    const out = spawnSync(process.execPath, ['--import', 'tsx', 'scripts/backup.ts'], {
      encoding: 'utf8',
      env: { ...process.env, DATABASE_PATH: t.config.databasePath, UPLOAD_DIR: t.config.uploadDir, BACKUP_DIR: path.join(t.dir, 'script-backups') },
    });
    expect(out.status, out.stderr).toBe(0);
    expect(out.stdout).toMatch(/Backed up to .*script-backups/);
    expect(out.stdout).toMatch(/integrity ok/);
    const [made] = fs.readdirSync(path.join(t.dir, 'script-backups'));
    expect(fs.readdirSync(path.join(t.dir, 'script-backups', made!)).sort()).toEqual(['kindloop.sqlite', 'manifest.json', 'uploads']);
  });

  it('restores into a fresh place with the same rows and the same photo bytes, and Kindloop serves them', async () => {
    const live = await describeDatabase(t.config.databasePath);
    const target = path.join(t.dir, 'restored');
    const databasePath = path.join(target, 'kindloop.sqlite');
    const uploadDir = path.join(target, 'uploads');
    fs.mkdirSync(uploadDir, { recursive: true });
    fs.writeFileSync(path.join(uploadDir, 'stale.txt'), 'left over from before');
    await restoreBackup({ backupDir: backup.dir, databasePath, uploadDir });

    const restored = await describeDatabase(databasePath);
    expect(restored.integrity).toBe('ok');
    expect(restored.rows).toEqual(backup.manifest.database.rows);
    // The live database has moved on by at most the pledges written during the backup.
    for (const [table, n] of Object.entries(restored.rows)) {
      if (table !== 'pledges' && table !== 'sessions') expect(live.rows[table], table).toBe(n);
    }
    const users = (db: string) => rowsOf(db, 'SELECT id, email, passwordHash, role FROM users ORDER BY id');
    expect(await users(databasePath)).toEqual(await users(t.config.databasePath));
    const photos = (db: string) => rowsOf(db, 'SELECT id, blanketId, fileName, thumbName, bytes FROM photos ORDER BY id');
    expect(await photos(databasePath)).toEqual(await photos(t.config.databasePath));
    expect(fs.existsSync(path.join(uploadDir, 'stale.txt'))).toBe(false);
    for (const p of (await photos(databasePath)) as Array<{ fileName: string; thumbName: string }>) {
      for (const name of [p.fileName, p.thumbName]) {
        expect(sha(fs.readFileSync(path.join(uploadDir, 'photos', name)))).toBe(sha(fs.readFileSync(path.join(t.config.uploadDir, 'photos', name))));
      }
    }

    // Kindloop started on the restored files signs the maker in and serves the same photo.
    const original = await vol.get(photo.url).buffer(true);
    const sequelize = await openDatabase(databasePath);
    initModels(sequelize);
    await migrate(sequelize);
    const app = createApp({ sequelize, config: { ...t.config, databasePath, uploadDir }, sessionSecret: 'y'.repeat(40) });
    try {
      const again = await signedIn(app, 'volunteer');
      const served = await again.get(photo.url).buffer(true);
      expect(served.status).toBe(200);
      expect(sha(served.body as Buffer)).toBe(sha(original.body as Buffer));
      expect((await again.get(`/api/blankets/${blanketId}`)).body.blanket.photos.map((p: { id: number }) => p.id)).toEqual([photo.id]);
    } finally {
      app.locals.close();
      await sequelize.close();
    }
  });

  it('refuses a folder that is not a backup, and touches nothing', async () => {
    const databasePath = path.join(t.dir, 'untouched.sqlite');
    fs.writeFileSync(databasePath, 'keep me');
    await expect(restoreBackup({ backupDir: t.dir, databasePath, uploadDir: path.join(t.dir, 'nope') })).rejects.toThrow(/not a Kindloop backup/);
    expect(fs.readFileSync(databasePath, 'utf8')).toBe('keep me');
  });
});
