import fs from 'node:fs';
import path from 'node:path';
import sqlite3 from 'sqlite3';
import { BUSY_TIMEOUT_MS } from './sequelize';
import { PHOTO_FOLDER } from '../modules/photos/photo-files';

/**
 * Backups of the live database and the uploaded photos, safe to take while Kindloop runs.
 *
 * The database is copied with `VACUUM INTO`, which writes a consistent, compacted copy of the file as
 * one read transaction sees it (SQLite's documentation, "VACUUM INTO"): in WAL mode the server keeps
 * reading and writing meanwhile. The photos are copied after the database, because a photo's files
 * are written before its row and removed after it: every row in the copy already had its files when
 * the copy was taken. Only a photo removed in the moments between the two steps can be missing, and
 * the manifest names any such file.
 */

export const DATABASE_FILE = 'kindloop.sqlite';
export const UPLOADS_FOLDER = 'uploads';
export const MANIFEST_FILE = 'manifest.json';

export interface BackupManifest {
  createdAt: string;
  database: { file: string; bytes: number; integrity: string; rows: Record<string, number> };
  uploads: { folder: string; files: number; bytes: number; missingPhotoFiles: string[] };
}

function open(file: string, mode: number): Promise<sqlite3.Database> {
  return new Promise((resolve, reject) => {
    const db = new sqlite3.Database(file, mode, (err) => (err ? reject(err) : resolve(db)));
  });
}
const all = <T>(db: sqlite3.Database, sql: string, params: unknown[] = []) =>
  new Promise<T[]>((resolve, reject) => db.all(sql, params, (err, rows) => (err ? reject(err) : resolve(rows as T[]))));
const run = (db: sqlite3.Database, sql: string, params: unknown[] = []) =>
  new Promise<void>((resolve, reject) => db.run(sql, params, (err) => (err ? reject(err) : resolve())));
const close = (db: sqlite3.Database) => new Promise<void>((resolve, reject) => db.close((err) => (err ? reject(err) : resolve())));

/** A folder name for a backup: the UTC date and time, sortable, with no characters a file system minds. */
export const backupName = (at: Date) => at.toISOString().replace(/\.\d{3}Z$/, 'Z').replace(/:/g, '-');

/** Row counts per table and the integrity check of a database file, for the manifest and the restore. */
export async function describeDatabase(file: string): Promise<{ integrity: string; rows: Record<string, number> }> {
  const db = await open(file, sqlite3.OPEN_READONLY);
  try {
    const [{ integrity_check: integrity }] = await all<{ integrity_check: string }>(db, 'PRAGMA integrity_check');
    const tables = await all<{ name: string }>(db, "SELECT name FROM sqlite_master WHERE type = 'table' AND name NOT LIKE 'sqlite_%' ORDER BY name");
    const rows: Record<string, number> = {};
    for (const { name } of tables) rows[name] = (await all<{ n: number }>(db, `SELECT count(*) AS n FROM "${name.replace(/"/g, '""')}"`))[0]!.n;
    return { integrity: integrity!, rows };
  } finally {
    await close(db);
  }
}

function filesUnder(dir: string): Array<{ file: string; bytes: number }> {
  if (!fs.existsSync(dir)) return [];
  return fs
    .readdirSync(dir, { recursive: true, withFileTypes: true })
    .filter((d) => d.isFile())
    .map((d) => {
      const file = path.join(d.parentPath, d.name);
      return { file, bytes: fs.statSync(file).size };
    });
}

