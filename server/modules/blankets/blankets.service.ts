import { Op, col, fn, literal, where as sqlWhere, type Order, type Transaction, type WhereOptions } from 'sequelize';
import { Blanket } from '../../db/models/blanket';
import { BlanketEvent } from '../../db/models/blanket-event';
import { STEP_STATUSES } from '@shared/drive/glance';
import { DAY_MS, arrivalIn, localDayOf, needOfBlanket, zoneSpans } from '../drive/glance-sql';
import { driveZone } from '../bookings/drive-clock';
import { Photo } from '../../db/models/photo';
import { Pledge } from '../../db/models/pledge';
import { Need } from '../../db/models/need';
import { Plan } from '../../db/models/plan';
import { Recipient } from '../../db/models/recipient';
import { Site } from '../../db/models/site';
import { User } from '../../db/models/user';
import { findAllPlain } from '../../db/plain-rows';
import { HttpError, fieldError, notFound } from '../../lib/http-error';
import { maySee, readsAll, type Actor } from '../../auth/actor';
import { fieldsForCheck, type BlanketFields, type BlanketStatus } from '@shared/schemas/blanket';
import { findingsOf } from '@shared/intake/rules';
import {
  LOG_FIELDS,
  type BlanketCreate,
  type BlanketDetail,
  type BlanketEventView,
  type BlanketListQuery,
  type BlanketSort,
  type BlanketSummary,
  type BlanketUpdate,
  type InspectionFindings,
  type PhotoView,
} from '@shared/schemas/blanket-log';
import { isIntakeMove, isMakerEditable, moveChannel, movesFrom } from '@shared/blankets/status';
import { moveBlanket } from './move-blanket';
import { check, evaluate, type OtherRecipient } from '@shared/guidelines/check';
import { activeRecipients, guidelinesOf, recipientBrief } from '../pledges/recipient-brief';
import { pledgeTally, refreshPledgeStatus } from '../pledges/pledges.service';
import { placesLeft } from '@shared/pledges/rules';
import { uniqueBlanketCode } from './blanket-code';
import type { Page } from '@shared/schemas/page';

/** BlanketEvent.data is free-form JSON; the model's creation type can't say so. */
const eventData = (v: unknown) => v as BlanketEvent['data'];

type Loaded = Blanket & {
  maker?: User;
  recipient?: Recipient | null;
  pledge?: Pledge | null;
  photos?: Photo[];
  events?: Array<BlanketEvent & { actor?: User | null }>;
};

/** One step of a blanket's history as the blanket page and the intake table show it. */
export function eventView(e: BlanketEvent & { actor?: User | null }): BlanketEventView {
  return {
    id: e.id,
    kind: e.kind,
    fromStatus: (e.fromStatus as BlanketStatus | null) ?? null,
    toStatus: (e.toStatus as BlanketStatus | null) ?? null,
    reason: e.reason ?? null,
    data: e.data ?? null,
    createdAt: new Date(e.createdAt).toISOString(),
    actor: e.actor ? { id: e.actor.id, name: e.actor.name } : null,
  };
}

export function photoView(p: Photo): PhotoView {
  const url = `/api/blankets/${p.blanketId}/photos/${p.id}`;
  return {
    id: p.id,
    mime: p.mime,
    bytes: p.bytes,
    width: p.width ?? null,
    height: p.height ?? null,
    createdAt: new Date(p.createdAt).toISOString(),
    url,
    thumbUrl: `${url}?size=thumb`,
  };
}

/** The blanket if this person may see it: its maker, or anyone who reads every blanket. */
export async function visibleBlanket(actor: Actor, id: number, transaction?: Transaction): Promise<Blanket> {
  const b = await Blanket.findByPk(id, { transaction });
  if (!b || !maySee(actor, b.userId)) throw notFound('That blanket');
  return b;
}

