import { driveToday } from '../bookings/drive-clock';
import { Op, type Sequelize, type Transaction } from 'sequelize';
import { Assignment } from '../../db/models/assignment';
import { Blanket } from '../../db/models/blanket';
import { BlanketEvent } from '../../db/models/blanket-event';
import { Need } from '../../db/models/need';
import { Photo } from '../../db/models/photo';
import { Pledge } from '../../db/models/pledge';
import { Recipient } from '../../db/models/recipient';
import { Site } from '../../db/models/site';
import { User } from '../../db/models/user';
import { HttpError, fieldError, notFound } from '../../lib/http-error';
import { moveBlanket } from '../blankets/move-blanket';
import { storedGuidelines } from '../recipients/recipients.service';
import { needCounts } from '../pledges/need-counts';
import type { Actor } from '../../auth/actor';
import { STATUS_LABELS } from '@shared/blankets/status';
import { cautionsFor } from '@shared/guidelines/cautions';
import { sizeCategoryFor, sizeCategoryRow } from '@shared/guidelines/size-categories';
import { daysUntil, feasibility, type MatchBlanket, type MatchNeed } from '@shared/matching/cost';
import { suggestAssignments } from '@shared/matching/suggest';
import { fieldsForCheck, sizeOnRecord, type BlanketStatus, type SizeCategory } from '@shared/schemas/blanket';
import type { Page } from '@shared/schemas/page';
import type {
  AssignBatchBody,
  AssignmentListQuery,
  AssignmentSource,
  AssignmentView,
  BatchOutcome,
  BatchResult,
  BoardNeed,
  BoardQuery,
  ReassignBody,
  SuggestBody,
  Suggestion,
  Urgency,
  WaitingBlanket,
} from '@shared/schemas/assignment';

/** The drive's today as the matching engine counts days: its UTC midnight, so whole days come out exact. */
const driveDay = async (): Promise<Date> => new Date(`${await driveToday()}T00:00:00Z`);

/** A need due within this many days is shown as due soon. */
const SOON_DAYS = 14;

type LoadedNeed = Need & { recipient: Recipient };
type LoadedAssignment = Assignment & { blanket?: Blanket; need?: Need; recipient?: Recipient; assignedBy?: User | null };

const needName = (n: LoadedNeed) => `${n.recipient.name} (${sizeCategoryRow(n.sizeCategory).label})`;

function view(a: LoadedAssignment): AssignmentView {
  return {
    id: a.id,
    blanketId: a.blanketId,
    blanketCode: a.blanket?.code ?? '',
    blanketStatus: a.blanket?.status ?? 'assigned',
    needId: a.needId,
    sizeCategory: (a.need?.sizeCategory ?? 'lap') as SizeCategory,
    recipient: { id: a.recipientId, name: a.recipient?.name ?? '' },
    assignedAt: new Date(a.assignedAt).toISOString(),
    assignedBy: a.assignedBy ? { id: a.assignedBy.id, name: a.assignedBy.name } : null,
    source: a.source,
    version: a.version,
  };
}

const VIEW_INCLUDE = [
  { model: Blanket, as: 'blanket', attributes: ['id', 'code', 'status'] },
  { model: Need, as: 'need', attributes: ['id', 'sizeCategory'] },
  { model: Recipient, as: 'recipient', attributes: ['id', 'name'] },
  { model: User, as: 'assignedBy', attributes: ['id', 'name'] },
];

async function loadView(id: number, transaction?: Transaction): Promise<AssignmentView> {
  const a = (await Assignment.findByPk(id, { include: VIEW_INCLUDE, transaction })) as LoadedAssignment | null;
  if (!a) throw notFound('That assignment');
  return view(a);
}

/** Live assignments on a need, counted in the caller's transaction so two assigns cannot both take the last slot. */
async function liveOnNeed(needId: number, transaction: Transaction): Promise<number> {
  return Assignment.count({ where: { needId, endedAt: null }, transaction });
}

