import { Op } from 'sequelize';
import { Need } from '../models/need';
import { Recipient } from '../models/recipient';
import { Site } from '../models/site';
import { Pledge } from '../models/pledge';
import { Blanket } from '../models/blanket';
import { BlanketEvent } from '../models/blanket-event';
import type { User } from '../models/user';
import { addSeedStep } from './demo';
import { daysFrom, isoDay, type SeedContext } from './seed-context';
import { uniqueBlanketCode } from '../../modules/blankets/blanket-code';
import { guidelinesOf } from '../../modules/pledges/recipient-brief';
import { MAIN_LINE, findMove } from '@shared/blankets/status';
import { sizeCategoryRow } from '@shared/guidelines/size-categories';
import type { BlanketStatus, BodyStitch, Feature, Fibre, SizeCategory } from '@shared/schemas/blanket';
import type { PledgeStatus } from '@shared/schemas/pledge';

/**
 * The volunteers' side of the demo: pledges against the recipients' needs, and blankets at every
 * stage from the hook to the recipient. The demo volunteer (Wren) has two pledges, one of them
 * late, and three blankets at different stages. Every name and colour here is invented.
 */

type NeedWithRecipient = Need & { recipient: Recipient };

interface BlanketPlan {
  status: BlanketStatus;
  colours: string;
  bodyStitch: BodyStitch;
  /** Changes to a blanket that meets the recipient's guidelines, to show what the check catches. */
  tweak?: Partial<{ yarnWeight: number; fibres: Fibre[]; features: Feature[]; smokeFree: boolean; petFree: boolean }>;
  borderId?: string;
  labelName?: 'first-name' | 'anonymous';
  notes?: string;
  /** The reason recorded on the step into needs_fix or declined. */
  because?: string;
  /** Days ago it was logged; each later step is a day or two after the one before. */
  loggedDaysAgo: number;
}

interface PledgePlan {
  maker: string;
  /** Which need, by recipient kind and size; null for "wherever it's needed most". */
  need: { kind: string; size: SizeCategory } | null;
  size: SizeCategory;
  quantity: number;
  dueInDays: number;
  status?: PledgeStatus;
  blankets: BlanketPlan[];
}

