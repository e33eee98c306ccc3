/**
 * The drive at a glance on a drive of 20,000 blankets: its aggregate queries, beside the home page's
 * progress charts (one aggregate over needs and blankets) and beside loading the rows the figures are
 * made from (every blanket, live assignment, pledge and history entry) the way a page counting in
 * JavaScript would have to. Prints the median time of each and the ratios, measured in the same run,
 * and the heap each one grows; nothing passes or fails on time.
 *
 *   node --expose-gc --import tsx bench/glance.ts [--db bench/data/demo-20k.sqlite] [--rounds 7]
 *
 * Grows the demo first when the database is missing (bench/grow-demo.ts), on a copy in the system's
 * temp folder so the grown drive is left as it was.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { openDatabase } from '../server/db/sequelize';
import { initModels } from '../server/db/models/index';
import { migrate } from '../server/db/migrate';
import { Assignment } from '../server/db/models/assignment';
import { Blanket } from '../server/db/models/blanket';
import { BlanketEvent } from '../server/db/models/blanket-event';
import { Pledge } from '../server/db/models/pledge';
import { driveGlance } from '../server/modules/drive/glance.service';
import { driveProgress } from '../server/modules/drive/progress.service';
import { growDemo } from './grow-demo';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const arg = (name: string, fallback: string) => {
  const i = process.argv.indexOf(`--${name}`);
  return i >= 0 && process.argv[i + 1] ? process.argv[i + 1]! : fallback;
};
const DB = path.resolve(root, arg('db', 'bench/data/demo-20k.sqlite'));
const ROUNDS = Number(arg('rounds', '7'));
const MB = 1024 * 1024;

if (!fs.existsSync(DB)) {
  console.log(`Growing the demo to 20,000 blankets in ${path.relative(root, DB)}…`);
  await growDemo({ db: DB, blankets: 20_000, makers: 2_000 });
}
const copy = path.join(fs.mkdtempSync(path.join(os.tmpdir(), 'kindloop-bench-glance-')), 'glance.sqlite');
fs.copyFileSync(DB, copy);
const sequelize = await openDatabase(copy);
initModels(sequelize);
await migrate(sequelize);
const gc = (globalThis as { gc?: () => void }).gc;

async function measure(name: string, run: () => Promise<unknown>) {
  await run(); // warm the page cache and the statement cache
  const times: number[] = [];
  let peak = 0;
  for (let i = 0; i < ROUNDS; i++) {
    gc?.();
    const before = process.memoryUsage().heapUsed;
    const t0 = performance.now();
    const out = await run();
    times.push(performance.now() - t0);
    peak = Math.max(peak, process.memoryUsage().heapUsed - before);
    void out;
  }
  times.sort((a, b) => a - b);
  return { name, ms: times[Math.floor(times.length / 2)]!, peakMb: peak / MB };
}

const blankets = await Blanket.count();
const events = await BlanketEvent.count();
const glance = await measure('GET /api/drive/glance (aggregates)', () => driveGlance());
const progress = await measure('GET /api/drive/progress (home charts, baseline)', () => driveProgress());
const rows = await measure('loading the rows to count in JavaScript', async () => {
  const [b, a, p, e] = await Promise.all([
    Blanket.findAll({ attributes: ['id', 'status', 'pledgeId', 'createdAt', 'recipientId', 'code'], raw: true }),
    Assignment.findAll({ where: { endedAt: null }, attributes: ['blanketId', 'needId'], raw: true }),
    Pledge.findAll({ attributes: ['id', 'needId', 'quantity', 'status', 'createdAt'], raw: true }),
    BlanketEvent.findAll({ attributes: ['blanketId', 'fromStatus', 'toStatus', 'createdAt'], raw: true }),
  ]);
  return b.length + a.length + p.length + e.length;
});

console.log(`Drive: ${blankets} blankets, ${events} history entries; median of ${ROUNDS} rounds.\n`);
console.log('| what | median ms | × home charts | peak heap growth |');
console.log('|---|---|---|---|');
for (const r of [glance, progress, rows]) {
  console.log(`| ${r.name} | ${r.ms.toFixed(1)} | ${(r.ms / progress.ms).toFixed(2)} | ${r.peakMb.toFixed(1)} MB |`);
}
console.log(`\nThe glance takes ${(glance.ms / rows.ms).toFixed(2)}× the time of loading its rows, before any counting in JavaScript.`);
await sequelize.close();
fs.rmSync(path.dirname(copy), { recursive: true, force: true });
