import { Op } from 'sequelize';
import { Blanket } from '../models/blanket';
import { BlanketEvent } from '../models/blanket-event';
import { Recipient } from '../models/recipient';
import { Export, Run, RunBlanket, RunStop } from '../models/run';
import { Site } from '../models/site';
import type { User } from '../models/user';
import { addSeedStep } from './demo';
import { daysFrom, isoDay, type SeedContext } from './seed-context';
import { uniqueBlanketCode } from '../../modules/blankets/blanket-code';
import { MAIN_LINE, findMove } from '@shared/blankets/status';
import { sizeCategoryRow } from '@shared/guidelines/size-categories';
import type { BlanketStatus, SizeCategory } from '@shared/schemas/blanket';

/**
 * The last mile of the demo: a run delivered last week, a run later this week with its blankets
 * packed for several stops, and blankets still waiting for a run. Names are invented.
 */

interface ExtraBlanket {
  recipient: string;
  status: BlanketStatus;
  size: SizeCategory;
  colours: string;
  maker: string;
  daysAgo: number;
}

/** Blankets beyond the volunteers' step, so the runs have several stops. */
const EXTRA: ExtraBlanket[] = [
  { recipient: 'Willow Newborn Unit, Thimbleford General', status: 'packed', size: 'preemie', colours: 'soft primrose', maker: 'maren@example.org', daysAgo: 26 },
  { recipient: 'Willow Newborn Unit, Thimbleford General', status: 'packed', size: 'preemie', colours: 'pale mint', maker: 'ines@example.org', daysAgo: 24 },
  { recipient: 'Tansy Court Care Home', status: 'packed', size: 'lap', colours: 'plum and heather', maker: 'agnes@example.org', daysAgo: 25 },
  { recipient: 'Harbour Lantern Family Shelter', status: 'assigned', size: 'crib', colours: 'ocean blues', maker: 'dev@example.org', daysAgo: 19 },
  { recipient: 'Harbour Lantern Family Shelter', status: 'assigned', size: 'crib', colours: 'sunflower yellow', maker: 'hattie@example.org', daysAgo: 18 },
  { recipient: 'Fernhollow House', status: 'assigned', size: 'lap', colours: 'moss and oat', maker: 'felix@example.org', daysAgo: 17 },
];

function moverFor(from: BlanketStatus, to: BlanketStatus, maker: User, ctx: SeedContext): User {
  const move = findMove(from, to);
  if (!move) throw new Error(`The demo plans an impossible move ${from} → ${to}`);
  if (move.by.includes('maker')) return maker;
  return move.by.includes('organiser') ? ctx.users.organiser : ctx.users.coordinator;
}

async function addExtra(ctx: SeedContext, e: ExtraBlanket, recipient: Recipient, site: Site | null) {
  const { transaction, today } = ctx;
  const maker = ctx.users.volunteers.find((u) => u.email === e.maker) ?? ctx.users.volunteer;
  const row = sizeCategoryRow(e.size);
  const steps = MAIN_LINE.slice(0, MAIN_LINE.indexOf(e.status) + 1);
  const logged = daysFrom(today, -e.daysAgo);
  const at = (i: number) => new Date(logged.getTime() + i * 1.5 * 86_400_000);
  const b = await Blanket.create(
    {
      code: await uniqueBlanketCode(transaction),
      userId: maker.id,
      pledgeId: null,
      recipientId: recipient.id,
      siteId: site?.id ?? null,
      status: e.status,
      widthCm: Math.round(row.nominalCm.width),
      lengthCm: Math.round(row.nominalCm.length) + 1,
      yarnWeight: 3,
      fibres: ['acrylic'],
      features: [],
      machineWashable: true,
      dryerSafe: true,
      smokeFree: true,
      petFree: true,
      colours: e.colours,
      receivedAt: at(steps.indexOf('received')),
    },
    { transaction },
  );
  const events = [
    { kind: 'logged', fromStatus: null, toStatus: 'in_progress', actorId: maker.id, createdAt: at(0) },
    ...steps.slice(1).map((to, i) => ({ kind: 'status', fromStatus: steps[i]!, toStatus: to, actorId: moverFor(steps[i]!, to, maker, ctx).id, createdAt: at(i + 1) })),
  ];
  for (const ev of events) {
    const made = await BlanketEvent.create({ blanketId: b.id, ...ev, reason: null, data: null as BlanketEvent['data'] }, { transaction });
    await BlanketEvent.update({ createdAt: ev.createdAt }, { where: { id: made.id }, transaction, silent: true });
  }
  await Blanket.update({ createdAt: logged }, { where: { id: b.id }, transaction, silent: true });
}