/** Writes `<backupsRoot>/<date-time>/` with the database copy, the uploads and a manifest; returns the folder. */
export async function takeBackup(opts: { databasePath: string; uploadDir: string; backupsRoot: string; now?: Date }): Promise<{ dir: string; manifest: BackupManifest }> {
  if (!fs.existsSync(opts.databasePath)) throw new Error(`There is no database at ${opts.databasePath} to back up`);
  const now = opts.now ?? new Date();
  const dir = path.join(opts.backupsRoot, backupName(now));
  if (fs.existsSync(dir)) throw new Error(`A backup named ${path.basename(dir)} already exists; wait a second and try again`);
  fs.mkdirSync(dir, { recursive: true });

  const dbCopy = path.join(dir, DATABASE_FILE);
  const live = await open(opts.databasePath, sqlite3.OPEN_READONLY);
  try {
    // Wait for a writer's lock as long as the server's own statements do, rather than failing at once.
    live.configure('busyTimeout', BUSY_TIMEOUT_MS);
    await run(live, 'VACUUM INTO ?', [dbCopy]);
  } finally {
    await close(live);
  }
  const db = await describeDatabase(dbCopy);

  const uploadsCopy = path.join(dir, UPLOADS_FOLDER);
  fs.mkdirSync(uploadsCopy, { recursive: true });
  if (fs.existsSync(opts.uploadDir)) fs.cpSync(opts.uploadDir, uploadsCopy, { recursive: true });
  const copied = filesUnder(uploadsCopy);

  // Every photo row of the copy should have both of its files in the copied uploads.
  const copyDb = await open(dbCopy, sqlite3.OPEN_READONLY);
  let names: string[] = [];
  try {
    const hasPhotos = (await all(copyDb, "SELECT 1 FROM sqlite_master WHERE type = 'table' AND name = 'photos'")).length > 0;
    if (hasPhotos) names = (await all<{ fileName: string; thumbName: string }>(copyDb, 'SELECT fileName, thumbName FROM photos')).flatMap((p) => [p.fileName, p.thumbName]);
  } finally {
    await close(copyDb);
  }
  const missingPhotoFiles = names.filter((n) => !fs.existsSync(path.join(uploadsCopy, PHOTO_FOLDER, n)));

  const manifest: BackupManifest = {
    createdAt: now.toISOString(),
    database: { file: DATABASE_FILE, bytes: fs.statSync(dbCopy).size, ...db },
    uploads: { folder: UPLOADS_FOLDER, files: copied.length, bytes: copied.reduce((s, f) => s + f.bytes, 0), missingPhotoFiles },
  };
  fs.writeFileSync(path.join(dir, MANIFEST_FILE), `${JSON.stringify(manifest, null, 2)}\n`);
  return { dir, manifest };
}

/**
 * Puts a backup in place of the database and the uploads. Kindloop must be stopped first: the files
 * are replaced underneath it. The copy is checked before anything is touched, the database is moved
 * in whole (a rename), and the old write-ahead log beside it is removed so it cannot be replayed
 * over the restored file.
 */
export async function restoreBackup(opts: { backupDir: string; databasePath: string; uploadDir: string }): Promise<BackupManifest> {
  const manifestFile = path.join(opts.backupDir, MANIFEST_FILE);
  const dbCopy = path.join(opts.backupDir, DATABASE_FILE);
  if (!fs.existsSync(manifestFile) || !fs.existsSync(dbCopy)) throw new Error(`${opts.backupDir} is not a Kindloop backup (no ${MANIFEST_FILE} or ${DATABASE_FILE})`);
  const manifest = JSON.parse(fs.readFileSync(manifestFile, 'utf8')) as BackupManifest;
  const check = await describeDatabase(dbCopy);
  if (check.integrity !== 'ok') throw new Error(`The backup's database fails SQLite's integrity check: ${check.integrity}`);

  fs.mkdirSync(path.dirname(path.resolve(opts.databasePath)), { recursive: true });
  const incoming = `${opts.databasePath}.restoring`;
  fs.copyFileSync(dbCopy, incoming);
  for (const suffix of ['-wal', '-shm', '-journal']) fs.rmSync(`${opts.databasePath}${suffix}`, { force: true });
  fs.renameSync(incoming, opts.databasePath);

  const uploadsCopy = path.join(opts.backupDir, UPLOADS_FOLDER);
  fs.rmSync(opts.uploadDir, { recursive: true, force: true });
  fs.mkdirSync(opts.uploadDir, { recursive: true });
  if (fs.existsSync(uploadsCopy)) fs.cpSync(uploadsCopy, opts.uploadDir, { recursive: true });
  return manifest;
}
