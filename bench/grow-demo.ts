/**
 * Grows the Thimbleford demo drive to a large one for the API benchmark: by default 20,000 blankets
 * from 2,000 makers, with pledges against the open needs (the right size, due by the deadline),
 * every blanket's history as allowed moves of the status machine, intake events at a drop-off site,
 * and inspections carrying the guideline check of the blanket against its recipient. Pledges whose
 * blankets are all made are marked fulfilled, as the server would mark them.
 *
 *   npm run bench:grow -- [--db bench/data/demo-20k.sqlite] [--blankets 20000] [--makers 2000]
 *
 * The database is made afresh (seeded with the demo first); nothing here touches data/.
 */
import fs from 'node:fs';
import path from 'node:path';
import { Op } from 'sequelize';
import { openDatabase } from '../server/db/sequelize';
import { initModels } from '../server/db/models/index';
import { migrate } from '../server/db/migrate';
import { seedDemo } from '../server/db/seed/demo';
import '../server/db/seed/all-steps';
import { User } from '../server/db/models/user';
import { Need } from '../server/db/models/need';
import { Recipient } from '../server/db/models/recipient';
import { Site } from '../server/db/models/site';
import { Pledge } from '../server/db/models/pledge';
import { Blanket } from '../server/db/models/blanket';
import { BlanketEvent } from '../server/db/models/blanket-event';
import { guidelinesOf } from '../server/modules/pledges/recipient-brief';
import { CODE_LENGTH, codeFromBytes } from '@shared/blankets/code';
import { FINISHED_STATUSES, MAIN_LINE, findMove } from '@shared/blankets/status';
import { check } from '@shared/guidelines/check';
import { sizeCategoryRow } from '@shared/guidelines/size-categories';
import type { BlanketFields, BlanketStatus, BodyStitch, SizeCategory } from '@shared/schemas/blanket';

export const BENCH_PASSWORD = 'bench-demo-password';
const DAY = 86_400_000;

function arg(name: string, fallback: string): string {
  const i = process.argv.indexOf(`--${name}`);
  return i >= 0 && process.argv[i + 1] ? process.argv[i + 1]! : fallback;
}

