import { Op } from 'sequelize';
import { Assignment } from '../models/assignment';
import { Blanket } from '../models/blanket';
import { BlanketEvent } from '../models/blanket-event';
import { Need } from '../models/need';
import { Pledge } from '../models/pledge';
import { Recipient } from '../models/recipient';
import { Site } from '../models/site';
import { addSeedStep } from './demo';
import { daysFrom, isoDay, type SeedContext } from './seed-context';
import { uniqueBlanketCode } from '../../modules/blankets/blanket-code';
import type { BodyStitch, Feature, Fibre, SizeCategory } from '@shared/schemas/blanket';

/**
 * The assignment board's part of the demo. First, the blankets already past "checked" get the
 * record the board would have made. Then a Saturday's worth of checked blankets waits at the sites:
 * some pledged for a need, some for "wherever needed most", lap blankets that three recipients would
 * take, and a few that no recipient takes as they are, so a suggestion on a fresh demo places a few
 * dozen, leaves needs short and blankets over. Every colour and note here is invented.
 */

type NeedWithRecipient = Need & { recipient: Recipient };

interface Waiting {
  /** The need it was pledged for, by recipient kind and size; null for "wherever needed most". */
  pledgedFor: { kind: string; size: SizeCategory } | null;
  /** Measured at intake, in cm. */
  size: [number, number];
  yarnWeight: number;
  colours: string[];
  bodyStitch: BodyStitch;
  fibres?: Fibre[];
  features?: Feature[];
  count: number;
  /**
   * Set for the few no recipient takes: they passed the table's checklist (well made, clean), and
   * the organiser recorded why they were kept, as the inspection asks when it goes against the check.
   */
  keptBecause?: string;
}

const WAITING: Waiting[] = [
  { pledgedFor: { kind: 'neonatal-unit', size: 'preemie' }, size: [45, 47], yarnWeight: 3, colours: ['pale mint', 'soft cream', 'pale lilac', 'buttermilk', 'pale peach'], bodyStitch: 'sc', count: 7 },
  { pledgedFor: null, size: [44, 46], yarnWeight: 2, colours: ['white', 'pale blue', 'soft grey'], bodyStitch: 'hdc', count: 4 },
  { pledgedFor: { kind: 'family-shelter', size: 'baby' }, size: [75, 78], yarnWeight: 4, colours: ['sunny yellow', 'sky blue', 'sage green'], bodyStitch: 'ripple', count: 4 },
  { pledgedFor: { kind: 'family-shelter', size: 'crib' }, size: [77, 92], yarnWeight: 4, colours: ['oatmeal and rose', 'duck-egg blue', 'coral'], bodyStitch: 'granny', count: 5 },
  { pledgedFor: { kind: 'childrens-ward', size: 'child' }, size: [101, 139], yarnWeight: 4, colours: ['bright rainbow stripes', 'red and yellow squares', 'bright teal'], bodyStitch: 'granny', count: 6 },
  // Lap blankets fit the ward, both care homes and the hospice: the solver decides where they help most.
  { pledgedFor: { kind: 'care-home', size: 'lap' }, size: [90, 121], yarnWeight: 4, colours: ['warm rust', 'calm heather', 'moss green', 'warm plum'], bodyStitch: 'moss', count: 8 },
  { pledgedFor: null, size: [92, 120], yarnWeight: 4, colours: ['charcoal', 'navy and cream', 'dusky rose', 'warm ochre', 'soft lavender', 'bright orange'], bodyStitch: 'hdc', count: 12 },
  { pledgedFor: { kind: 'hospice', size: 'throw' }, size: [127, 150], yarnWeight: 5, colours: ['soft lavender', 'gentle sea green'], bodyStitch: 'shell', count: 3 },
  // Fits no one as it is: only the newborn unit takes this size, and it refuses mohair, which sheds.
  { pledgedFor: null, size: [46, 46], yarnWeight: 3, colours: ['cloud white mohair'], bodyStitch: 'knit-garter', fibres: ['mohair'], count: 2, keptBecause: 'Beautifully made; none of our units takes mohair, so we will look for a home for it outside the usual list' },
  // A long narrow wrap: no unit's size span holds it.
  { pledgedFor: null, size: [40, 170], yarnWeight: 4, colours: ['striped autumn wrap'], bodyStitch: 'dc', count: 1, keptBecause: 'Well made but an odd shape; kept while we ask around for someone who wants a wrap' },
  // Pompoms on a preemie-sized blanket: the newborn unit takes nothing that can come off.
  { pledgedFor: null, size: [45, 46], yarnWeight: 3, colours: ['pink with pompoms'], bodyStitch: 'dc', features: ['pompoms'], count: 1, keptBecause: 'The maker may take the pompoms off; kept here until she can collect it' },
];