const summaryInclude = [
  { model: User, as: 'maker', attributes: ['id', 'name'] },
  { model: Recipient, as: 'recipient' },
  { model: Pledge, as: 'pledge' },
  { model: Photo, as: 'photos' },
];

/** The columns a row of a blanket list shows (the rest of a blanket is read on its own page). */
const SUMMARY_ATTRIBUTES = ['id', 'code', 'status', 'userId', 'pledgeId', 'recipientId', 'widthCm', 'lengthCm', 'yarnWeight', 'colours', 'version', 'createdAt', 'updatedAt'] as const;
type SummaryRow = Pick<Blanket, (typeof SUMMARY_ATTRIBUTES)[number]> & {
  maker?: Pick<User, 'name'> | null;
  recipient?: Pick<Recipient, 'name'> | null;
  pledge?: Pick<Pledge, 'sizeCategory'> | null;
  photos?: Photo[];
};

function summaryOf(b: SummaryRow): BlanketSummary {
  const photos = [...(b.photos ?? [])].sort((x, y) => x.id - y.id);
  return {
    id: b.id,
    code: b.code,
    status: b.status,
    userId: b.userId,
    makerName: b.maker?.name ?? '',
    pledgeId: b.pledgeId ?? null,
    recipientId: b.recipientId ?? null,
    recipientName: b.recipient?.name ?? null,
    sizeCategory: b.pledge?.sizeCategory ?? null,
    widthCm: b.widthCm,
    lengthCm: b.lengthCm,
    yarnWeight: b.yarnWeight,
    colours: b.colours,
    photoCount: photos.length,
    coverPhoto: photos[0] ? photoView(photos[0]) : null,
    version: b.version,
    createdAt: new Date(b.createdAt).toISOString(),
    updatedAt: new Date(b.updatedAt).toISOString(),
  };
}

/** Sorting by status follows a blanket's life, the order the stepper shows, not the alphabet. */
export const STATUS_ORDER: readonly BlanketStatus[] = ['in_progress', 'finished', 'booked', 'received', 'needs_fix', 'declined', 'checked', 'assigned', 'packed', 'delivered'];

const statusRank = literal(`CASE \`Blanket\`.\`status\` ${STATUS_ORDER.map((st, i) => `WHEN '${st}' THEN ${i}`).join(' ')} END`);

function listOrder(sort: BlanketSort, dir: 'ASC' | 'DESC'): Order {
  // The id breaks ties, so a row never shows on two pages.
  switch (sort) {
    case 'createdAt':
      return [['createdAt', dir], ['id', dir]];
    case 'code':
      return [['code', dir]];
    case 'status':
      return [[statusRank, dir], ['id', 'DESC']];
    case 'recipient':
      return [[{ model: Recipient, as: 'recipient' }, 'name', dir], ['id', 'DESC']];
    case 'size':
      return [[literal('`Blanket`.`widthCm` * `Blanket`.`lengthCm`'), dir], ['id', 'DESC']];
    case 'maker':
      return [[{ model: User, as: 'maker' }, 'name', dir], ['id', 'DESC']];
    case 'colours':
      return [['colours', dir], ['id', 'DESC']];
  }
}

/** Case-blind "contains" without LIKE, so % and _ in a search are plain characters. */
const contains = (column: string, q: string) => sqlWhere(fn('instr', fn('lower', col(column)), q.toLowerCase()), Op.gt, 0);

