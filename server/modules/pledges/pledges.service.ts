import { Op, col, fn, literal, where as sqlWhere, type Order, type Transaction, type WhereOptions } from 'sequelize';
import { Pledge } from '../../db/models/pledge';
import { Need } from '../../db/models/need';
import { Recipient } from '../../db/models/recipient';
import { Blanket } from '../../db/models/blanket';
import { User } from '../../db/models/user';
import { HttpError, fieldError, notFound } from '../../lib/http-error';
import { maySee, readsAll, type Actor } from '../../auth/actor';
import {
  MAX_PLEDGE_DAYS_AHEAD,
  type PledgeCreate,
  type PledgeListQuery,
  type PledgeSort,
  type PledgeUpdate,
  type PledgePage,
  type PledgeView,
} from '@shared/schemas/pledge';
import type { SizeCategory } from '@shared/schemas/blanket';
import { recipientBrief, addDaysIso, type BriefSource } from './recipient-brief';
import { findAllPlain } from '../../db/plain-rows';
import { driveToday } from '../bookings/drive-clock';
import { addToTally, emptyTally, isPledgeLate, pledgeStatusFor, type PledgeTally } from '@shared/pledges/rules';
import { PROMISING_PLEDGE_STATUSES } from './need-counts';

/** Kept here for callers written before the actor had its own home in server/auth/actor.ts. */
export type { Actor } from '../../auth/actor';

async function blanketCounts(pledgeIds: number[], transaction?: Transaction): Promise<Map<number, PledgeTally>> {
  const out = new Map<number, PledgeTally>();
  if (pledgeIds.length === 0) return out;
  const rows = await Blanket.findAll({
    attributes: ['pledgeId', 'status'],
    where: { pledgeId: { [Op.in]: pledgeIds } },
    transaction,
  });
  for (const b of rows) out.set(b.pledgeId!, addToTally(out.get(b.pledgeId!) ?? emptyTally(), b.status));
  return out;
}

/** The tally of one pledge's blankets. */
export async function pledgeTally(pledgeId: number, transaction?: Transaction): Promise<PledgeTally> {
  return (await blanketCounts([pledgeId], transaction)).get(pledgeId) ?? emptyTally();
}

const include = (transaction?: Transaction) => ({
  include: [
    { model: Need, as: 'need', include: [{ model: Recipient, as: 'recipient' }] },
    { model: User, as: 'user', attributes: ['id', 'name'] },
  ],
  transaction,
});

/** What a pledge's view reads: an instance, or the plain values of a list's row (see findAllPlain). */
type PledgeRow = Pick<Pledge, 'id' | 'userId' | 'needId' | 'quantity' | 'sizeCategory' | 'dueDate' | 'status' | 'version' | 'createdAt'> & {
  need?: (Pick<Need, 'id' | 'sizeCategory' | 'deadline'> & { recipient?: BriefSource | null }) | null;
  user?: Pick<User, 'name'> | null;
};

function view(p: PledgeRow, counts: PledgeTally | undefined, today: string): PledgeView {
  const c = counts ?? emptyTally();
  const need = p.need ?? null;
  const user = p.user ?? undefined;
  return {
    id: p.id,
    userId: p.userId,
    makerName: user?.name,
    needId: p.needId ?? null,
    quantity: p.quantity,
    sizeCategory: p.sizeCategory,
    dueDate: p.dueDate,
    status: p.status,
    version: p.version,
    createdAt: new Date(p.createdAt).toISOString(),
    blanketsLogged: c.logged,
    blanketsFinished: c.finished,
    blanketsDeclined: c.declined,
    late: isPledgeLate({ status: p.status, dueDate: p.dueDate, quantity: p.quantity, blanketsFinished: c.finished }, today),
    afterDeadline: need ? p.dueDate > need.deadline : false,
    need:
      need && need.recipient
        ? { id: need.id, sizeCategory: need.sizeCategory, deadline: need.deadline, recipient: recipientBrief(need.recipient) }
        : null,
  };
}

async function views(pledges: PledgeRow[], transaction?: Transaction): Promise<PledgeView[]> {
  const counts = await blanketCounts(pledges.map((p) => p.id), transaction);
  const today = await driveToday(transaction);
  return pledges.map((p) => view(p, counts.get(p.id), today));
}

export async function pledgeView(id: number, transaction?: Transaction): Promise<PledgeView> {
  const p = await Pledge.findByPk(id, include(transaction));
  if (!p) throw notFound('That pledge');
  return (await views([p], transaction))[0]!;
}

