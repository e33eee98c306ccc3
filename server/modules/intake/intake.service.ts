import { DateTime } from 'luxon';
import { Op, literal, where as sqlWhere, type FindOptions, type Sequelize, type Transaction } from 'sequelize';
import QRCode from 'qrcode';
import { Blanket } from '../../db/models/blanket';
import { BlanketEvent } from '../../db/models/blanket-event';
import { moveBlanket } from '../blankets/move-blanket';
import { Recipient } from '../../db/models/recipient';
import { Site } from '../../db/models/site';
import { User } from '../../db/models/user';
import { findAllPlain } from '../../db/plain-rows';
import { HttpError, notFound } from '../../lib/http-error';
import { blanketNeedsFixMail } from '../../mail/templates';
import { sizeCategoryFor } from '@shared/guidelines/size-categories';
import { fieldsForCheck, sizeOnRecord, type BlanketFields, type BlanketStatus } from '@shared/schemas/blanket';
import type { IntakeBody, IntakeQueueQuery, InspectionBody } from '@shared/schemas/intake';
import { CHECKLIST_ITEMS, RECEIVABLE_STATUSES, suggestOutcome, OUTCOME_LABELS } from '@shared/intake/rules';
import type { BlanketTag, BookedArrival, IntakeBlanketView, IntakeQueue, IntakeQueueItem } from '@shared/schemas/intake-views';
import { maySee, readsAll, type Actor } from '../../auth/actor';
import { checkAgainst, type CheckAnswer } from '../guidelines/guidelines.service';
import { eventView } from '../blankets/blankets.service';
import { driveNow } from '../bookings/drive-clock';
import { siteDay } from '../bookings/bookings.service';

const INCLUDE = [
  { model: User, as: 'maker' },
  { model: Recipient, as: 'recipient' },
  { model: Site, as: 'site' },
];

type LoadedBlanket = Blanket & { maker?: User; recipient?: Recipient | null; site?: Site | null };

/** The name on the tag and the manifest: the maker's first name, or "Anonymous" if they chose that. */
export function makerLabel(b: Pick<Blanket, 'labelName'>, maker: Pick<User, 'name'> | undefined): string {
  if (b.labelName === 'anonymous' || !maker) return 'Anonymous';
  return maker.name.trim().split(/\s+/)[0] ?? 'Anonymous';
}

async function historyOf(blanketId: number, transaction?: Transaction) {
  const events = await BlanketEvent.findAll({
    where: { blanketId },
    include: [{ model: User, as: 'actor', attributes: ['id', 'name'] }],
    order: [['createdAt', 'ASC'], ['id', 'ASC']],
    transaction,
  });
  return events.map((e) => eventView(e as BlanketEvent & { actor?: User | null }));
}

async function view(b: LoadedBlanket, transaction?: Transaction): Promise<IntakeBlanketView> {
  return {
    id: b.id,
    code: b.code,
    status: b.status,
    version: b.version,
    ...sizeOnRecord(b),
    logged: { widthCm: b.widthCm, lengthCm: b.lengthCm },
    yarnWeight: b.yarnWeight,
    fibres: b.fibres,
    features: b.features ?? [],
    colours: b.colours,
    bodyStitch: b.bodyStitch,
    machineWashable: b.machineWashable,
    dryerSafe: b.dryerSafe,
    smokeFree: b.smokeFree,
    petFree: b.petFree,
    newYarn: b.newYarn,
    notes: b.notes,
    sizeCategory: sizeCategoryFor(sizeOnRecord(b).widthCm, sizeOnRecord(b).lengthCm),
    receivedAt: b.receivedAt ? b.receivedAt.toISOString() : null,
    maker: { id: b.maker?.id ?? b.userId, name: b.maker?.name ?? '', label: makerLabel(b, b.maker) },
    recipient: b.recipient ? { id: b.recipient.id, name: b.recipient.name, population: b.recipient.population } : null,
    site: b.site ? { id: b.site.id, name: b.site.name } : null,
    history: await historyOf(b.id, transaction),
  };
}

async function load(where: { id: number } | { code: string }, transaction?: Transaction): Promise<LoadedBlanket> {
  const b = (await Blanket.findOne({ where, include: INCLUDE, transaction })) as LoadedBlanket | null;
  if (!b) throw notFound('That blanket');
  return b;
}