/** One page of blankets: the maker's own, or everyone's for staff; filtered, searched and sorted here. */
export async function listBlankets(actor: Actor, q: BlanketListQuery): Promise<Page<BlanketSummary>> {
  const where: WhereOptions = {};
  if (!readsAll(actor) || q.mine) where.userId = actor.id;
  if (q.status) where.status = q.status;
  if (q.pledgeId) where.pledgeId = q.pledgeId;
  // The filters behind the figures of the drive at a glance, in the same SQL words it counts with.
  const and: unknown[] = [];
  if (q.step) and.push({ status: { [Op.in]: STEP_STATUSES[q.step] } });
  if (q.needId) and.push(sqlWhere(literal(needOfBlanket('`Blanket`.`id`', '`Blanket`.`pledgeId`')), Op.eq, q.needId));
  if (q.reached && q.from && q.to) {
    const from = Blanket.sequelize!.escape(q.from);
    const to = Blanket.sequelize!.escape(q.to);
    // Days in the drive's zone, as the glance's weeks count them; at most ten years of clock changes.
    const toMs = Date.parse(`${q.to}T00:00:00Z`) + 2 * DAY_MS;
    const spans = zoneSpans(await driveZone(), Math.max(Date.parse(`${q.from}T00:00:00Z`) - 2 * DAY_MS, toMs - 3653 * DAY_MS), toMs);
    const day = localDayOf('e.createdAt', spans);
    and.push(literal(`EXISTS (SELECT 1 FROM blanket_events e WHERE e.blanketId = \`Blanket\`.\`id\` AND ${arrivalIn(q.reached, 'e')} AND ${day} >= ${from} AND ${day} < ${to})`));
  }
  if (and.length) (where as Record<symbol, unknown>)[Op.and] = and;
  if (q.q) {
    (where as Record<symbol, unknown>)[Op.or] = [
      contains('Blanket.code', q.q),
      contains('Blanket.colours', q.q),
      contains('recipient.name', q.q),
      contains('maker.name', q.q),
    ];
  }
  const include = [
    { model: User, as: 'maker', attributes: ['id', 'name'] },
    { model: Recipient, as: 'recipient', attributes: ['id', 'name'] },
    { model: Pledge, as: 'pledge', attributes: ['id', 'sizeCategory'] },
  ];
  const dir = (q.dir ?? (q.sort === 'createdAt' ? 'desc' : 'asc')).toUpperCase() as 'ASC' | 'DESC';
  const total = await Blanket.count({ where, include: q.q ? include.slice(0, 2) : [] });
  // A page of a list is read as plain values: building model instances was most of what it cost.
  const rows = await findAllPlain<SummaryRow>(Blanket, {
    attributes: [...SUMMARY_ATTRIBUTES],
    where,
    include,
    order: listOrder(q.sort, dir),
    limit: q.pageSize,
    offset: (q.page - 1) * q.pageSize,
  });
  const photos = rows.length
    ? await Photo.findAll({ where: { blanketId: { [Op.in]: rows.map((b) => b.id) } }, order: [['id', 'ASC']] })
    : [];
  for (const b of rows) b.photos = photos.filter((p) => p.blanketId === b.id);
  return { items: rows.map(summaryOf), total, page: q.page, pageSize: q.pageSize };
}

/** The recipient's check, run on the logged fields; also which other recipients it would suit. */
export function selfCheckOf(fields: BlanketFields, recipient: Recipient | null | undefined, all: Recipient[]) {
  const others: OtherRecipient[] = all.map((r) => ({ recipientId: r.id, name: r.name, guidelines: guidelinesOf(r) }));
  if (recipient) {
    return { selfCheck: check(fields, guidelinesOf(recipient), others, { recipientId: recipient.id }), fitsRecipients: [] };
  }
  const fitsRecipients = others
    .filter((o) => evaluate(fields, o.guidelines).reasons.length === 0)
    .map((o) => ({ recipientId: o.recipientId, name: o.name }));
  return { selfCheck: null, fitsRecipients };
}

/** The shape an inspection's history entry keeps (see intake.service inspect()). */
interface InspectionData {
  outcome?: string;
  checklist?: Record<string, boolean>;
  check?: { recipientName?: string; reasons?: Array<{ message?: string }> };
  fixes?: string[];
  fixNote?: string | null;
}