const PLEDGES: PledgePlan[] = [
  // The demo volunteer: one pledge on track with a checked and an in-progress blanket, one late.
  {
    maker: 'volunteer@example.org',
    need: { kind: 'neonatal-unit', size: 'preemie' },
    size: 'preemie',
    quantity: 2,
    dueInDays: 14,
    blankets: [
      { status: 'checked', colours: 'pale mint and cream', bodyStitch: 'hdc', borderId: 'crab-stitch-edge', loggedDaysAgo: 20 },
      {
        status: 'in_progress',
        colours: 'soft lemon',
        bodyStitch: 'sc',
        // Worsted is heavier than the unit takes: the self-check says so while there is time to change yarn.
        tweak: { yarnWeight: 4 },
        notes: 'Half way; trying a worsted I had in the cupboard.',
        loggedDaysAgo: 3,
      },
    ],
  },
  {
    maker: 'volunteer@example.org',
    need: { kind: 'care-home', size: 'lap' },
    size: 'lap',
    quantity: 2,
    dueInDays: -4,
    blankets: [{ status: 'booked', colours: 'heather and oat stripes', bodyStitch: 'moss', borderId: 'plain-hdc-round', loggedDaysAgo: 9 }],
  },

  {
    maker: 'maren@example.org',
    need: { kind: 'childrens-ward', size: 'child' },
    size: 'child',
    quantity: 3,
    dueInDays: 30,
    blankets: [
      { status: 'delivered', colours: 'rainbow granny squares', bodyStitch: 'granny', loggedDaysAgo: 34 },
      { status: 'packed', colours: 'teal and orange stripes', bodyStitch: 'dc', loggedDaysAgo: 22 },
      { status: 'assigned', colours: 'bright red with a yellow border', bodyStitch: 'hdc', borderId: 'five-dc-shell', loggedDaysAgo: 15 },
    ],
  },
  {
    maker: 'tobias@example.org',
    need: { kind: 'family-shelter', size: 'baby' },
    size: 'baby',
    quantity: 2,
    dueInDays: 10,
    blankets: [
      { status: 'received', colours: 'sky blue', bodyStitch: 'ripple', loggedDaysAgo: 8 },
      {
        status: 'needs_fix',
        colours: 'sage green with a cream fringe',
        bodyStitch: 'dc',
        tweak: { features: ['fringe'] },
        because: 'Fringe on a baby blanket: take it off and finish the edge with a round of single crochet.',
        loggedDaysAgo: 12,
      },
    ],
  },
  {
    maker: 'ines@example.org',
    need: null,
    size: 'lap',
    quantity: 1,
    dueInDays: 25,
    blankets: [{ status: 'finished', colours: 'charcoal and silver', bodyStitch: 'knit-garter', labelName: 'anonymous', loggedDaysAgo: 2 }],
  },
  {
    maker: 'priya@example.org',
    need: { kind: 'hospice', size: 'lap' },
    size: 'lap',
    quantity: 4,
    dueInDays: 12,
    blankets: [
      { status: 'delivered', colours: 'lavender', bodyStitch: 'shell', borderId: 'picot-tipped-shell', loggedDaysAgo: 30 },
      { status: 'delivered', colours: 'dusky rose', bodyStitch: 'shell', loggedDaysAgo: 28 },
    ],
  },
  {
    maker: 'lucia@example.org',
    need: { kind: 'hospice', size: 'lap' },
    size: 'lap',
    // With Priya's four this promises more than the hospice asked for: the coordinator sees it.
    quantity: 8,
    dueInDays: 20,
    blankets: [{ status: 'in_progress', colours: 'forest green', bodyStitch: 'moss', loggedDaysAgo: 5 }],
  },
  {
    maker: 'agnes@example.org',
    need: { kind: 'neonatal-unit', size: 'preemie' },
    size: 'preemie',
    quantity: 5,
    dueInDays: 21,
    blankets: [
      { status: 'booked', colours: 'white', bodyStitch: 'sc', loggedDaysAgo: 6 },
      { status: 'finished', colours: 'pale peach', bodyStitch: 'hdc', loggedDaysAgo: 4 },
    ],
  },
  {
    maker: 'dev@example.org',
    need: { kind: 'hospice', size: 'throw' },
    size: 'throw',
    quantity: 2,
    dueInDays: 45,
    blankets: [
      {
        status: 'declined',
        colours: 'navy and mustard',
        bodyStitch: 'granny',
        tweak: { smokeFree: false },
        because: 'Smells strongly of smoke after washing; the hospice takes blankets from smoke-free homes only.',
        loggedDaysAgo: 18,
      },
    ],
  },
  {
    maker: 'rosalind@example.org',
    need: { kind: 'care-home', size: 'lap' },
    size: 'lap',
    quantity: 3,
    dueInDays: 16,
    blankets: [{ status: 'checked', colours: 'warm rust and cream', bodyStitch: 'ripple', loggedDaysAgo: 11 }],
  },
  { maker: 'samir@example.org', need: { kind: 'family-shelter', size: 'crib' }, size: 'crib', quantity: 2, dueInDays: 35, blankets: [] },
  {
    maker: 'hattie@example.org',
    need: { kind: 'neonatal-unit', size: 'preemie' },
    size: 'preemie',
    quantity: 10,
    dueInDays: 28,
    blankets: [
      { status: 'received', colours: 'duck-egg blue', bodyStitch: 'sc', loggedDaysAgo: 10 },
      { status: 'booked', colours: 'buttermilk', bodyStitch: 'hdc', loggedDaysAgo: 7 },
      { status: 'finished', colours: 'pale lilac', bodyStitch: 'sc', loggedDaysAgo: 3 },
    ],
  },
  { maker: 'oona@example.org', need: { kind: 'care-home', size: 'lap' }, size: 'lap', quantity: 2, dueInDays: 30, status: 'cancelled', blankets: [] },
  { maker: 'oona@example.org', need: null, size: 'throw', quantity: 1, dueInDays: 40, blankets: [] },
  // Late with nothing logged yet: the volunteer sees "late" and a push-back button.
  { maker: 'felix@example.org', need: { kind: 'childrens-ward', size: 'lap' }, size: 'lap', quantity: 2, dueInDays: -6, blankets: [] },
];

/** The steps from in_progress to `status`, each one an allowed move. */
function pathTo(status: BlanketStatus): BlanketStatus[] {
  if (status === 'needs_fix' || status === 'declined') return [...pathTo('received'), status];
  const at = MAIN_LINE.indexOf(status);
  return MAIN_LINE.slice(0, at + 1);
}

function fieldsFor(size: SizeCategory, need: NeedWithRecipient | null, tweak: BlanketPlan['tweak'] = {}) {
  const row = sizeCategoryRow(size);
  const g = need ? guidelinesOf(need.recipient) : null;
  const weights = g?.yarnWeights ?? [4];
  const yarnWeight = weights.includes(3) ? 3 : weights.includes(4) ? 4 : weights[0]!;
  return {
    // Handmade blankets come out a little off the nominal size: a centimetre or two either way.
    widthCm: Math.round(row.nominalCm.width) - 1,
    lengthCm: Math.round(row.nominalCm.length) + 2,
    yarnWeight,
    fibres: ['acrylic'] as Fibre[],
    features: [] as Feature[],
    machineWashable: true,
    dryerSafe: true,
    smokeFree: true,
    petFree: true,
    newYarn: true,
    ...tweak,
  };
}