function checkVersion(b: Blanket, sent: number | undefined) {
  if (sent !== undefined && sent !== b.version) {
    throw new HttpError(409, `Someone else changed blanket ${b.code} since you opened it; reload and try again`, [
      { path: 'version', message: `You had version ${sent}; it is now ${b.version}` },
    ]);
  }
}

/** A size corrected at the table is a measurement: it goes beside the logged size, never over it. */
function correctionsOnRecord(corrections: Partial<BlanketFields> | undefined): Record<string, unknown> {
  const { widthCm, lengthCm, ...rest } = corrections ?? {};
  return {
    ...rest,
    ...(widthCm !== undefined ? { measuredWidthCm: widthCm } : {}),
    ...(lengthCm !== undefined ? { measuredLengthCm: lengthCm } : {}),
  };
}

export interface BlanketWithCheck {
  blanket: IntakeBlanketView;
  /** The guideline check against where it is meant to go, when it has a recipient. */
  check: CheckAnswer | null;
}

async function withCheck(b: LoadedBlanket): Promise<BlanketWithCheck> {
  const check = b.recipientId ? await checkAgainst(b.recipientId, fieldsForCheck(b)) : null;
  return { blanket: await view(b), check };
}

export async function findByCode(code: string): Promise<BlanketWithCheck> {
  return withCheck(await load({ code }));
}

export async function findById(id: number): Promise<BlanketWithCheck> {
  return withCheck(await load({ id }));
}

const RECEIVABLE_TEXT = RECEIVABLE_STATUSES.join(', ');

export async function receive(sequelize: Sequelize, id: number, input: IntakeBody, actor: Actor): Promise<BlanketWithCheck> {
  await sequelize.transaction(async (transaction) => {
    const b = await load({ id }, transaction);
    checkVersion(b, input.version);
    if (!(RECEIVABLE_STATUSES as readonly string[]).includes(b.status)) {
      const where = b.site ? ` at ${b.site.name}` : '';
      const message =
        b.status === 'received'
          ? `Blanket ${b.code} was already received${where}${b.receivedAt ? ` on ${b.receivedAt.toISOString().slice(0, 10)}` : ''}`
          : `Blanket ${b.code} is ${b.status.replace('_', ' ')}; only a blanket that is ${RECEIVABLE_TEXT} can be received`;
      throw new HttpError(409, message);
    }
    const site = await Site.findByPk(input.siteId, { transaction });
    if (!site) throw new HttpError(400, 'siteId: there is no such drop-off site', [{ path: 'siteId', message: 'No such drop-off site' }]);
    if (!site.active) {
      throw new HttpError(400, `siteId: ${site.name} is closed as a drop-off site`, [
        { path: 'siteId', message: `${site.name} is not taking blankets` },
      ]);
    }
    const logged = { widthCm: b.widthCm, lengthCm: b.lengthCm };
    await moveBlanket(
      {
        blanket: b,
        to: 'received',
        actor,
        via: 'intake',
        kind: 'intake',
        changes: { siteId: site.id, receivedAt: new Date(), measuredWidthCm: input.widthCm, measuredLengthCm: input.lengthCm },
        data: {
          siteId: site.id,
          siteName: site.name,
          logged,
          measured: { widthCm: input.widthCm, lengthCm: input.lengthCm },
          note: input.note ?? null,
        },
      },
      transaction,
    );
  });
  return findById(id);
}

function requireReason(reason: string | undefined, message: string) {
  if (reason && reason.length > 0) return;
  throw new HttpError(400, `overrideReason: ${message}`, [{ path: 'overrideReason', message }]);
}