async function loadNeed(needId: number, transaction: Transaction): Promise<LoadedNeed> {
  const need = (await Need.findByPk(needId, { include: [{ model: Recipient, as: 'recipient' }], transaction })) as LoadedNeed | null;
  if (!need) throw fieldError(400, 'needId', 'There is no such need');
  if (!need.recipient.active) throw fieldError(400, 'needId', `${need.recipient.name} is not taking blankets at the moment`);
  return need;
}

/** Why this blanket cannot go to this need, or null when it can: the unit's rules on the measured size, and room. */
async function refusalFor(b: Blanket, need: LoadedNeed, transaction: Transaction): Promise<HttpError | null> {
  const fit = feasibility({ fields: fieldsForCheck(b) }, storedGuidelines(need.recipient));
  if (!fit.ok) {
    return new HttpError(
      400,
      `${need.recipient.name} does not take blanket ${b.code} as it is: ${fit.reasons.join(' ')}`,
      fit.reasons.map((message) => ({ path: 'needId', message })),
    );
  }
  const taken = await liveOnNeed(need.id, transaction);
  if (taken >= need.quantity) {
    return new HttpError(409, `${needName(need)} is full: ${taken} of ${need.quantity} blankets are assigned`, [
      { path: 'needId', message: 'This need has all the blankets it asked for' },
    ]);
  }
  return null;
}

/** Why a blanket is not free to assign: taken a moment ago, or not at the checked stage. */
async function notFree(b: Blanket, transaction: Transaction): Promise<HttpError> {
  const live = (await Assignment.findOne({
    where: { blanketId: b.id, endedAt: null },
    include: [
      { model: Recipient, as: 'recipient', attributes: ['id', 'name'] },
      { model: User, as: 'assignedBy', attributes: ['id', 'name'] },
    ],
    transaction,
  })) as LoadedAssignment | null;
  if (live) {
    const by = live.assignedBy ? ` by ${live.assignedBy.name}` : '';
    return new HttpError(409, `Blanket ${b.code} was just assigned to ${live.recipient?.name ?? 'a recipient'}${by}`, [
      { path: 'blanketId', message: `Already assigned to ${live.recipient?.name ?? 'a recipient'}` },
    ]);
  }
  return new HttpError(409, `Blanket ${b.code} is ${STATUS_LABELS[b.status as BlanketStatus].toLowerCase()}; only a checked blanket can be assigned`, [
    { path: 'blanketId', message: 'Only a checked blanket can be assigned' },
  ]);
}

async function assignInside(
  actor: Actor,
  pair: { blanketId: number; needId: number },
  source: AssignmentSource,
  transaction: Transaction,
): Promise<number> {
  const b = await Blanket.findByPk(pair.blanketId, { transaction });
  if (!b) throw fieldError(400, 'blanketId', 'There is no such blanket');
  if (b.status !== 'checked') throw await notFree(b, transaction);
  const need = await loadNeed(pair.needId, transaction);
  const refused = await refusalFor(b, need, transaction);
  if (refused) throw refused;
  const now = new Date();
  const a = await Assignment.create(
    {
      blanketId: b.id,
      needId: need.id,
      recipientId: need.recipientId,
      assignedById: actor.id,
      assignedAt: now,
      priorRecipientId: b.recipientId ?? null,
      source,
    },
    { transaction },
  );
  await moveBlanket(
    {
      blanket: b,
      to: 'assigned',
      actor,
      via: 'assignment',
      kind: 'assignment',
      changes: { recipientId: need.recipientId },
      data: { assignmentId: a.id, needId: need.id, recipientId: need.recipientId, recipientName: need.recipient.name, sizeCategory: need.sizeCategory, source },
    },
    transaction,
  );
  return a.id;
}

export async function assign(sequelize: Sequelize, actor: Actor, pair: { blanketId: number; needId: number }): Promise<AssignmentView> {
  const id = await sequelize.transaction((transaction) => assignInside(actor, pair, 'board', transaction));
  return loadView(id);
}

/**
 * Several pairs in one transaction. Each pair runs in its own savepoint: one that someone else took
 * a moment ago, or that no longer fits, comes back with its reason and leaves the others applied.
 */