function moverFor(from: BlanketStatus, to: BlanketStatus, maker: User, ctx: SeedContext): User {
  const move = findMove(from, to);
  if (!move) throw new Error(`The demo plans an impossible move ${from} → ${to}`);
  if (move.by.includes('maker')) return maker;
  // The demo's delivered run was driven and recorded by the coordinator.
  if (move.via === 'delivery') return ctx.users.coordinator;
  return move.by.includes('organiser') ? ctx.users.organiser : ctx.users.coordinator;
}

addSeedStep(async (ctx) => {
  const { transaction, today } = ctx;
  const makers = new Map(ctx.users.volunteers.map((u) => [u.email, u]));
  // Read the needs back rather than trusting ids: the recipients step may have shaped them differently.
  const needs = (await Need.findAll({
    where: ctx.ids.needs ? { id: { [Op.in]: ctx.ids.needs } } : {},
    include: [{ model: Recipient, as: 'recipient' }],
    order: [['id', 'ASC']],
    transaction,
  })) as NeedWithRecipient[];
  const site = await Site.findOne({ where: ctx.ids.sites?.[0] ? { id: ctx.ids.sites[0] } : {}, order: [['id', 'ASC']], transaction });

  const pledgeIds: number[] = [];
  const blanketIds: number[] = [];
  for (const plan of PLEDGES) {
    const maker = makers.get(plan.maker);
    if (!maker) continue;
    const need = plan.need ? (needs.find((n) => n.recipient.kind === plan.need!.kind && n.sizeCategory === plan.need!.size) ?? null) : null;
    const finished = plan.blankets.filter((b) => b.status !== 'in_progress' && b.status !== 'declined').length;
    const pledge = await Pledge.create(
      {
        userId: maker.id,
        needId: need?.id ?? null,
        quantity: plan.quantity,
        sizeCategory: plan.size,
        dueDate: isoDay(daysFrom(today, plan.dueInDays)),
        status: plan.status ?? (finished >= plan.quantity ? 'fulfilled' : 'active'),
      },
      { transaction },
    );
    pledgeIds.push(pledge.id);
    // A promise comes before its blankets: a week before the first one was logged, or a few weeks
    // ago for a pledge with nothing logged yet (Sequelize stamps createdAt with now).
    const firstLogged = Math.max(0, ...plan.blankets.map((b) => b.loggedDaysAgo));
    const pledgedAt = daysFrom(today, -(firstLogged > 0 ? firstLogged + 7 : 10 + (pledgeIds.length % 15)));
    await Pledge.update({ createdAt: pledgedAt }, { where: { id: pledge.id }, transaction, silent: true });

    for (const b of plan.blankets) {
      const steps = pathTo(b.status);
      const loggedAt = daysFrom(today, -b.loggedDaysAgo);
      const at = (i: number) => new Date(loggedAt.getTime() + i * 1.5 * 86_400_000);
      const received = steps.indexOf('received');
      const row = await Blanket.create(
        {
          code: await uniqueBlanketCode(transaction),
          userId: maker.id,
          pledgeId: pledge.id,
          recipientId: need?.recipientId ?? null,
          siteId: steps.includes('booked') ? (site?.id ?? null) : null,
          status: b.status,
          ...fieldsFor(plan.size, need, b.tweak),
          colours: b.colours,
          bodyStitch: b.bodyStitch,
          borderId: b.borderId ?? null,
          labelName: b.labelName ?? 'first-name',
          notes: b.notes ?? '',
          receivedAt: received >= 0 ? at(received) : null,
        },
        { transaction },
      );
      blanketIds.push(row.id);
      const events = [
        { kind: 'logged', fromStatus: null, toStatus: 'in_progress', actorId: maker.id, reason: null, createdAt: at(0) },
        ...steps.slice(1).map((to, i) => ({
          kind: 'status',
          fromStatus: steps[i]!,
          toStatus: to,
          actorId: moverFor(steps[i]!, to, maker, ctx).id,
          reason: to === 'needs_fix' || to === 'declined' ? (b.because ?? null) : null,
          createdAt: at(i + 1),
        })),
      ];
      for (const e of events) {
        const ev = await BlanketEvent.create({ blanketId: row.id, ...e, data: null as BlanketEvent['data'] }, { transaction });
        // Sequelize stamps createdAt with now; the demo history needs it back-dated.
        await BlanketEvent.update({ createdAt: e.createdAt }, { where: { id: ev.id }, transaction, silent: true });
      }
      await Blanket.update({ createdAt: loggedAt, updatedAt: at(steps.length - 1) }, { where: { id: row.id }, transaction, silent: true });
    }
  }
  ctx.ids.pledges = pledgeIds;
  ctx.ids.blankets = blanketIds;
});