export async function inspect(
  sequelize: Sequelize,
  id: number,
  input: InspectionBody,
  actor: Actor,
  appUrl: string,
): Promise<BlanketWithCheck> {
  await sequelize.transaction(async (transaction) => {
    const b = await load({ id }, transaction);
    checkVersion(b, input.version);
    if (b.status !== 'received') {
      throw new HttpError(409, `Blanket ${b.code} is ${b.status.replace('_', ' ')}; receive it at a drop-off site before inspecting it`);
    }
    const targetId = input.recipientId ?? b.recipientId;
    if (!targetId) {
      throw new HttpError(400, 'recipientId: this blanket has no recipient yet; choose one to check it against', [
        { path: 'recipientId', message: 'Choose the recipient to check it against' },
      ]);
    }

    const before = fieldsForCheck(b);
    const corrected: BlanketFields = { ...before, ...(input.corrections ?? {}) };
    const check = await checkAgainst(targetId, corrected, transaction).catch((e: unknown) => {
      if (e instanceof HttpError && e.status === 404) {
        throw new HttpError(400, 'recipientId: there is no such recipient', [{ path: 'recipientId', message: 'No such recipient' }]);
      }
      throw e;
    });
    const suggestion = suggestOutcome(input.checklist, check, check.guidelines);
    const chose = OUTCOME_LABELS[input.outcome].toLowerCase();
    const suggested = OUTCOME_LABELS[suggestion.outcome].toLowerCase();

    let finalRecipientId: number = targetId;
    let overridden = false;
    let redirectCheck: CheckAnswer | null = null;
    if (input.outcome === 'redirect') {
      const to = input.redirectRecipientId!;
      if (to === targetId) {
        throw new HttpError(400, 'redirectRecipientId: that is where it was meant to go already', [
          { path: 'redirectRecipientId', message: 'Choose a different recipient' },
        ]);
      }
      const other = await Recipient.findByPk(to, { transaction });
      if (!other || !other.active) {
        throw new HttpError(400, 'redirectRecipientId: there is no such active recipient', [
          { path: 'redirectRecipientId', message: 'No such active recipient' },
        ]);
      }
      redirectCheck = await checkAgainst(to, corrected, transaction);
      // Sending it where it fits as it is follows the check, whatever the first suggestion was,
      // unless the table found something wrong with the blanket itself.
      const physicalProblem = CHECKLIST_ITEMS.some((item) => item.key !== 'matchesLog' && !input.checklist[item.key]);
      if (!redirectCheck.ok) {
        overridden = true;
        requireReason(input.overrideReason, `${other.name}'s guidelines do not take it as it is; say why it should go there`);
      } else if (physicalProblem) {
        overridden = true;
        requireReason(input.overrideReason, `the check suggests "${suggested}" for what you found on the table; say why it can go as it is`);
      }
      finalRecipientId = to;
    } else if (input.outcome !== suggestion.outcome) {
      overridden = true;
      requireReason(input.overrideReason, `the check suggests "${suggested}"; say why you chose "${chose}"`);
    }

    const fixes = input.outcome === 'needs_fix' ? suggestion.fixes : [];
    if (input.outcome === 'needs_fix' && fixes.length === 0 && !input.fixNote) {
      throw new HttpError(400, 'fixNote: tell the maker what to fix', [
        { path: 'fixNote', message: 'The check found nothing to fix; tell the maker what needs doing' },
      ]);
    }

    const toStatus: BlanketStatus = input.outcome === 'redirect' ? 'checked' : input.outcome;
    const correctedFields: Partial<Record<keyof BlanketFields, { from: unknown; to: unknown }>> = {};
    for (const [key, value] of Object.entries(input.corrections ?? {}) as Array<[keyof BlanketFields, unknown]>) {
      correctedFields[key] = { from: before[key], to: value };
    }
    // The size on record once this inspection's corrections are kept: what the maker is told was measured.
    const measuredAfter = sizeOnRecord({
      widthCm: b.widthCm,
      lengthCm: b.lengthCm,
      measuredWidthCm: input.corrections?.widthCm ?? b.measuredWidthCm,
      measuredLengthCm: input.corrections?.lengthCm ?? b.measuredLengthCm,
    });
    const mail =
      input.outcome === 'needs_fix' && b.maker
        ? [
            {
              to: b.maker.email,
              ...blanketNeedsFixMail({
                name: b.maker.name.split(/\s+/)[0] ?? b.maker.name,
                code: b.code,
                blanketId: b.id,
                recipientName: check.recipient.name,
                fixes,
                note: input.fixNote,
                logged: { widthCm: b.widthCm, lengthCm: b.lengthCm },
                measured: measuredAfter.measured ? measuredAfter : null,
                appUrl,
              }),
            },
          ]
        : [];
    await moveBlanket(
      {
        blanket: b,
        to: toStatus,
        actor,
        via: 'intake',
        kind: 'inspection',
        // An override's reason is the move's reason; the machine itself asks none of a forward move.
        reason: input.overrideReason ?? null,
        changes: { ...correctionsOnRecord(input.corrections), recipientId: finalRecipientId },
        data: {
          checklist: input.checklist,
          corrections: correctedFields,
          check: {
            recipientId: check.recipient.id,
            recipientName: check.recipient.name,
            verdict: check.verdict,
            reasons: check.reasons,
            alsoFits: check.alsoFits,
          },
          suggested: { outcome: suggestion.outcome, redirectRecipientId: suggestion.redirectRecipientId },
          outcome: input.outcome,
          overridden,
          redirect:
            input.outcome === 'redirect'
              ? { fromRecipientId: targetId, toRecipientId: finalRecipientId, toName: redirectCheck?.recipient.name ?? null }
              : null,
          fixes,
          fixNote: input.fixNote ?? null,
          note: input.note ?? null,
        },
        mail,
      },
      transaction,
    );
  });
  return findById(id);
}

