/**
 * What survives a crash, for the choice of SQLite's `synchronous` setting (docs/decisions/0005).
 * For each setting: a child process writes rows one autocommit at a time in WAL mode and reports
 * each id once SQLite says it is committed; the parent kills it with SIGKILL mid-stream (a process
 * crash), reopens the file and checks that every reported row is there. Also times an autocommit
 * UPDATE under each setting, side by side. A power cut cannot be staged here: that is where FULL
 * and NORMAL differ (NORMAL may lose the last commits, never the file's consistency).
 *
 *   npx tsx bench/crash-durability.ts
 */
import { spawn } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import sqlite3 from 'sqlite3';

const run = (db: sqlite3.Database, sql: string, params: unknown[] = []) =>
  new Promise<void>((resolve, reject) => db.run(sql, params, (err) => (err ? reject(err) : resolve())));
const all = <T>(db: sqlite3.Database, sql: string) =>
  new Promise<T[]>((resolve, reject) => db.all(sql, (err, rows) => (err ? reject(err) : resolve(rows as T[]))));
const open = (file: string) => new sqlite3.Database(file);

if (process.argv[2] === '--writer') {
  const [file, mode] = process.argv.slice(3) as [string, string];
  const db = open(file);
  await run(db, 'PRAGMA journal_mode = WAL');
  await run(db, `PRAGMA synchronous = ${mode}`);
  for (let i = 1; ; i++) {
    await run(db, 'INSERT INTO rows (id, body) VALUES (?, ?)', [i, 'x'.repeat(200)]);
    process.stdout.write(`${i}\n`);
  }
}

async function crashOnce(mode: string, dir: string): Promise<{ acked: number; found: number; missing: number; ok: boolean }> {
  const file = path.join(dir, `${mode}.sqlite`);
  const setup = open(file);
  await run(setup, 'PRAGMA journal_mode = WAL');
  await run(setup, 'CREATE TABLE rows (id INTEGER PRIMARY KEY, body TEXT NOT NULL)');
  await new Promise((r) => setup.close(r));
  const child = spawn(process.execPath, ['--import', 'tsx', process.argv[1]!, '--writer', file, mode], { stdio: ['ignore', 'pipe', 'inherit'] });
  let acked = 0;
  let buffer = '';
  await new Promise<void>((resolve) => {
    child.stdout.on('data', (chunk: Buffer) => {
      buffer += chunk.toString();
      const lines = buffer.split('\n');
      buffer = lines.pop()!;
      for (const l of lines) acked = Math.max(acked, Number(l));
      if (acked >= 300 && child.exitCode === null) child.kill('SIGKILL');
    });
    child.on('exit', () => resolve());
  });
  const db = open(file);
  const [{ n, top }] = await all<{ n: number; top: number }>(db, 'SELECT count(*) AS n, max(id) AS top FROM rows');
  const [{ integrity_check }] = await all<{ integrity_check: string }>(db, 'PRAGMA integrity_check');
  await new Promise((r) => db.close(r));
  const missing = Math.max(0, acked - n);
  return { acked, found: n, missing, ok: integrity_check === 'ok' && top >= acked };
}

async function updateMs(mode: string, dir: string, rounds = 300): Promise<number> {
  const db = open(path.join(dir, `time-${mode}.sqlite`));
  await run(db, 'PRAGMA journal_mode = WAL');
  await run(db, `PRAGMA synchronous = ${mode}`);
  await run(db, 'CREATE TABLE IF NOT EXISTS s (id INTEGER PRIMARY KEY, expires INTEGER)');
  await run(db, 'INSERT OR REPLACE INTO s VALUES (1, 0)');
  const t0 = process.hrtime.bigint();
  for (let i = 0; i < rounds; i++) await run(db, 'UPDATE s SET expires = ? WHERE id = 1', [i]);
  const ms = Number(process.hrtime.bigint() - t0) / 1e6 / rounds;
  await new Promise((r) => db.close(r));
  return ms;
}

if (process.argv[2] !== '--writer') {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'kindloop-crash-'));
  try {
    console.log('SIGKILL of a writer mid-stream, WAL mode, 300+ acknowledged autocommits each\n');
    for (const mode of ['NORMAL', 'FULL']) {
      const r = await crashOnce(mode, dir);
      console.log(`synchronous=${mode.padEnd(6)} acknowledged ${r.acked}, found ${r.found}, lost ${r.missing}, integrity ${r.ok ? 'ok' : 'FAILED'}`);
    }
    // Interleaved rounds, so machine noise hits both alike.
    const times: Record<string, number[]> = { NORMAL: [], FULL: [] };
    for (let round = 0; round < 3; round++) for (const mode of ['NORMAL', 'FULL']) times[mode]!.push(await updateMs(mode, dir));
    const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!;
    console.log(`\nautocommit UPDATE: NORMAL ${median(times.NORMAL!).toFixed(3)} ms, FULL ${median(times.FULL!).toFixed(3)} ms (FULL/NORMAL ${(median(times.FULL!) / median(times.NORMAL!)).toFixed(2)}×)`);
  } finally {
    fs.rmSync(dir, { recursive: true, force: true });
  }
}