export async function assignBatch(sequelize: Sequelize, actor: Actor, body: AssignBatchBody): Promise<BatchResult> {
  const results = await sequelize.transaction(async (transaction) => {
    const out: Array<{ blanketId: number; needId: number; id: number | null; status: number; message: string }> = [];
    for (const pair of body.pairs) {
      try {
        const id = await sequelize.transaction({ transaction }, (savepoint) => assignInside(actor, pair, body.source, savepoint));
        out.push({ ...pair, id, status: 201, message: 'Assigned' });
      } catch (e) {
        if (!(e instanceof HttpError)) throw e;
        out.push({ ...pair, id: null, status: e.status, message: e.message });
      }
    }
    return out;
  });
  const outcomes: BatchOutcome[] = [];
  for (const r of results) {
    outcomes.push({
      blanketId: r.blanketId,
      needId: r.needId,
      ok: r.id !== null,
      status: r.status,
      message: r.message,
      assignment: r.id !== null ? await loadView(r.id) : null,
    });
  }
  const applied = outcomes.filter((o) => o.ok).length;
  return { applied, conflicts: outcomes.length - applied, outcomes };
}

async function liveAssignment(id: number, transaction: Transaction): Promise<Assignment & { blanket: Blanket }> {
  const a = (await Assignment.findByPk(id, { include: [{ model: Blanket, as: 'blanket' }], transaction })) as (Assignment & { blanket: Blanket }) | null;
  if (!a) throw notFound('That assignment');
  if (a.endedAt) throw new HttpError(409, `That assignment of blanket ${a.blanket.code} was already ended; reload the board`);
  if (a.blanket.status !== 'assigned') {
    throw new HttpError(
      409,
      `Blanket ${a.blanket.code} is ${STATUS_LABELS[a.blanket.status as BlanketStatus].toLowerCase()}; it can only be moved or unassigned while it is assigned and not yet packed`,
    );
  }
  return a;
}

/** Sends an assigned blanket to another need; the old assignment ends, a new one records who and when. */
export async function reassign(sequelize: Sequelize, actor: Actor, id: number, body: ReassignBody): Promise<AssignmentView> {
  const newId = await sequelize.transaction(async (transaction) => {
    const a = await liveAssignment(id, transaction);
    if (a.needId === body.needId) throw fieldError(409, 'needId', 'It is assigned to that need already');
    const need = await loadNeed(body.needId, transaction);
    const refused = await refusalFor(a.blanket, need, transaction);
    if (refused) throw refused;
    const now = new Date();
    a.set({ endedAt: now, endedById: actor.id, endReason: body.reason ?? `Moved to ${needName(need)}` });
    await a.save({ transaction });
    const next = await Assignment.create(
      {
        blanketId: a.blanketId,
        needId: need.id,
        recipientId: need.recipientId,
        assignedById: actor.id,
        assignedAt: now,
        priorRecipientId: a.priorRecipientId ?? null,
        source: 'board',
      },
      { transaction },
    );
    a.blanket.recipientId = need.recipientId;
    await a.blanket.save({ transaction });
    await BlanketEvent.create(
      {
        blanketId: a.blanketId,
        actorId: actor.id,
        kind: 'reassignment',
        fromStatus: null,
        toStatus: null,
        reason: body.reason ?? null,
        data: { assignmentId: next.id, fromNeedId: a.needId, needId: need.id, recipientId: need.recipientId, recipientName: need.recipient.name } as BlanketEvent['data'],
      },
      { transaction },
    );
    return next.id;
  });
  return loadView(newId);
}

/** Ends an assignment: the blanket goes back to the checked blankets, where it was meant to go before. */
export async function unassign(sequelize: Sequelize, actor: Actor, id: number, reason: string): Promise<{ blanketId: number }> {
  return sequelize.transaction(async (transaction) => {
    const a = await liveAssignment(id, transaction);
    a.set({ endedAt: new Date(), endedById: actor.id, endReason: reason });
    await a.save({ transaction });
    await moveBlanket(
      {
        blanket: a.blanket,
        to: 'checked',
        actor,
        via: 'assignment',
        kind: 'assignment',
        reason,
        changes: { recipientId: a.priorRecipientId ?? null },
        data: { assignmentId: a.id, needId: a.needId, recipientId: a.recipientId, ended: true },
      },
      transaction,
    );
    return { blanketId: a.blanketId };
  });
}

