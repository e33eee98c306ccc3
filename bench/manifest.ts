/**
 * The delivery-list manifest of a very large run (100,000 blankets by default), streamed from SQLite
 * a page at a time through csv-stringify exactly as the download route does (manifestStream), against
 * csv-stringify writing the same records, with the same options, from an array already in memory
 * (the fastest it can go, and the memory a naive export would hold). Prints the time ratio per round
 * and the live memory growth; nothing passes or fails on time.
 *
 *   node --expose-gc --import tsx bench/manifest.ts [--rows 100000] [--rounds 5] [--page 1000]
 *
 * Goals from the issue: streaming within 1.5x of the in-memory baseline's time, and under 50 MB of
 * peak memory growth. Memory is measured in a separate, untimed pass (see bench/README.md): a full
 * collection every 256 KiB written, so the heap figure is memory still live, not garbage waiting.
 * The database is a throwaway file in the system's temp folder.
 */
import crypto from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { Readable, Writable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import { openDatabase } from '../server/db/sequelize';
import { initModels } from '../server/db/models/index';
import { migrate } from '../server/db/migrate';
import { MANIFEST_PAGE, manifestPages, manifestRows, manifestStream } from '../server/modules/runs/manifest.service';
import { manifestStringifier, type ManifestRecord } from '../server/modules/runs/manifest-format';

function arg(name: string, fallback: number): number {
  const i = process.argv.indexOf(`--${name}`);
  return i >= 0 ? Number(process.argv[i + 1]) : fallback;
}
const MEMORY = process.argv.includes('--memory') ? process.argv[process.argv.indexOf('--memory') + 1] : null;
const ROWS = arg('rows', 100_000);
const ROUNDS = arg('rounds', 5);
const PAGE = arg('page', MANIFEST_PAGE);
const MB = 1024 * 1024;
if (!globalThis.gc) throw new Error('Run with node --expose-gc (npm run bench:manifest does): the memory pass needs full collections.');
const gc: () => void = globalThis.gc;

// A memory pass runs in a fresh process of its own on the parent's database (see the end of the file).
const dir = MEMORY ? path.dirname(process.argv[process.argv.indexOf('--db') + 1]!) : fs.mkdtempSync(path.join(os.tmpdir(), 'kindloop-bench-manifest-'));
const dbFile = path.join(dir, 'bench.sqlite');
const sequelize = await openDatabase(dbFile);
initModels(sequelize);
if (!MEMORY) {
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
      // Each blanket's history as a packed blanket has it: logged, received, checked, assigned, packed.
      `INSERT INTO blanket_events (blanketId, actorId, kind, fromStatus, toStatus, createdAt)
       SELECT b.id, s.actorId, s.kind, s.fromStatus, s.toStatus, :now FROM blankets b
       CROSS JOIN (SELECT 1 AS actorId, 'logged' AS kind, NULL AS fromStatus, 'finished' AS toStatus, 1 AS k
                   UNION ALL SELECT 2, 'intake', 'finished', 'received', 2
                   UNION ALL SELECT 2, 'inspection', 'received', 'checked', 3
                   UNION ALL SELECT 2, 'assignment', 'checked', 'assigned', 4
                   UNION ALL SELECT 2, 'packing', 'assigned', 'packed', 5) s
       ORDER BY b.id, s.k`,
      { ...opts, replacements: { now } },
    );
  });
  await q('ANALYZE');
}

/** A sink like a fast client: counts bytes, optionally hashes them, and can watch memory as it goes. */
function sink(opts: { hash?: boolean; watch?: (bytes: number) => void } = {}) {
  let bytes = 0;
  let nextWatch = 0;
  const hash = opts.hash ? crypto.createHash('sha256') : null;
  const w = new Writable({
    write(chunk: Buffer, _e, cb) {
      bytes += chunk.length;
      hash?.update(chunk);
      if (opts.watch && bytes >= nextWatch) {
        nextWatch = bytes + 256 * 1024;
        opts.watch(bytes);
      }
      cb();
    },
  });
  return { w, bytes: () => bytes, digest: () => hash?.digest('hex') ?? '' };
}