const pledgeStatusRank = literal("CASE `Pledge`.`status` WHEN 'active' THEN 0 WHEN 'fulfilled' THEN 1 ELSE 2 END");

function pledgeOrder(sort: PledgeSort, dir: 'ASC' | 'DESC'): Order {
  // The id breaks ties, so a row never shows on two pages.
  switch (sort) {
    case 'dueDate':
      return [['dueDate', dir], ['id', dir]];
    case 'createdAt':
      return [['createdAt', dir], ['id', dir]];
    case 'quantity':
      return [['quantity', dir], ['id', 'ASC']];
    case 'status':
      return [[pledgeStatusRank, dir], ['dueDate', 'ASC'], ['id', 'ASC']];
    case 'maker':
      return [[{ model: User, as: 'user' }, 'name', dir], ['id', 'ASC']];
  }
}

/** One page of pledges: your own, or everyone's for staff; filtered, searched and sorted here. */
export async function listPledges(actor: Actor, q: PledgeListQuery): Promise<PledgePage> {
  const where: WhereOptions = {};
  if (!readsAll(actor) || q.mine) where.userId = actor.id;
  if (q.status) where.status = q.status;
  if (q.needId) where.needId = q.needId;
  const and: unknown[] = [];
  if (q.q) and.push(sqlWhere(fn('instr', fn('lower', col('user.name')), q.q.toLowerCase()), Op.gt, 0));
  // The filters behind the pledged figures of the drive at a glance.
  if (q.promising) and.push({ status: { [Op.in]: [...PROMISING_PLEDGE_STATUSES] } });
  if (q.from && q.to) {
    // Times are kept in UTC as text beginning YYYY-MM-DD: the day is its first ten characters.
    const day = fn('substr', col('Pledge.createdAt'), 1, 10);
    and.push(sqlWhere(day, Op.gte, q.from), sqlWhere(day, Op.lt, q.to));
  }
  if (and.length) (where as Record<symbol, unknown>)[Op.and] = and;
  const dir = (q.dir ?? (q.sort === 'createdAt' ? 'desc' : 'asc')).toUpperCase() as 'ASC' | 'DESC';
  const countInclude = q.q ? [{ model: User, as: 'user', attributes: [] }] : [];
  const total = await Pledge.count({ where, include: countInclude });
  const [sum] = (await Pledge.findAll({ attributes: [[fn('SUM', col('Pledge.quantity')), 'n']], where, include: countInclude, raw: true })) as unknown as Array<{ n: number | null }>;
  const blankets = Number(sum?.n ?? 0);
  // A page of a list is read as plain values: building model instances was most of what it cost.
  const pledges = await findAllPlain<PledgeRow>(Pledge, {
    where,
    ...include(),
    order: pledgeOrder(q.sort, dir),
    limit: q.pageSize,
    offset: (q.page - 1) * q.pageSize,
  });
  return { items: await views(pledges), total, page: q.page, pageSize: q.pageSize, blankets };
}

/** The pledge if this person may see it; someone else's is "not found" to a volunteer, never "forbidden". */
export async function visiblePledge(actor: Actor, id: number, transaction?: Transaction): Promise<Pledge> {
  const p = await Pledge.findByPk(id, { transaction });
  if (!p || !maySee(actor, p.userId)) throw notFound('That pledge');
  return p;
}

async function ownPledge(actor: Actor, id: number, transaction: Transaction): Promise<Pledge> {
  const p = await visiblePledge(actor, id, transaction);
  if (p.userId !== actor.id) throw new HttpError(403, 'Only the person who made a pledge can change it');
  return p;
}

function checkDueDate(dueDate: string, today: string) {
  if (dueDate < today) throw fieldError(400, 'dueDate', `dueDate: choose today (${today}) or a later day`);
  const latest = addDaysIso(today, MAX_PLEDGE_DAYS_AHEAD);
  if (dueDate > latest) throw fieldError(400, 'dueDate', `dueDate: choose a day before ${latest}`);
}

/** A need a volunteer may still pledge against, checked against the size they want to make. */
async function openNeed(needId: number, sizeCategory: SizeCategory, today: string, transaction: Transaction): Promise<Need> {
  const need = await Need.findByPk(needId, { include: [{ model: Recipient, as: 'recipient' }], transaction });
  if (!need || !need.recipient) throw fieldError(404, 'needId', 'needId: that need was not found');
  if (!need.recipient.active || need.deadline < today) {
    // Says neither who nor why: a recipient that stopped collecting may not be named to makers any more.
    throw fieldError(409, 'needId', 'needId: this need is no longer collecting blankets; choose another from What is needed');
  }
  if (need.sizeCategory !== sizeCategory) {
    throw fieldError(400, 'sizeCategory', `sizeCategory: ${need.recipient.name} asks for ${need.sizeCategory} blankets here, not ${sizeCategory}`);
  }
  return need;
}