export async function listAssignments(q: AssignmentListQuery): Promise<Page<AssignmentView>> {
  const where: Record<string, unknown> = { endedAt: null };
  if (q.needId) where.needId = q.needId;
  if (q.recipientId) where.recipientId = q.recipientId;
  const { rows, count } = await Assignment.findAndCountAll({
    where,
    include: VIEW_INCLUDE,
    order: [['assignedAt', q.dir === 'asc' ? 'ASC' : 'DESC'], ['id', 'DESC']],
    limit: q.pageSize,
    offset: (q.page - 1) * q.pageSize,
    distinct: true,
  });
  return { items: (rows as LoadedAssignment[]).map(view), total: count, page: q.page, pageSize: q.pageSize };
}

// --- The board and the suggestion --------------------------------------------------------------

function urgencyOf(daysLeft: number): Urgency {
  return daysLeft < 0 ? 'overdue' : daysLeft <= SOON_DAYS ? 'soon' : 'later';
}

/** Assigned per need, from the one aggregate every page that shows need figures reads. */
async function assignedPerNeed(needIds: number[]): Promise<Map<number, number>> {
  const counts = await needCounts(needIds);
  return new Map([...counts].map(([id, c]) => [id, c.assigned]));
}

async function openNeeds(filter: { recipientId?: number; sizeCategory?: SizeCategory }, today: Date): Promise<Array<BoardNeed & { guidelines: MatchNeed['guidelines'] }>> {
  const where: Record<string, unknown> = {};
  if (filter.recipientId) where.recipientId = filter.recipientId;
  if (filter.sizeCategory) where.sizeCategory = filter.sizeCategory;
  const needs = (await Need.findAll({
    where,
    include: [{ model: Recipient, as: 'recipient', where: { active: true } }],
    order: [['deadline', 'ASC'], ['id', 'ASC']],
  })) as LoadedNeed[];
  const assigned = await assignedPerNeed(needs.map((n) => n.id));
  return needs.map((n) => {
    const taken = assigned.get(n.id) ?? 0;
    const daysLeft = daysUntil(n.deadline, today);
    return {
      needId: n.id,
      recipientId: n.recipientId,
      recipientName: n.recipient.name,
      population: n.recipient.population,
      sizeCategory: n.sizeCategory,
      wanted: n.quantity,
      assigned: taken,
      open: Math.max(0, n.quantity - taken),
      deadline: n.deadline,
      daysLeft,
      urgency: urgencyOf(daysLeft),
      preferences: n.preferences ?? null,
      cautions: cautionsFor(n.recipient.population),
      guidelines: storedGuidelines(n.recipient),
    };
  });
}

export async function boardNeeds(q: Pick<BoardQuery, 'recipientId' | 'sizeCategory'>, today?: Date): Promise<BoardNeed[]> {
  return (await openNeeds(q, today ?? (await driveDay()))).map(({ guidelines: _g, ...n }) => n);
}

type WaitingRow = Blanket & { site?: Site | null; pledge?: (Pledge & { need?: LoadedNeed | null }) | null };

/** Checked blankets no one has assigned yet, optionally at one site. */
async function waitingBlankets(siteId?: number): Promise<WaitingRow[]> {
  return (await Blanket.findAll({
    where: { status: 'checked', ...(siteId ? { siteId } : {}) },
    include: [
      { model: Site, as: 'site', attributes: ['id', 'name'] },
      {
        model: Pledge,
        as: 'pledge',
        attributes: ['id', 'needId'],
        include: [{ model: Need, as: 'need', attributes: ['id', 'sizeCategory'], include: [{ model: Recipient, as: 'recipient', attributes: ['id', 'name'] }] }],
      },
    ],
    order: [['receivedAt', 'ASC'], ['id', 'ASC']],
  })) as WaitingRow[];
}

function matchBlanket(b: WaitingRow): MatchBlanket {
  return {
    id: b.id,
    code: b.code,
    fields: fieldsForCheck(b),
    colours: b.colours,
    bodyStitch: b.bodyStitch,
    pledgedNeedId: b.pledge?.needId ?? null,
    siteId: b.siteId ?? null,
  };
}