const target = { kind: 'run', id: 1 } as const;
const streamed = (s: ReturnType<typeof sink>) => pipeline(manifestStream(sequelize, target, { pageSize: PAGE }), manifestStringifier({ bom: false }), s.w);
const readAll = async () => {
  const records: ManifestRecord[] = [];
  for await (const r of manifestRows(sequelize, target, PAGE)) records.push(r);
  return records;
};
const fromMemory = (records: ManifestRecord[], s: ReturnType<typeof sink>) => pipeline(Readable.from(records), manifestStringifier({ bom: false }), s.w);
const ms = (start: bigint) => Number(process.hrtime.bigint() - start) / 1e6;
const load = () => os.loadavg()[0]!.toFixed(2);

/**
 * CPU time so far of this process's main thread and of all its other threads (SQLite's work runs on
 * libuv's pool, parts of garbage collection on V8's), from /proc on Linux; null elsewhere. On a
 * shared machine the wall time mostly says how much of a core each thread was given; CPU time says
 * what the work cost.
 */
function cpuByThread(): { main: number; others: number } | null {
  const tasks = '/proc/self/task';
  if (!fs.existsSync(tasks)) return null;
  const tick = 10; // ms per clock tick (USER_HZ 100 on Linux)
  let main = 0;
  let others = 0;
  for (const t of fs.readdirSync(tasks)) {
    let stat: string;
    try {
      stat = fs.readFileSync(`${tasks}/${t}/stat`, 'utf8');
    } catch {
      continue; // a thread that ended between the listing and the read
    }
    const f = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
    const used = (Number(f[11]) + Number(f[12])) * tick;
    if (Number(t) === process.pid) main += used;
    else others += used;
  }
  return { main, others };
}

async function timed(fn: () => Promise<unknown>): Promise<{ wall: number; main: number; others: number }> {
  gc();
  const c0 = cpuByThread();
  const start = process.hrtime.bigint();
  await fn();
  const wall = ms(start);
  const c1 = cpuByThread();
  return { wall, main: c0 && c1 ? c1.main - c0.main : NaN, others: c0 && c1 ? c1.others - c0.others : NaN };
}

/**
 * Memory, untimed, in a fresh process: a full collection every 256 KiB written, then heapUsed and
 * RSS are read. The growth is the largest reading less the reading taken, after a collection, just
 * before the manifest starts. The baseline's figure includes the array of records it holds.
 */
async function memoryPass(run: (s: ReturnType<typeof sink>) => Promise<unknown>): Promise<{ heapMb: number; rssMb: number }> {
  gc();
  const base = process.memoryUsage();
  let heap = 0;
  let rss = 0;
  const watch = () => {
    gc();
    const m = process.memoryUsage();
    heap = Math.max(heap, m.heapUsed - base.heapUsed);
    rss = Math.max(rss, m.rss - base.rss);
  };
  const s = sink({ watch });
  await run(s);
  watch();
  return { heapMb: heap / MB, rssMb: rss / MB };
}

if (MEMORY) {
  const result = await memoryPass(MEMORY === 'streamed' ? streamed : async (s) => fromMemory(await readAll(), s));
  console.log(JSON.stringify(result));
  await sequelize.close();
  process.exit(0);
}

console.log(`Manifest of one run with ${ROWS.toLocaleString('en-GB')} blankets, pages of ${PAGE.toLocaleString('en-GB')}, ${ROUNDS} interleaved rounds`);
console.log(`${os.cpus().length} cores, load average at start ${os.loadavg().map((x) => x.toFixed(2)).join(' ')}\n`);