async function recordEarlierAssignments(ctx: SeedContext) {
  const { transaction } = ctx;
  const given = await Blanket.findAll({
    where: { status: { [Op.in]: ['assigned', 'packed', 'delivered'] } },
    include: [{ model: Pledge, as: 'pledge', include: [{ model: Need, as: 'need' }] }],
    transaction,
  });
  for (const b of given as Array<Blanket & { pledge?: Pledge & { need?: Need | null } }>) {
    const need = b.pledge?.need;
    if (!need) continue;
    const step = await BlanketEvent.findOne({ where: { blanketId: b.id, toStatus: 'assigned' }, order: [['id', 'ASC']], transaction });
    await Assignment.create(
      {
        blanketId: b.id,
        needId: need.id,
        recipientId: need.recipientId,
        assignedById: step?.actorId ?? ctx.users.organiser.id,
        assignedAt: step?.createdAt ?? ctx.today,
        priorRecipientId: b.recipientId ?? null,
        source: 'board',
      },
      { transaction },
    );
    if (step) await step.update({ kind: 'assignment', data: { needId: need.id, recipientId: need.recipientId, source: 'board' } as BlanketEvent['data'] }, { transaction, silent: true });
  }
}

async function addWaitingBlankets(ctx: SeedContext) {
  const { transaction, today } = ctx;
  const needs = (await Need.findAll({ include: [{ model: Recipient, as: 'recipient' }], order: [['id', 'ASC']], transaction })) as NeedWithRecipient[];
  const sites = await Site.findAll({ order: [['id', 'ASC']], transaction });
  // Not the demo volunteer, whose pages are written around her three blankets, nor Oona, whose two
  // pledges show a cancelled one and one for wherever needed.
  const makers = ctx.users.volunteers.filter((u) => u.id !== ctx.users.volunteer.id && u.email !== 'oona@example.org');
  const organiser = ctx.users.organiser;
  let k = 0;
  for (const w of WAITING) {
    const need = w.pledgedFor ? (needs.find((n) => n.recipient.kind === w.pledgedFor!.kind && n.sizeCategory === w.pledgedFor!.size) ?? null) : null;
    for (let i = 0; i < w.count; i++, k++) {
      const maker = makers[(k * 5 + 3) % makers.length]!;
      const pledge = await Pledge.create(
        { userId: maker.id, needId: need?.id ?? null, quantity: 1, sizeCategory: w.pledgedFor?.size ?? 'lap', dueDate: isoDay(daysFrom(today, 10 + (k % 20))), status: 'fulfilled' },
        { transaction },
      );
      const loggedAt = daysFrom(today, -(14 + (k % 9)));
      // Promised a few weeks before it was logged (Sequelize stamps createdAt with now).
      await Pledge.update({ createdAt: daysFrom(loggedAt, -(7 + (k % 14))) }, { where: { id: pledge.id }, transaction, silent: true });
      const at = (step: number) => new Date(loggedAt.getTime() + step * 86_400_000);
      // Handmade sizes wander a centimetre or two from one blanket to the next.
      const jitter = ((k * 7) % 5) - 2;
      const [width, length] = [w.size[0] + jitter, w.size[1] - jitter];
      const b = await Blanket.create(
        {
          code: await uniqueBlanketCode(transaction),
          userId: maker.id,
          pledgeId: pledge.id,
          recipientId: need?.recipientId ?? null,
          siteId: sites[k % sites.length]?.id ?? null,
          status: 'checked',
          widthCm: width + 1,
          lengthCm: length + 1,
          measuredWidthCm: width,
          measuredLengthCm: length,
          yarnWeight: w.yarnWeight,
          fibres: w.fibres ?? ['acrylic'],
          features: w.features ?? [],
          machineWashable: true,
          dryerSafe: true,
          smokeFree: true,
          petFree: true,
          newYarn: true,
          colours: w.colours[i % w.colours.length]!,
          bodyStitch: w.bodyStitch,
          receivedAt: at(3),
        },
        { transaction },
      );
      const steps: Array<[string | null, string, string, number, number]> = [
        [null, 'in_progress', 'logged', maker.id, 0],
        ['in_progress', 'finished', 'status', maker.id, 1],
        ['finished', 'booked', 'status', maker.id, 2],
        ['booked', 'received', 'intake', organiser.id, 3],
        ['received', 'checked', 'inspection', organiser.id, 3],
      ];
      for (const [fromStatus, toStatus, kind, actorId, day] of steps) {
        const kept = kind === 'inspection' && w.keptBecause;
        const ev = await BlanketEvent.create(
          {
            blanketId: b.id,
            actorId,
            kind,
            fromStatus: fromStatus as never,
            toStatus: toStatus as never,
            reason: kept ? w.keptBecause! : null,
            data: (kept ? { outcome: 'checked', overridden: true } : null) as BlanketEvent['data'],
          },
          { transaction },
        );
        await BlanketEvent.update({ createdAt: at(day) }, { where: { id: ev.id }, transaction, silent: true });
      }
      await Blanket.update({ createdAt: loggedAt, updatedAt: at(3) }, { where: { id: b.id }, transaction, silent: true });
    }
  }
}

addSeedStep(async (ctx) => {
  await recordEarlierAssignments(ctx);
  await addWaitingBlankets(ctx);
});