/**
 * One page of the checked blankets waiting for a recipient, each with whether it fits every open
 * need shown on the board and why not. The size category and the recipient filter come from the
 * measured size and the guideline check, so they are applied here rather than in SQL; the page is
 * still cut on the server.
 */
export async function boardWaiting(q: BoardQuery, today?: Date): Promise<Page<WaitingBlanket>> {
  const needs = await openNeeds({ recipientId: q.recipientId }, today ?? (await driveDay()));
  const all = await waitingBlankets(q.siteId);
  const rows: Array<{ b: WaitingRow; fits: WaitingBlanket['fits']; category: SizeCategory | null }> = [];
  for (const b of all) {
    const size = sizeOnRecord(b);
    const category = sizeCategoryFor(size.widthCm, size.lengthCm);
    if (q.sizeCategory && category !== q.sizeCategory) continue;
    const m = matchBlanket(b);
    const byRecipient = new Map<number, ReturnType<typeof feasibility>>();
    const fits = needs.map((n) => {
      let f = byRecipient.get(n.recipientId);
      if (!f) byRecipient.set(n.recipientId, (f = feasibility(m, n.guidelines)));
      const reasons = [...f.reasons];
      if (n.open === 0) reasons.push(`This need has all ${n.wanted} blankets it asked for.`);
      return { needId: n.needId, ok: reasons.length === 0, reasons };
    });
    if (q.recipientId && !fits.some((f) => f.ok)) continue;
    rows.push({ b, fits, category });
  }
  const page = rows.slice((q.page - 1) * q.pageSize, q.page * q.pageSize);
  const photos = page.length
    ? await Photo.findAll({ where: { blanketId: { [Op.in]: page.map((r) => r.b.id) } }, attributes: ['id', 'blanketId'], order: [['id', 'ASC']] })
    : [];
  const firstPhoto = new Map<number, number>();
  for (const p of photos) if (!firstPhoto.has(p.blanketId)) firstPhoto.set(p.blanketId, p.id);
  const items: WaitingBlanket[] = page.map(({ b, fits, category }) => {
    const size = sizeOnRecord(b);
    const need = b.pledge?.need;
    const photo = firstPhoto.get(b.id);
    return {
      id: b.id,
      code: b.code,
      version: b.version,
      widthCm: size.widthCm,
      lengthCm: size.lengthCm,
      measured: size.measured,
      sizeCategory: category,
      yarnWeight: b.yarnWeight,
      colours: b.colours,
      bodyStitch: b.bodyStitch,
      site: b.site ? { id: b.site.id, name: b.site.name } : null,
      pledgedFor: need ? { needId: need.id, recipientName: need.recipient?.name ?? '', sizeCategory: need.sizeCategory } : null,
      thumbnailUrl: photo ? `/api/blankets/${b.id}/photos/${photo}?size=thumb` : null,
      fits,
    };
  });
  return { items, total: rows.length, page: q.page, pageSize: q.pageSize };
}

/** The optimal suggestion for the whole drive, one site's stock or one recipient's needs. Writes nothing. */
export async function suggest(body: SuggestBody, today?: Date): Promise<Suggestion> {
  if (body.siteId && !(await Site.findByPk(body.siteId))) throw fieldError(400, 'siteId', 'There is no such drop-off site');
  if (body.recipientId && !(await Recipient.findByPk(body.recipientId))) throw fieldError(400, 'recipientId', 'There is no such recipient');
  const day = today ?? (await driveDay());
  const needs = await openNeeds({ recipientId: body.recipientId }, day);
  const blankets = (await waitingBlankets(body.siteId)).map(matchBlanket);
  const matchNeeds: MatchNeed[] = needs.map((n) => ({
    id: n.needId,
    recipientId: n.recipientId,
    recipientName: n.recipientName,
    sizeCategory: n.sizeCategory,
    open: n.open,
    deadline: n.deadline,
    preferences: n.preferences,
    guidelines: n.guidelines,
  }));
  return suggestAssignments(blankets, matchNeeds, day);
}