/** Where a day begins and ends in the drive's zone (not the server's): a day of 23 or 25 hours at a clock change. */
function dayBounds(isoDay: string, zone: string): [Date, Date] {
  const start = DateTime.fromISO(isoDay, { zone }).startOf('day');
  return [start.toJSDate(), start.plus({ days: 1 }).startOf('day').toJSDate()];
}

/** What a row of the queue reads of a blanket, as plain values (see findAllPlain). */
type QueueBlanket = Pick<Blanket, (typeof QUEUE_ATTRIBUTES)[number]> & {
  maker?: Pick<User, 'id' | 'name'> | null;
  recipient?: Pick<Recipient, 'id' | 'name'> | null;
};

function queueItem(b: QueueBlanket, at: Date | null, arrivedAs?: IntakeQueueItem['arrivedAs']): IntakeQueueItem {
  return {
    id: b.id,
    code: b.code,
    status: b.status,
    makerLabel: makerLabel(b, b.maker ?? undefined),
    recipientName: b.recipient?.name ?? null,
    widthCm: sizeOnRecord(b).widthCm,
    lengthCm: sizeOnRecord(b).lengthCm,
    sizeCategory: sizeCategoryFor(sizeOnRecord(b).widthCm, sizeOnRecord(b).lengthCm),
    at: at ? at.toISOString() : null,
    ...(arrivedAs ? { arrivedAs } : {}),
  };
}

const QUEUE_ATTRIBUTES = ['id', 'code', 'status', 'labelName', 'widthCm', 'lengthCm', 'measuredWidthCm', 'measuredLengthCm', 'receivedAt', 'siteId'] as const;
/** Enough of a blanket's maker, recipient and site for a row of the queue. */
const QUEUE_INCLUDE = [
  { model: User, as: 'maker', attributes: ['id', 'name'] },
  { model: Recipient, as: 'recipient', attributes: ['id', 'name'] },
];

/**
 * The queue at a site on a day: what arrived and what was inspected that day (bounded by the day),
 * and a page each of what waits for inspection and what is booked to come (these two grow with the
 * drive, so they come a page at a time with their totals).
 */