/** A small deterministic generator, so two runs grow the same drive. */
function rng(seed: number) {
  let s = seed >>> 0;
  return () => {
    s = (s + 0x6d2b79f5) >>> 0;
    let t = s;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

// Invented name parts for the extra makers of the fictional town.
const FIRST = ['Alder', 'Bryony', 'Corin', 'Delphine', 'Ember', 'Fennel', 'Garnet', 'Hazel', 'Isolde', 'Juniper', 'Kestrel', 'Linnet', 'Marlo', 'Nerys', 'Orrin', 'Posy', 'Quincy', 'Rowan', 'Sorrel', 'Tamsin', 'Umber', 'Verity', 'Wynn', 'Yarrow', 'Zinnia'];
const LAST = ['Ashcombe', 'Birchley', 'Coldharbour', 'Dunmore', 'Eddington', 'Fallow', 'Greywell', 'Hartsease', 'Ivybridge', 'Jessamy', 'Kettleby', 'Larkspur', 'Mossgrove', 'Nettlebed', 'Oakhurst', 'Pebbleton', 'Quarrendon', 'Rushmere', 'Saltmarsh', 'Thornwick'];
const COLOURS = ['oat and heather', 'marigold stripes', 'moss green', 'soft grey', 'cream', 'sky blue', 'dusky rose', 'rust and cream', 'lavender', 'teal'];
const STITCHES: BodyStitch[] = ['sc', 'hdc', 'dc', 'granny', 'ripple', 'moss', 'shell'];

/** Where grown blankets stand: most are made and on their way, a few wait at the hook or were turned away. */
const STATUS_MIX: Array<[BlanketStatus, number]> = [
  ['in_progress', 0.14],
  ['finished', 0.12],
  ['booked', 0.1],
  ['received', 0.08],
  ['needs_fix', 0.03],
  ['declined', 0.02],
  ['checked', 0.12],
  ['assigned', 0.1],
  ['packed', 0.09],
  ['delivered', 0.2],
];

function pathTo(status: BlanketStatus): BlanketStatus[] {
  if (status === 'needs_fix' || status === 'declined') return [...pathTo('received'), status];
  return MAIN_LINE.slice(0, MAIN_LINE.indexOf(status) + 1);
}

export async function growDemo(opts: { db: string; blankets: number; makers: number; today?: Date }) {
  const today = opts.today ?? new Date();
  const random = rng(20_000);
  const pick = <T>(xs: readonly T[]) => xs[Math.floor(random() * xs.length)]!;
  for (const f of [opts.db, `${opts.db}-wal`, `${opts.db}-shm`]) fs.rmSync(f, { force: true });
  fs.mkdirSync(path.dirname(path.resolve(opts.db)), { recursive: true });

  const sequelize = await openDatabase(opts.db);
  initModels(sequelize);
  await migrate(sequelize);
  await seedDemo(sequelize, BENCH_PASSWORD, 12, today);

  const template = await User.findOne({ where: { email: 'volunteer@example.org' } });
  const organiser = await User.findOne({ where: { email: 'organiser@example.org' } });
  const coordinator = await User.findOne({ where: { email: 'coordinator@example.org' } });
  const needs = (await Need.findAll({
    where: { deadline: { [Op.gte]: new Date(today.getTime() + 7 * DAY).toISOString().slice(0, 10) } },
    include: [{ model: Recipient, as: 'recipient', where: { active: true } }],
    order: [['id', 'ASC']],
  })) as Array<Need & { recipient: Recipient }>;
  const sites = await Site.findAll({ where: { active: true }, order: [['id', 'ASC']] });
  const others = (await Recipient.findAll({ where: { active: true } })).map((r) => ({ recipientId: r.id, name: r.name, guidelines: guidelinesOf(r) }));
  if (!template || !organiser || !coordinator || needs.length === 0 || sites.length === 0) throw new Error('The demo drive is missing its people, needs or sites');

  const existing = await User.count({ where: { role: 'volunteer' } });
  const newMakers = Math.max(0, opts.makers - existing);
  const makerRows = Array.from({ length: newMakers }, (_, i) => ({
    name: `${FIRST[i % FIRST.length]} ${LAST[Math.floor(i / FIRST.length) % LAST.length]}${i >= FIRST.length * LAST.length ? ` ${Math.floor(i / (FIRST.length * LAST.length)) + 1}` : ''}`,
    email: `maker-${String(i + 1).padStart(4, '0')}@example.org`,
    role: 'volunteer' as const,
    passwordHash: template.passwordHash,
    town: template.town,
  }));
  await sequelize.transaction(async (transaction) => {
    for (let i = 0; i < makerRows.length; i += 500) await User.bulkCreate(makerRows.slice(i, i + 500), { transaction });
  });
  const makers = await User.findAll({ where: { email: { [Op.like]: 'maker-%@example.org' } }, order: [['id', 'ASC']] });

  const codes = new Set((await Blanket.findAll({ attributes: ['code'] })).map((b) => b.code));
  const newCode = () => {
    for (;;) {
      const code = codeFromBytes(Uint8Array.from({ length: CODE_LENGTH }, () => Math.floor(random() * 256)));
      if (!codes.has(code)) {
        codes.add(code);
        return code;
      }
    }
  };
  const statusFor = () => {
    let r = random();
    for (const [s, p] of STATUS_MIX) if ((r -= p) < 0) return s;
    return 'delivered' as BlanketStatus;
  };

  let toMake = opts.blankets - (await Blanket.count());
  let makerIndex = 0;
  while (toMake > 0) {
    // A batch of makers per transaction keeps memory flat and the file consistent at every commit.
    await sequelize.transaction(async (transaction) => {
      for (let m = 0; m < 100 && toMake > 0; m++, makerIndex++) {
        const maker = makers[makerIndex % makers.length]!;
        const perMaker = Math.min(toMake, 6 + Math.floor(random() * 9));
        let left = perMaker;
        while (left > 0) {
          const quantity = Math.min(left, 1 + Math.floor(random() * 5));
          const need = random() < 0.1 ? null : pick(needs);
          const size: SizeCategory = need ? (need.sizeCategory as SizeCategory) : pick(['lap', 'throw', 'baby'] as SizeCategory[]);
          const latest = need ? Date.parse(`${need.deadline}T00:00:00Z`) : today.getTime() + 60 * DAY;
          const due = new Date(Math.min(latest, today.getTime() + (5 + Math.floor(random() * 50)) * DAY));
          const statuses = Array.from({ length: quantity }, statusFor);
          const finished = statuses.filter((s) => FINISHED_STATUSES.includes(s)).length;
          const pledge = await Pledge.create(
            {
              userId: maker.id,
              needId: need?.id ?? null,
              quantity,
              sizeCategory: size,
              dueDate: due.toISOString().slice(0, 10),
              status: finished >= quantity ? 'fulfilled' : 'active',
              createdAt: new Date(today.getTime() - 45 * DAY),
            },
            { transaction },
          );
          const row = sizeCategoryRow(size);
          const g = need ? guidelinesOf(need.recipient) : null;
          const yarnWeight = g?.yarnWeights.includes(3) ? 3 : g?.yarnWeights.includes(4) ? 4 : (g?.yarnWeights[0] ?? 4);
          const blanketRows = statuses.map((status) => {
            const steps = pathTo(status);
            // Logged early enough that every step, a day and a half apart, lies in the past: the
            // drive's history spreads over six weeks rather than piling up on today.
            const loggedAt = new Date(today.getTime() - (steps.length * 1.5 + 1 + random() * 30) * DAY);
            const at = (i: number) => new Date(loggedAt.getTime() + i * 1.5 * DAY);
            const received = steps.indexOf('received');
            const fields: BlanketFields = {
              widthCm: Math.round(row.nominalCm.width) - 1 + Math.floor(random() * 3),
              lengthCm: Math.round(row.nominalCm.length) + Math.floor(random() * 3),
              yarnWeight,
              fibres: ['acrylic'],
              features: [],
              machineWashable: true,
              dryerSafe: true,
              smokeFree: status !== 'declined',
              petFree: true,
              newYarn: true,
            };
            return { status, steps, at, received, fields, loggedAt };
          });
          const created = await Blanket.bulkCreate(
            blanketRows.map((b) => ({
              code: newCode(),
              userId: maker.id,
              pledgeId: pledge.id,
              recipientId: need?.recipientId ?? null,
              siteId: b.steps.includes('booked') || b.received >= 0 ? pick(sites).id : null,
              status: b.status,
              ...b.fields,
              colours: pick(COLOURS),
              bodyStitch: pick(STITCHES),
              receivedAt: b.received >= 0 ? b.at(b.received) : null,
              createdAt: b.loggedAt,
              updatedAt: b.at(b.steps.length - 1),
            })),
            { transaction },
          );
          const events = created.flatMap((blanket, k) => {
            const b = blanketRows[k]!;
            const mover = (from: BlanketStatus, to: BlanketStatus) => {
              const move = findMove(from, to)!;
              return move.by.includes('maker') ? maker.id : move.by.includes('organiser') ? organiser.id : coordinator.id;
            };
            return [
              { blanketId: blanket.id, actorId: maker.id, kind: 'logged', fromStatus: null, toStatus: 'in_progress', reason: null, data: null, createdAt: b.at(0) },
              ...b.steps.slice(1).map((to, i) => {
                const from = b.steps[i]!;
                const site = sites.find((s) => s.id === blanket.siteId) ?? sites[0]!;
                if (to === 'received') {
                  return { blanketId: blanket.id, actorId: organiser.id, kind: 'intake', fromStatus: from, toStatus: to, reason: null, createdAt: b.at(i + 1),
                    data: { siteId: site.id, siteName: site.name, logged: { widthCm: b.fields.widthCm, lengthCm: b.fields.lengthCm }, measured: { widthCm: b.fields.widthCm, lengthCm: b.fields.lengthCm }, note: null } };
                }
                if (from === 'received' && (to === 'checked' || to === 'needs_fix' || to === 'declined')) {
                  const result = need ? check(b.fields, guidelinesOf(need.recipient), others, { recipientId: need.recipientId }) : null;
                  const because = to === 'declined' ? 'Smells of smoke after washing; the recipients take blankets from smoke-free homes only.' : to === 'needs_fix' ? 'A loose end on one corner: weave it in.' : null;
                  return { blanketId: blanket.id, actorId: organiser.id, kind: 'inspection', fromStatus: from, toStatus: to, reason: because, createdAt: b.at(i + 1),
                    data: { checklist: {}, corrections: {}, check: result && { recipientId: need!.recipientId, recipientName: need!.recipient.name, verdict: result.verdict, reasons: result.reasons, alsoFits: result.alsoFits }, outcome: to, overridden: false, fixes: [], fixNote: because, note: null } };
                }
                return { blanketId: blanket.id, actorId: mover(from, to), kind: 'status', fromStatus: from, toStatus: to, reason: null, data: null, createdAt: b.at(i + 1) };
              }),
            ];
          });
          await BlanketEvent.bulkCreate(events as never[], { transaction });
          left -= quantity;
          toMake -= quantity;
        }
      }
    });
  }
  await sequelize.query('ANALYZE;');
  const counts = { makers: await User.count({ where: { role: 'volunteer' } }), pledges: await Pledge.count(), blankets: await Blanket.count(), events: await BlanketEvent.count() };
  await sequelize.close();
  return counts;
}

if (process.argv[1] && path.resolve(process.argv[1]).endsWith(path.join('bench', 'grow-demo.ts'))) {
  const db = arg('db', 'bench/data/demo-20k.sqlite');
  const t0 = Date.now();
  const counts = await growDemo({ db, blankets: Number(arg('blankets', '20000')), makers: Number(arg('makers', '2000')) });
  console.log(`Grew the demo drive in ${db} in ${((Date.now() - t0) / 1000).toFixed(1)} s:`, counts);
}
