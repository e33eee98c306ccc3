/**
 * The delivery-list manifest of a very large run (100,000 blankets by default), streamed from SQLite
 * a page at a time through csv-stringify, against csv-stringify writing the same records from an
 * array already in memory (the fastest it can go, and the memory a naive export would hold).
 * Prints time ratios and peak heap growth side by side; nothing passes or fails on time.
 *
 *   node --expose-gc --import tsx bench/manifest.ts [--rows 100000] [--rounds 3]
 *
 * Goals from the issue: streaming within 1.5× of the in-memory baseline's time, and under 50 MB of
 * peak heap growth. The database is a throwaway file in the system's temp folder.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { Readable, Writable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import { openDatabase } from '../server/db/sequelize';
import { initModels } from '../server/db/models/index';
import { migrate } from '../server/db/migrate';
import { manifestRows } from '../server/modules/runs/manifest.service';
import { manifestStringifier, type ManifestRecord } from '../server/modules/runs/manifest-format';

function arg(name: string, fallback: number): number {
  const i = process.argv.indexOf(`--${name}`);
  return i >= 0 ? Number(process.argv[i + 1]) : fallback;
}
const ROWS = arg('rows', 100_000);
const ROUNDS = arg('rounds', 3);
const MB = 1024 * 1024;

const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'kindloop-bench-manifest-'));
const sequelize = await openDatabase(path.join(dir, 'bench.sqlite'));
initModels(sequelize);
await migrate(sequelize);

const now = new Date().toISOString();
const q = (sql: string, replacements: Record<string, unknown> = {}) => sequelize.query(sql, { replacements });
await sequelize.transaction(async (transaction) => {
  const opts = { transaction };
  await sequelize.query(
    `INSERT INTO users (name, email, passwordHash, role, active, version, createdAt, updatedAt) VALUES
       ('Bench Maker', 'maker@example.org', 'x', 'volunteer', 1, 0, :now, :now),
       ('Bench Checker', 'checker@example.org', 'x', 'organiser', 1, 0, :now, :now)`,
    { ...opts, replacements: { now } },
  );
  await sequelize.query(
    `INSERT INTO recipients (name, kind, population, address, lat, lng, guidelines, active, version, createdAt, updatedAt)
     VALUES ('Bench Shelter, "north" door', 'family-shelter', 'infant', '1 Bench Row, Thimbleford', 46.2, -27.4, '{}', 1, 0, :now, :now)`,
    { ...opts, replacements: { now } },
  );
  await sequelize.query(`INSERT INTO sites (name, address, lat, lng, active, createdAt, updatedAt) VALUES ('Bench Hall', '2 Bench Row', 46.21, -27.41, 1, :now, :now)`, {
    ...opts,
    replacements: { now },
  });
  await sequelize.query(`INSERT INTO runs (runDate, driverId, startSiteId, notes, version, createdAt, updatedAt) VALUES ('2026-12-20', 2, 1, '', 0, :now, :now)`, {
    ...opts,
    replacements: { now },
  });
  await sequelize.query(`INSERT INTO run_stops (runId, recipientId, position, version, createdAt, updatedAt) VALUES (1, 1, 1, 0, :now, :now)`, { ...opts, replacements: { now } });
  // Every blanket packed for the one stop, with colours that need quoting or neutralising now and then.
  await sequelize.query(
    `WITH RECURSIVE n(i) AS (SELECT 1 UNION ALL SELECT i + 1 FROM n WHERE i < :rows)
     INSERT INTO blankets (code, userId, recipientId, status, widthCm, lengthCm, yarnWeight, fibres, colours, bodyStitch, features,
                           machineWashable, dryerSafe, smokeFree, petFree, newYarn, labelName, notes, version, createdAt, updatedAt)
     SELECT printf('B%07d', i), 1, 1, 'packed', 80 + (i % 7), 100 + (i % 11), 4, '["acrylic","cotton"]',
            CASE WHEN i % 50 = 0 THEN '=SUM(1,1)' WHEN i % 7 = 0 THEN 'cream, moss and "heather"' ELSE 'ocean blues' END,
            'hdc', '[]', 1, 1, 1, 1, 1, CASE WHEN i % 3 = 0 THEN 'anonymous' ELSE 'first-name' END, '', 0, :now, :now
     FROM n`,
    { ...opts, replacements: { rows: ROWS, now } },
  );
  await sequelize.query(`INSERT INTO run_blankets (runId, stopId, blanketId, box, createdAt, updatedAt) SELECT 1, 1, id, (id % 40) + 1, :now, :now FROM blankets`, {
    ...opts,
    replacements: { now },
  });
  await sequelize.query(
    `INSERT INTO blanket_events (blanketId, actorId, kind, fromStatus, toStatus, createdAt) SELECT id, 2, 'inspection', 'received', 'checked', :now FROM blankets`,
    { ...opts, replacements: { now } },
  );
});
await q('ANALYZE');

/** A sink that counts bytes and throws them away, like a fast client. */
function sink() {
  let bytes = 0;
  const w = new Writable({
    write(chunk: Buffer, _e, cb) {
      bytes += chunk.length;
      cb();
    },
  });
  return { w, bytes: () => bytes };
}