export async function queue(q: IntakeQueueQuery): Promise<IntakeQueue> {
  const { siteId, pageSize } = q;
  const site = await Site.findByPk(siteId, { attributes: ['id', 'name'] });
  if (!site) throw notFound('That drop-off site');
  const clock = await driveNow();
  // Without a day the queue is today's, the drive's today.
  const isoDay = q.date ?? clock.today;
  const [start, end] = dayBounds(isoDay, clock.zone);
  const inDay = { [Op.gte]: start, [Op.lt]: end };

  // SQLite reads the site out of the intake record itself, so the day's records are never parsed here;
  // inspections carry large records (the check) and only their time and blanket are needed.
  const intakeEvents = await BlanketEvent.findAll({
    attributes: ['id', 'blanketId', 'createdAt', 'fromStatus'],
    where: { kind: 'intake', createdAt: inDay, [Op.and]: [sqlWhere(literal("json_extract(`BlanketEvent`.`data`, '$.siteId')"), siteId)] },
    order: [['createdAt', 'ASC'], ['id', 'ASC']],
  });
  const inspectionEvents = await BlanketEvent.findAll({
    attributes: ['id', 'blanketId', 'createdAt'],
    where: { kind: 'inspection', createdAt: inDay },
    order: [['createdAt', 'ASC'], ['id', 'ASC']],
  });
  const dayIds = [...new Set([...intakeEvents, ...inspectionEvents].map((e) => e.blanketId))];
  // Rows of the queue are read as plain values: building model instances was most of its cost.
  const read = (options: FindOptions) => findAllPlain<QueueBlanket>(Blanket, { attributes: [...QUEUE_ATTRIBUTES], include: QUEUE_INCLUDE, ...options });
  const ofDay = dayIds.length ? await read({ where: { id: { [Op.in]: dayIds } } }) : [];
  const byId = new Map(ofDay.map((b) => [b.id, b]));

  const arrived: IntakeQueueItem[] = [];
  for (const e of intakeEvents) {
    const b = byId.get(e.blanketId);
    // A blanket received from "booked" came with its booking; from "finished", it walked in.
    if (b) arrived.push(queueItem(b, e.createdAt, e.fromStatus === 'booked' ? 'booked' : 'walk-in'));
  }
  const inspected: IntakeQueueItem[] = [];
  const seen = new Set<number>();
  // Latest inspection per blanket, and only those inspected while at this site.
  for (const e of [...inspectionEvents].reverse()) {
    const b = byId.get(e.blanketId);
    if (!b || b.siteId !== siteId || seen.has(b.id)) continue;
    seen.add(b.id);
    inspected.unshift(queueItem(b, e.createdAt));
  }

  const waitingWhere = { siteId, status: 'received', receivedAt: { [Op.lt]: end } };
  const expectedWhere = { siteId, status: 'booked' };
  const [waitingTotal, expectedTotal] = [await Blanket.count({ where: waitingWhere }), await Blanket.count({ where: expectedWhere })];
  const waiting = await read({
    where: waitingWhere,
    order: [['receivedAt', 'ASC'], ['id', 'ASC']],
    limit: pageSize,
    offset: (q.waitingPage - 1) * pageSize,
  });
  const expected = await read({
    where: expectedWhere,
    order: [['id', 'ASC']],
    limit: pageSize,
    offset: (q.expectedPage - 1) * pageSize,
  });
  // Cancelled visits are not coming; everything else booked for the day stands beside the walk-ins.
  const bookedArrivals: BookedArrival[] = (await siteDay(siteId, isoDay, clock.zone, clock.nowMs)).flatMap((v) =>
    v.arrival === 'cancelled'
      ? []
      : [{ bookingId: v.id, start: v.start, end: v.end, makerName: v.maker.name, blankets: v.blankets, arrival: v.arrival }],
  );
  return {
    site: { id: site.id, name: site.name },
    date: isoDay,
    timeZone: clock.zone,
    bookedArrivals,
    arrived,
    waiting: waiting.map((b) => queueItem(b, b.receivedAt ?? null)),
    waitingTotal,
    waitingPage: q.waitingPage,
    inspected,
    expected: expected.map((b) => queueItem(b, null)),
    expectedTotal,
    expectedPage: q.expectedPage,
    pageSize,
  };
}

export async function tags(ids: number[], actor: Actor, appUrl: string): Promise<BlanketTag[]> {
  const rows = (await Blanket.findAll({ where: { id: { [Op.in]: ids } }, include: INCLUDE })) as LoadedBlanket[];
  // A volunteer prints tags for their own blankets only; someone else's is "not found", not "forbidden".
  const visible = rows.filter((b) => maySee(actor, b.userId));
  const found = new Set(visible.map((b) => b.id));
  const missing = ids.filter((i) => !found.has(i));
  if (missing.length > 0) {
    // Someone else's blanket reads the same as one that does not exist: nothing about it is given away.
    const n = missing.length;
    const which = n === 1 ? 'One of these blankets is' : `${n} of these blankets are`;
    const where = readsAll(actor) ? 'no longer in the log' : 'not among yours';
    const message = `${which} ${where}, so there is no tag to print for ${n === 1 ? 'it' : 'them'}. Choose blankets from ${readsAll(actor) ? 'the blanket list' : 'My blankets'} to print their tags.`;
    throw new HttpError(404, message, [{ path: 'ids', message }]);
  }
  const byId = new Map(visible.map((b) => [b.id, b]));
  return Promise.all(
    ids.map(async (i) => {
      const b = byId.get(i)!;
      const link = `${appUrl}/organiser/intake?code=${encodeURIComponent(b.code)}`;
      const qrSvg = await QRCode.toString(link, { type: 'svg', errorCorrectionLevel: 'M', margin: 1 });
      return {
        id: b.id,
        code: b.code,
        makerLabel: makerLabel(b, b.maker),
        widthCm: sizeOnRecord(b).widthCm,
        lengthCm: sizeOnRecord(b).lengthCm,
        sizeCategory: sizeCategoryFor(sizeOnRecord(b).widthCm, sizeOnRecord(b).lengthCm),
        recipientName: b.recipient?.name ?? null,
        recipientPopulation: b.recipient?.population ?? null,
        link,
        qrSvg,
      };
    }),
  );
}