// The two ways must write the very same file.
{
  const a = sink({ hash: true });
  await streamed(a);
  const b = sink({ hash: true });
  await fromMemory(await readAll(), b);
  if (a.digest() !== b.digest()) throw new Error(`The two ways wrote different files (${a.bytes()} and ${b.bytes()} bytes)`);
  console.log(`file size ${(a.bytes() / MB).toFixed(1)} MB, identical both ways (sha256)\n`);
}

const f0 = (x: number) => (Number.isNaN(x) ? '–' : x.toFixed(0));
console.log('       ---------- wall ms ----------   -- streamed CPU ms --   - baseline CPU ms -   read+shape alone');
console.log('round  streamed  baseline  ratio      main  other threads       main  other          wall ms   load');
const rounds: Array<{ s: Awaited<ReturnType<typeof timed>>; b: Awaited<ReturnType<typeof timed>>; read: number }> = [];
for (let r = 0; r < ROUNDS; r++) {
  // Where the streamed time goes: reading and shaping the pages alone, with nothing written.
  let n = 0;
  const read = await timed(async () => {
    for await (const page of manifestPages(sequelize, target, PAGE)) n += page.length;
  });
  if (n !== ROWS) throw new Error(`read ${n} rows, expected ${ROWS}`);
  const s = await timed(() => streamed(sink()));
  const records = await readAll();
  const b = await timed(() => fromMemory(records, sink()));
  rounds.push({ s, b, read: read.wall });
  console.log(
    `${String(r + 1).padStart(5)}  ${f0(s.wall).padStart(8)}  ${f0(b.wall).padStart(8)}  ${(s.wall / b.wall).toFixed(2).padStart(5)}  ${f0(s.main).padStart(8)}  ${f0(s.others).padStart(13)}  ${f0(b.main).padStart(9)}  ${f0(b.others).padStart(5)}  ${f0(read.wall).padStart(15)}  ${load().padStart(5)}`,
  );
}
const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!;
const m = (f: (x: (typeof rounds)[number]) => number) => median(rounds.map(f));
console.log(`\nwall time, streamed / baseline (median of the rounds' ratios)      ${m((x) => x.s.wall / x.b.wall).toFixed(2)}×   (goal ≤ 1.5×)`);
console.log(`main-thread CPU, streamed / baseline                                ${m((x) => x.s.main / x.b.main).toFixed(2)}×`);
console.log(`CPU of all threads, streamed / baseline                             ${m((x) => (x.s.main + x.s.others) / (x.b.main + x.b.others)).toFixed(2)}×`);
console.log(`medians: streamed ${f0(m((x) => x.s.wall))} ms, baseline ${f0(m((x) => x.b.wall))} ms, read and shape alone ${f0(m((x) => x.read))} ms\n`);

await sequelize.close();

// Each memory pass in a fresh process, so RSS growth is not hidden by what the timed rounds grew.
const { execFileSync } = await import('node:child_process');
const self = process.argv[1]!;
const memory = (which: string) =>
  JSON.parse(
    execFileSync(process.execPath, [...process.execArgv, self, '--memory', which, '--db', dbFile, '--rows', String(ROWS), '--page', String(PAGE)], { encoding: 'utf8' })
      .trim()
      .split('\n')
      .pop()!,
  ) as { heapMb: number; rssMb: number };
const streamedMem = memory('streamed');
const baselineMem = memory('baseline');
console.log(`live heap growth, streamed  ${streamedMem.heapMb.toFixed(1).padStart(6)} MB   RSS growth ${streamedMem.rssMb.toFixed(1).padStart(6)} MB   (goal < 50 MB)`);
console.log(`live heap growth, baseline  ${baselineMem.heapMb.toFixed(1).padStart(6)} MB   RSS growth ${baselineMem.rssMb.toFixed(1).padStart(6)} MB   (the whole array held)`);
console.log(`load average at the end ${os.loadavg().map((x) => x.toFixed(2)).join(' ')}`);

fs.rmSync(dir, { recursive: true, force: true });
