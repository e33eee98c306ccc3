import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { spawn } from 'node:child_process';
import { afterAll, describe, expect, it } from 'vitest';
import sqlite3 from 'sqlite3';

/**
 * A process crash in the middle of a burst of writes loses nothing that was acknowledged and leaves
 * the file sound: WAL with synchronous = NORMAL (docs/decisions/0006-synchronous-normal.md). The
 * timing comparison of the settings lives in bench/crash-durability.ts; this is the pass/fail half.
 */
const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'kindloop-crash-'));
afterAll(() => fs.rmSync(dir, { recursive: true, force: true }));

const query = <T>(file: string, sql: string) =>
  new Promise<T[]>((resolve, reject) => {
    const db = new sqlite3.Database(file, (e) => e && reject(e));
    db.all(sql, (err, rows) => db.close(() => (err ? reject(err) : resolve(rows as T[]))));
  });

describe('kill -9 during a burst of acknowledged writes', () => {
  it('finds every acknowledged write after a restart, and the file passes integrity_check', async () => {
    const file = path.join(dir, 'crash.sqlite');
    const child = spawn(process.execPath, ['--import', 'tsx', 'tests/fixtures/crash-writer.ts', file], { stdio: ['ignore', 'pipe', 'pipe'] });
    const acked = new Set<number>();
    let stderr = '';
    child.stderr.on('data', (c: Buffer) => (stderr += c.toString()));
    await new Promise<void>((resolve, reject) => {
      let buffer = '';
      child.stdout.on('data', (chunk: Buffer) => {
        buffer += chunk.toString();
        const lines = buffer.split('\n');
        buffer = lines.pop()!;
        for (const l of lines) if (/^\d+$/.test(l)) acked.add(Number(l));
        // SIGKILL: no exit handlers, no closing of the database, as in a crash.
        if (acked.size >= 100 && child.exitCode === null && !child.killed) child.kill('SIGKILL');
      });
      child.on('exit', (code, signal) => (signal === 'SIGKILL' ? resolve() : reject(new Error(`writer exited with ${code}: ${stderr}`))));
    });
    expect(acked.size).toBeGreaterThanOrEqual(100);

    // "Restart": open the file afresh, which replays the write-ahead log.
    const [{ integrity_check }] = await query<{ integrity_check: string }>(file, 'PRAGMA integrity_check');
    expect(integrity_check).toBe('ok');
    const present = new Set((await query<{ id: number }>(file, 'SELECT id FROM mail_outbox')).map((r) => r.id));
    const lost = [...acked].filter((id) => !present.has(id));
    expect(lost).toEqual([]);
    const [{ journal_mode }] = await query<{ journal_mode: string }>(file, 'PRAGMA journal_mode');
    expect(journal_mode).toBe('wal');
  });
});