/** While a blanket needs a fix or was declined, what the inspection that put it there found. */
function findingsFrom(status: BlanketStatus, events: BlanketEventView[]): InspectionFindings | null {
  if (status !== 'needs_fix' && status !== 'declined') return null;
  const last = [...events].reverse().find((e) => e.toStatus === status);
  if (!last) return null;
  if (last.kind !== 'inspection') {
    // A move made without the inspection form (older records, the demo's history) keeps only its reason.
    return { outcome: status, at: last.createdAt, recipientName: null, findings: last.reason ? [last.reason] : [], fixes: [], note: null };
  }
  const data = (last.data ?? {}) as InspectionData;
  const rules = (data.check?.reasons ?? []).map((r) => r.message).filter((m): m is string => typeof m === 'string');
  return {
    outcome: status,
    at: last.createdAt,
    recipientName: data.check?.recipientName ?? null,
    findings: findingsOf(data.checklist, rules),
    fixes: data.fixes ?? [],
    note: data.fixNote ?? null,
  };
}

export async function blanketDetail(actor: Actor, id: number, transaction?: Transaction): Promise<BlanketDetail> {
  await visibleBlanket(actor, id, transaction);
  const b = (await Blanket.findByPk(id, {
    include: [
      ...summaryInclude,
      { model: BlanketEvent, as: 'events', include: [{ model: User, as: 'actor', attributes: ['id', 'name'] }] },
    ],
    transaction,
  })) as Loaded;
  const isMaker = b.userId === actor.id;
  // The check reads what is on record: the size measured at the table where it was measured.
  const { selfCheck, fitsRecipients } = selfCheckOf(fieldsForCheck(b), b.recipient, await activeRecipients(transaction));
  const brief = b.recipient ? recipientBrief(b.recipient) : null;
  const events: BlanketEventView[] = [...(b.events ?? [])]
    .sort((x, y) => new Date(x.createdAt).getTime() - new Date(y.createdAt).getTime() || x.id - y.id)
    .map(eventView);
  return {
    ...summaryOf(b),
    measured: b.measuredWidthCm != null && b.measuredLengthCm != null ? { widthCm: b.measuredWidthCm, lengthCm: b.measuredLengthCm } : null,
    inspection: findingsFrom(b.status, events),
    fibres: b.fibres,
    features: b.features,
    bodyStitch: b.bodyStitch as BlanketDetail['bodyStitch'],
    borderId: b.borderId ?? null,
    planId: b.planId ?? null,
    siteId: b.siteId ?? null,
    machineWashable: b.machineWashable,
    dryerSafe: b.dryerSafe,
    smokeFree: b.smokeFree,
    petFree: b.petFree,
    newYarn: b.newYarn,
    labelName: b.labelName,
    notes: b.notes,
    receivedAt: b.receivedAt ? new Date(b.receivedAt).toISOString() : null,
    photos: [...(b.photos ?? [])].sort((x, y) => x.id - y.id).map(photoView),
    events,
    recipient: brief,
    selfCheck,
    fitsRecipients,
    cautions: brief?.cautions ?? [],
    // Receiving and inspecting happen on the intake page, where the check is recorded with them.
    moves: movesFrom(b.status, { role: actor.role, isMaker })
      .filter((m) => moveChannel(m) === 'plain')
      .map((m) => ({ to: m.to, direction: m.direction, action: m.action })),
    atIntake: movesFrom(b.status, { role: actor.role, isMaker }).some(isIntakeMove),
    editable: isMaker && isMakerEditable(b.status),
  };
}

async function checkPlan(actor: Actor, planId: number | null | undefined, transaction: Transaction) {
  if (planId === null || planId === undefined) return;
  const plan = await Plan.findOne({ where: { id: planId, userId: actor.id }, transaction });
  if (!plan) throw fieldError(400, 'planId', 'planId: that is not one of your saved plans');
}