/** One stop per recipient, in the order given, with their blankets in box 1, 2, … by three. */
async function stopsFor(ctx: SeedContext, run: Run, blankets: Blanket[], state: { packedAt?: Date; deliveredAt?: Date; signers?: string[] }) {
  const { transaction } = ctx;
  const byRecipient = new Map<number, Blanket[]>();
  for (const b of blankets) byRecipient.set(b.recipientId!, [...(byRecipient.get(b.recipientId!) ?? []), b]);
  let position = 0;
  for (const [recipientId, list] of byRecipient) {
    position += 1;
    const stop = await RunStop.create(
      {
        runId: run.id,
        recipientId,
        position,
        packedAt: state.packedAt ?? null,
        deliveredAt: state.deliveredAt ?? null,
        receivedCount: state.deliveredAt ? list.length : null,
        signedBy: state.deliveredAt ? (state.signers?.[position - 1] ?? 'Front desk') : null,
      },
      { transaction },
    );
    for (const [i, b] of list.entries()) await RunBlanket.create({ runId: run.id, stopId: stop.id, blanketId: b.id, box: Math.floor(i / 3) + 1 }, { transaction });
  }
}

addSeedStep(async (ctx) => {
  const { transaction, today } = ctx;
  const site = await Site.findOne({ where: ctx.ids.sites?.[0] ? { id: ctx.ids.sites[0] } : {}, order: [['id', 'ASC']], transaction });
  if (!site) return;
  const recipients = await Recipient.findAll({ transaction });
  for (const e of EXTRA) {
    const r = recipients.find((x) => x.name === e.recipient);
    if (r) await addExtra(ctx, e, r, site);
  }
  const inState = (status: BlanketStatus) =>
    Blanket.findAll({ where: { status, recipientId: { [Op.ne]: null } }, order: [['recipientId', 'ASC'], ['id', 'ASC']], transaction });

  const delivered = await Run.create(
    { runDate: isoDay(daysFrom(today, -9)), driverId: ctx.users.coordinator.id, startSiteId: site.id, createdById: ctx.users.coordinator.id, notes: 'Morning run; the ward asked for arrival before ten.' },
    { transaction },
  );
  await stopsFor(ctx, delivered, await inState('delivered'), {
    packedAt: daysFrom(today, -10),
    deliveredAt: daysFrom(today, -9),
    signers: ['Nurse on the front desk', 'Reception, Kestrel Rise'],
  });

  const planned = await Run.create(
    { runDate: isoDay(daysFrom(today, 3)), driverId: ctx.users.organiser.id, startSiteId: site.id, createdById: ctx.users.coordinator.id, notes: 'Use the side entrance at the newborn unit.' },
    { transaction },
  );
  await stopsFor(ctx, planned, await inState('packed'), { packedAt: daysFrom(today, -1) });

  // A history of exports for the Exports page. The demo keeps no files, so downloading one of these asks
  // for the manifest to be made again (410), as for any file cleared from the export folder.
  const past = [
    { days: -10, title: `Delivery run of ${delivered.runDate}`, runId: delivered.id, rows: (await inState('delivered')).length },
    { days: -1, title: `Delivery run of ${planned.runDate}`, runId: planned.id, rows: (await inState('packed')).length },
  ];
  for (const [i, p] of past.entries()) {
    const made = await Export.create(
      {
        kind: 'run',
        runId: p.runId,
        recipientId: null,
        title: p.title,
        fileName: `kindloop-run-${p.runId}-demo-${i + 1}.csv`,
        bytes: 400 + p.rows * 160,
        rows: p.rows,
        bom: i === 0,
        createdById: ctx.users.coordinator.id,
      },
      { transaction },
    );
    await Export.update({ createdAt: daysFrom(today, p.days) }, { where: { id: made.id }, transaction, silent: true });
  }
  ctx.ids.runs = [delivered.id, planned.id];
});