export async function createPledge(actor: Actor, body: PledgeCreate, transaction: Transaction): Promise<PledgeView> {
  const today = await driveToday(transaction);
  checkDueDate(body.dueDate, today);
  if (body.needId !== null) {
    const need = await openNeed(body.needId, body.sizeCategory, today, transaction);
    if (body.dueDate > need.deadline) {
      throw fieldError(400, 'dueDate', `dueDate: ${need.recipient!.name} needs these by ${need.deadline}; choose that day or an earlier one`);
    }
  }
  const p = await Pledge.create(
    { userId: actor.id, needId: body.needId, quantity: body.quantity, sizeCategory: body.sizeCategory, dueDate: body.dueDate },
    { transaction },
  );
  return pledgeView(p.id, transaction);
}

function checkVersion(sent: number | undefined, current: number) {
  if (sent !== undefined && sent !== current) {
    throw new HttpError(409, 'Someone changed this at the same time; reload it and try again', [
      { path: 'version', message: `You had version ${sent}; it is now ${current}` },
    ]);
  }
}

export async function updatePledge(actor: Actor, id: number, body: PledgeUpdate, transaction: Transaction): Promise<PledgeView> {
  const p = await ownPledge(actor, id, transaction);
  checkVersion(body.version, p.version);
  if (p.status === 'cancelled') throw new HttpError(409, 'This pledge was cancelled; make a new one instead');
  const today = await driveToday(transaction);
  const counts = await pledgeTally(p.id, transaction);

  const currentNeedId = p.needId ?? null;
  const needId = body.needId !== undefined ? body.needId : currentNeedId;
  const sizeCategory = body.sizeCategory ?? p.sizeCategory;
  const retargeted = needId !== currentNeedId || sizeCategory !== p.sizeCategory;
  // Declined blankets stay in the pledge's history, so they hold it to its need and size too.
  const everLogged = counts.logged + counts.declined;
  if (retargeted && everLogged > 0) {
    throw fieldError(409, body.needId !== undefined ? 'needId' : 'sizeCategory', `You have logged ${everLogged} blanket(s) under this pledge already; make a new pledge for a different need or size`);
  }
  if (needId !== null && retargeted) {
    await openNeed(needId, sizeCategory, today, transaction);
  }
  // A push-back may go past the need's deadline: the pledge then shows as after the deadline
  // rather than vanishing, so the coordinator can see it and ask.
  if (body.dueDate !== undefined) checkDueDate(body.dueDate, today);
  if (body.quantity !== undefined && body.quantity < counts.logged) {
    throw fieldError(409, 'quantity', `quantity: you have logged ${counts.logged} blanket(s) under this pledge; it cannot be fewer`);
  }

  p.needId = needId;
  p.sizeCategory = sizeCategory;
  if (body.quantity !== undefined) p.quantity = body.quantity;
  if (body.dueDate !== undefined) p.dueDate = body.dueDate;
  p.status = pledgeStatusFor(p.status, p.quantity, counts.finished);
  await p.save({ transaction });
  return pledgeView(p.id, transaction);
}

export async function cancelPledge(actor: Actor, id: number, transaction: Transaction): Promise<PledgeView> {
  const p = await ownPledge(actor, id, transaction);
  if (p.status === 'cancelled') return pledgeView(p.id, transaction);
  const counts = await pledgeTally(p.id, transaction);
  if (counts.logged > 0) {
    throw new HttpError(
      409,
      `You have logged ${counts.logged} blanket(s) under this pledge, so it cannot be cancelled; reduce it to ${counts.logged} instead`,
      [{ path: 'quantity', message: `Reduce it to ${counts.logged}` }],
    );
  }
  p.status = 'cancelled';
  await p.save({ transaction });
  return pledgeView(p.id, transaction);
}

/** Keeps a pledge's status in step with its blankets: fulfilled once enough are finished. */
export async function refreshPledgeStatus(pledgeId: number | null | undefined, transaction: Transaction) {
  if (!pledgeId) return;
  const p = await Pledge.findByPk(pledgeId, { transaction });
  if (!p || p.status === 'cancelled') return;
  const next = pledgeStatusFor(p.status, p.quantity, (await pledgeTally(p.id, transaction)).finished);
  if (next !== p.status) {
    p.status = next;
    await p.save({ transaction });
  }
}