export async function createBlanket(actor: Actor, body: BlanketCreate, transaction: Transaction): Promise<number> {
  const pledge = await Pledge.findByPk(body.pledgeId, { include: [{ model: Need, as: 'need' }], transaction });
  if (!pledge || pledge.userId !== actor.id) throw fieldError(404, 'pledgeId', 'pledgeId: that pledge was not found among yours');
  if (pledge.status === 'cancelled') throw fieldError(409, 'pledgeId', 'pledgeId: that pledge was cancelled; choose another one');
  const { logged } = await pledgeTally(pledge.id, transaction);
  if (placesLeft(pledge.quantity, { logged }) === 0) {
    throw fieldError(
      409,
      'pledgeId',
      `pledgeId: that pledge is for ${pledge.quantity} blanket(s) and ${logged} are logged; raise the pledge to log another`,
    );
  }
  await checkPlan(actor, body.planId, transaction);
  const { pledgeId: _pledgeId, status, ...fields } = body;
  const b = await Blanket.create(
    {
      ...fields,
      code: await uniqueBlanketCode(transaction),
      userId: actor.id,
      pledgeId: pledge.id,
      recipientId: pledge.need?.recipientId ?? null,
      status,
    },
    { transaction },
  );
  await BlanketEvent.create(
    { blanketId: b.id, actorId: actor.id, kind: 'logged', fromStatus: null, toStatus: status, reason: null, data: eventData(null) },
    { transaction },
  );
  await refreshPledgeStatus(pledge.id, transaction);
  return b.id;
}

export async function updateBlanket(actor: Actor, id: number, body: BlanketUpdate, transaction: Transaction): Promise<void> {
  const b = await visibleBlanket(actor, id, transaction);
  if (body.version !== undefined && body.version !== b.version) {
    throw new HttpError(409, 'Someone changed this blanket at the same time; reload it and try again', [
      { path: 'version', message: `You had version ${body.version}; it is now ${b.version}` },
    ]);
  }
  const isMaker = b.userId === actor.id;
  const sent = LOG_FIELDS.filter((f) => body[f] !== undefined);
  // A form sends every field; only the ones that differ are a correction worth recording.
  const changed = sent.filter((f) => JSON.stringify(b.get(f)) !== JSON.stringify(body[f]));
  const wantsSite = body.siteId !== undefined;
  if (body.reason !== undefined && body.status === undefined) {
    throw fieldError(400, 'reason', 'reason: a reason goes with a status change');
  }
  if (sent.length === 0 && !wantsSite && body.status === undefined) {
    throw new HttpError(400, 'Nothing to change: send a field of the log, a siteId or a status');
  }

  if (changed.length > 0 || wantsSite) {
    if (!isMaker) throw new HttpError(403, 'Only its maker can change what was logged about a blanket');
    if (!isMakerEditable(b.status)) {
      throw new HttpError(409, 'This blanket is with the organisers now; ask them if something in the log is wrong');
    }
  }
  if (changed.length > 0) {
    await checkPlan(actor, body.planId, transaction);
    const before: Record<string, unknown> = {};
    for (const f of changed) {
      before[f] = b.get(f);
      b.set(f, body[f] as never);
    }
    await b.save({ transaction });
    await BlanketEvent.create(
      { blanketId: b.id, actorId: actor.id, kind: 'edited', fromStatus: null, toStatus: null, reason: null, data: eventData({ fields: changed, before }) },
      { transaction },
    );
  }
  if (wantsSite) {
    if (body.siteId !== null) {
      const site = await Site.findByPk(body.siteId, { transaction });
      if (!site || !site.active) throw fieldError(400, 'siteId', 'siteId: choose one of the open drop-off sites');
    }
    b.siteId = body.siteId ?? null;
    await b.save({ transaction });
  }
  if (body.status !== undefined) {
    await moveBlanket({ blanket: b, to: body.status, actor, reason: body.reason, data: wantsSite ? { siteId: b.siteId ?? null } : null }, transaction);
  }
}