/** Runs fn while sampling the heap every 5 ms; returns the time and the peak growth over the start. */
async function measure(fn: () => Promise<unknown>): Promise<{ ms: number; peakMb: number }> {
  globalThis.gc?.();
  const base = process.memoryUsage().heapUsed;
  let peak = base;
  const timer = setInterval(() => {
    peak = Math.max(peak, process.memoryUsage().heapUsed);
  }, 5);
  const start = process.hrtime.bigint();
  await fn();
  const ms = Number(process.hrtime.bigint() - start) / 1e6;
  clearInterval(timer);
  peak = Math.max(peak, process.memoryUsage().heapUsed);
  return { ms, peakMb: (peak - base) / MB };
}

const streamed = async () => {
  const s = sink();
  await pipeline(Readable.from(manifestRows(sequelize, { kind: 'run', id: 1 })), manifestStringifier({ bom: false }), s.w);
  return s.bytes();
};

/** The baseline: the same records read into an array first (that read is part of its memory, not its time). */
const inMemory = async () => {
  const records: ManifestRecord[] = [];
  for await (const r of manifestRows(sequelize, { kind: 'run', id: 1 }, ROWS + 1)) records.push(r);
  const s = sink();
  const start = process.hrtime.bigint();
  await pipeline(Readable.from(records), manifestStringifier({ bom: false }), s.w);
  return { ms: Number(process.hrtime.bigint() - start) / 1e6, bytes: s.bytes(), records };
};

console.log(`Manifest of one run with ${ROWS.toLocaleString('en-GB')} blankets (${ROUNDS} interleaved rounds, medians)\n`);
if (!globalThis.gc) console.log('(run with node --expose-gc for steady heap figures)\n');
const rows: Array<{ sMs: number; sPeak: number; bMs: number; bPeak: number; bytes: number; readMs: number }> = [];
for (let r = 0; r < ROUNDS; r++) {
  // Where the streamed time goes: reading and shaping the rows alone, with nothing written.
  const read = await measure(async () => {
    for await (const rec of manifestRows(sequelize, { kind: 'run', id: 1 })) if (rec.length === 0) throw new Error('empty record');
  });
  let bytes = 0;
  const s = await measure(async () => {
    bytes = await streamed();
  });
  let baselineMs = 0;
  const b = await measure(async () => {
    const res = await inMemory();
    baselineMs = res.ms;
    if (res.bytes !== bytes) throw new Error(`The two ways wrote different files: ${res.bytes} and ${bytes} bytes`);
  });
  rows.push({ sMs: s.ms, sPeak: s.peakMb, bMs: baselineMs, bPeak: b.peakMb, bytes, readMs: read.ms });
}
const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!;
const sMs = median(rows.map((x) => x.sMs));
const bMs = median(rows.map((x) => x.bMs));
const sPeak = median(rows.map((x) => x.sPeak));
const bPeak = median(rows.map((x) => x.bPeak));
console.log(`file size                                       ${(rows[0]!.bytes / MB).toFixed(1)} MB`);
console.log(`streamed from SQLite, pages of 1,000            ${sMs.toFixed(0).padStart(7)} ms   peak heap growth ${sPeak.toFixed(1).padStart(6)} MB`);
console.log(`csv-stringify from an array in memory (baseline) ${bMs.toFixed(0).padStart(6)} ms   peak heap growth ${bPeak.toFixed(1).padStart(6)} MB (array included)`);
console.log(`of which reading and shaping rows alone          ${median(rows.map((x) => x.readMs)).toFixed(0).padStart(7)} ms`);
console.log(`time ratio streamed / baseline                  ${(sMs / bMs).toFixed(2)}×   (goal ≤ 1.5×)`);
console.log(`peak heap growth streamed                       ${sPeak.toFixed(1)} MB   (goal < 50 MB; baseline ${(sPeak / bPeak).toFixed(2)}× of its own)`);

await sequelize.close();
fs.rmSync(dir, { recursive: true, force: true });
