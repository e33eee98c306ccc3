import { driveToday } from '../bookings/drive-clock';
import { Op, QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import { Blanket } from '../../db/models/blanket';
import { Recipient } from '../../db/models/recipient';
import { Run, RunBlanket, RunStop } from '../../db/models/run';
import { Site } from '../../db/models/site';
import { User } from '../../db/models/user';
import { HttpError, notFound } from '../../lib/http-error';
import { moveBlanket } from '../blankets/move-blanket';
import { enqueueMail } from '../../mail/outbox';
import { deliveryThankYouMail } from '../../mail/templates';
import { makerLabel } from '../intake/intake.service';
import type { Actor } from '../pledges/pledges.service';
import { cautionsFor } from '@shared/guidelines/cautions';
import { sizeCategoryFor } from '@shared/guidelines/size-categories';
import { haversineKm } from '@shared/routing/distance';
import { suggestRoute } from '@shared/routing/route';
import { sizeOnRecord } from '@shared/schemas/blanket';
import type { Page } from '@shared/schemas/page';
import {
  MAX_STOPS,
  type DeliverBody,
  type PackBody,
  type RunBlanketView,
  type RunCreate,
  type RunListQuery,
  type RunState,
  type RunStopView,
  type RunSummary,
  type RunUpdate,
  type RunView,
  type StopState,
  type WaitingRecipient,
} from '@shared/schemas/run';

type LoadedItem = Omit<RunBlanket, 'blanket'> & { blanket: Blanket & { maker?: User } };
type LoadedStop = Omit<RunStop, 'recipient' | 'items'> & { recipient: Recipient; items: LoadedItem[] };
type LoadedRun = Omit<Run, 'driver' | 'startSite' | 'stops'> & { driver: User; startSite: Site; stops: LoadedStop[] };

const day = (d: Date | null | undefined) => (d ? d.toISOString() : null);

async function loadRun(id: number, transaction?: Transaction): Promise<LoadedRun> {
  const run = (await Run.findByPk(id, {
    include: [
      { model: User, as: 'driver', attributes: ['id', 'name'] },
      { model: Site, as: 'startSite' },
      {
        model: RunStop,
        as: 'stops',
        include: [
          { model: Recipient, as: 'recipient' },
          { model: RunBlanket, as: 'items', include: [{ model: Blanket, as: 'blanket', include: [{ model: User, as: 'maker', attributes: ['id', 'name'] }] }] },
        ],
      },
    ],
    order: [
      [{ model: RunStop, as: 'stops' }, 'position', 'ASC'],
      [{ model: RunStop, as: 'stops' }, { model: RunBlanket, as: 'items' }, 'box', 'ASC'],
      [{ model: RunStop, as: 'stops' }, { model: RunBlanket, as: 'items' }, 'blanketId', 'ASC'],
    ],
    transaction,
  })) as unknown as LoadedRun | null;
  if (!run) throw notFound('That delivery run');
  return run;
}

const stopState = (s: Pick<RunStop, 'packedAt' | 'deliveredAt'>): StopState => (s.deliveredAt ? 'delivered' : s.packedAt ? 'packed' : 'planned');

function runState(stops: Array<Pick<RunStop, 'packedAt' | 'deliveredAt'>>): RunState {
  if (stops.length === 0) return 'empty';
  const states = stops.map(stopState);
  if (states.every((s) => s === 'delivered')) return 'delivered';
  if (states.some((s) => s === 'delivered')) return 'partly-delivered';
  if (states.every((s) => s === 'packed')) return 'packed';
  return 'planned';
}

const pinOf = (p: { lat: number | null; lng: number | null }) => (p.lat === null || p.lng === null ? null : { lat: p.lat, lng: p.lng });

function blanketView(item: LoadedItem): RunBlanketView {
  const b = item.blanket;
  const size = sizeOnRecord(b);
  return {
    id: b.id,
    code: b.code,
    status: b.status,
    box: item.box,
    sizeCategory: sizeCategoryFor(size.widthCm, size.lengthCm),
    colours: b.colours,
    makerLabel: makerLabel(b, b.maker),
  };
}

function summaryOf(run: LoadedRun): RunSummary {
  const stops = run.stops ?? [];
  return {
    id: run.id,
    runDate: run.runDate,
    state: runState(stops),
    driver: { id: run.driver.id, name: run.driver.name },
    startSite: { id: run.startSite.id, name: run.startSite.name },
    stopCount: stops.length,
    blanketCount: stops.reduce((n, s) => n + s.items.length, 0),
    deliveredCount: stops.filter((s) => s.deliveredAt).reduce((n, s) => n + s.items.length, 0),
  };
}

export function runView(run: LoadedRun): RunView {
  const start = pinOf(run.startSite);
  let prev = start;
  let total: number | null = start ? 0 : null;
  const stops: RunStopView[] = run.stops.map((s) => {
    const here = pinOf(s.recipient);
    const legKm = prev && here ? haversineKm(prev, here) : null;
    total = legKm === null || total === null ? null : total + legKm;
    prev = here;
    const blankets = s.items.map(blanketView);
    return {
      id: s.id,
      position: s.position,
      state: stopState(s),
      recipient: {
        id: s.recipient.id,
        name: s.recipient.name,
        address: s.recipient.address,
        lat: s.recipient.lat,
        lng: s.recipient.lng,
        population: s.recipient.population,
        deliveryNotes: s.recipient.deliveryNotes ?? null,
      },
      blankets,
      boxes: [...new Set(blankets.map((b) => b.box))].sort((a, b) => a - b),
      legKm,
      packedAt: day(s.packedAt),
      deliveredAt: day(s.deliveredAt),
      receivedCount: s.receivedCount ?? null,
      signedBy: s.signedBy ?? null,
      cautions: cautionsFor(s.recipient.population),
    };
  });
  const returnKm = run.stops.length > 0 && prev && start ? haversineKm(prev, start) : null;
  const totalKm = run.stops.length === 0 ? 0 : total === null || returnKm === null ? null : (total as number) + returnKm;
  return {
    ...summaryOf(run),
    version: run.version,
    notes: run.notes,
    startSite: { id: run.startSite.id, name: run.startSite.name, address: run.startSite.address, lat: run.startSite.lat, lng: run.startSite.lng },
    stops,
    returnKm,
    totalKm,
    unpinned: run.stops.filter((s) => !pinOf(s.recipient)).map((s) => s.recipient.name),
  };
}

export async function getRun(id: number): Promise<RunView> {
  return runView(await loadRun(id));
}

export async function listRuns(q: RunListQuery): Promise<Page<RunSummary>> {
  const today = await driveToday();
  const where = q.when === 'upcoming' ? { runDate: { [Op.gte]: today } } : q.when === 'past' ? { runDate: { [Op.lt]: today } } : {};
  const dir = q.dir ?? (q.when === 'upcoming' ? 'asc' : 'desc');
  const { rows, count } = await Run.findAndCountAll({
    where,
    order: [['runDate', dir.toUpperCase()], ['id', dir.toUpperCase()]],
    limit: q.pageSize,
    offset: (q.page - 1) * q.pageSize,
    distinct: true,
  });
  const items: RunSummary[] = [];
  for (const r of rows) items.push(summaryOf(await loadRun(r.id)));
  return { items, total: count, page: q.page, pageSize: q.pageSize };
}

/** Recipients with assigned blankets that no run carries yet, most waiting first. */
export async function waitingRecipients(sequelize: Sequelize): Promise<WaitingRecipient[]> {
  const rows = await sequelize.query<WaitingRecipient>(
    `SELECT r.id, r.name, r.address, r.population, r.lat, r.lng, COUNT(b.id) AS waiting
       FROM blankets b
       JOIN recipients r ON r.id = b.recipientId
       LEFT JOIN run_blankets rb ON rb.blanketId = b.id
      WHERE b.status = 'assigned' AND rb.id IS NULL
      GROUP BY r.id
      ORDER BY waiting DESC, r.name ASC`,
    { type: QueryTypes.SELECT },
  );
  return rows.map((r) => ({ ...r, waiting: Number(r.waiting) }));
}

async function checkDriver(driverId: number, transaction: Transaction) {
  const driver = await User.findByPk(driverId, { transaction });
  if (!driver || !driver.active) {
    throw new HttpError(400, 'Choose a driver from the people of the drive', [{ path: 'driverId', message: 'No active person with that id' }]);
  }
}

async function checkSite(siteId: number, transaction: Transaction) {
  const site = await Site.findByPk(siteId, { transaction });
  if (!site) throw new HttpError(400, 'Choose the site the run starts from', [{ path: 'startSiteId', message: 'No drop-off site with that id' }]);
}

/** Assigned blankets of a recipient that no run carries yet. */
async function freeBlankets(recipientId: number, transaction: Transaction): Promise<Blanket[]> {
  return Blanket.findAll({
    where: { recipientId, status: 'assigned', '$runItem.id$': null },
    include: [{ model: RunBlanket, as: 'runItem', attributes: [], required: false }],
    order: [['id', 'ASC']],
    transaction,
  });
}

async function nextPosition(runId: number, transaction: Transaction): Promise<number> {
  const max = (await RunStop.max('position', { where: { runId }, transaction })) as number | null;
  return (max ?? 0) + 1;
}

/** Put a recipient on the run as its last stop, with every assigned blanket of theirs that no run carries yet. */
async function addStopTx(run: Run, recipientId: number, transaction: Transaction): Promise<RunStop> {
  const recipient = await Recipient.findByPk(recipientId, { transaction });
  if (!recipient) throw new HttpError(400, 'That recipient does not exist', [{ path: 'recipientId', message: 'No recipient with that id' }]);
  if (await RunStop.findOne({ where: { runId: run.id, recipientId }, transaction })) {
    throw new HttpError(409, `${recipient.name} is already a stop on this run`, [{ path: 'recipientId', message: 'Already a stop' }]);
  }
  if ((await RunStop.count({ where: { runId: run.id }, transaction })) >= MAX_STOPS) {
    throw new HttpError(409, `A run takes at most ${MAX_STOPS} stops; plan a second run for the rest`);
  }
  const blankets = await freeBlankets(recipientId, transaction);
  if (blankets.length === 0) {
    throw new HttpError(409, `${recipient.name} has no assigned blankets waiting for a run`, [
      { path: 'recipientId', message: 'Nothing waiting to deliver' },
    ]);
  }
  const stop = await RunStop.create({ runId: run.id, recipientId, position: await nextPosition(run.id, transaction) }, { transaction });
  for (const b of blankets) await RunBlanket.create({ runId: run.id, stopId: stop.id, blanketId: b.id, box: 1 }, { transaction });
  return stop;
}

export async function createRun(sequelize: Sequelize, input: RunCreate, actor: Actor): Promise<RunView> {
  const id = await sequelize.transaction(async (transaction) => {
    await checkDriver(input.driverId, transaction);
    await checkSite(input.startSiteId, transaction);
    const run = await Run.create(
      { runDate: input.runDate, driverId: input.driverId, startSiteId: input.startSiteId, createdById: actor.id, notes: input.notes },
      { transaction },
    );
    for (const r of input.recipientIds) await addStopTx(run, r, transaction);
    return run.id;
  });
  return getRun(id);
}

async function runForWrite(id: number, transaction: Transaction, version?: number): Promise<Run> {
  const run = await Run.findByPk(id, { transaction });
  if (!run) throw notFound('That delivery run');
  if (version !== undefined && version !== run.version) {
    throw new HttpError(409, 'Someone else changed this run since you opened it; reload and try again', [
      { path: 'version', message: `You had version ${version}; it is now ${run.version}` },
    ]);
  }
  return run;
}

/** Delivering is recorded by a coordinator, or by the organiser who drives this run. */
function mayRecordDelivery(run: Run, actor: Actor) {
  if (actor.role === 'coordinator' || run.driverId === actor.id) return;
  throw new HttpError(403, 'Only the driver of this run or a coordinator records what was delivered');
}

async function stopForWrite(run: Run, stopId: number, transaction: Transaction) {
  const stop = (await RunStop.findOne({
    where: { id: stopId, runId: run.id },
    include: [
      { model: Recipient, as: 'recipient' },
      { model: RunBlanket, as: 'items', include: [{ model: Blanket, as: 'blanket' }] },
    ],
    order: [[{ model: RunBlanket, as: 'items' }, 'blanketId', 'ASC']],
    transaction,
  })) as (RunStop & { recipient: Recipient; items: Array<RunBlanket & { blanket: Blanket }> }) | null;
  if (!stop) throw notFound('That stop');
  return stop;
}

/** Bump the run's version so two planners see each other's changes to its stops. */
async function touch(run: Run, transaction: Transaction) {
  run.changed('updatedAt', true);
  await run.save({ transaction });
}

export async function updateRun(sequelize: Sequelize, id: number, input: RunUpdate): Promise<RunView> {
  await sequelize.transaction(async (transaction) => {
    const run = await runForWrite(id, transaction, input.version);
    if (input.driverId !== undefined) {
      await checkDriver(input.driverId, transaction);
      run.driverId = input.driverId;
    }
    if (input.startSiteId !== undefined) {
      await checkSite(input.startSiteId, transaction);
      run.startSiteId = input.startSiteId;
    }
    if (input.runDate !== undefined) run.runDate = input.runDate;
    if (input.notes !== undefined) run.notes = input.notes;
    if (input.stopOrder !== undefined) await reorder(run, input.stopOrder, transaction);
    await touch(run, transaction);
  });
  return getRun(id);
}

async function reorder(run: Run, order: number[], transaction: Transaction) {
  const stops = await RunStop.findAll({ where: { runId: run.id }, transaction });
  const ids = new Set(stops.map((s) => s.id));
  if (order.length !== stops.length || new Set(order).size !== order.length || order.some((s) => !ids.has(s))) {
    throw new HttpError(400, 'The new order must list every stop of this run exactly once', [{ path: 'stopOrder', message: 'Not the stops of this run' }]);
  }
  const byId = new Map(stops.map((s) => [s.id, s]));
  for (const [i, stopId] of order.entries()) {
    const s = byId.get(stopId)!;
    if (s.position !== i + 1) {
      s.position = i + 1;
      await s.save({ transaction });
    }
  }
}

/**
 * Order the stops by the suggested round trip from the start site. Stops without a map pin cannot be
 * placed and keep their order after the others.
 */
export async function applySuggestedRoute(sequelize: Sequelize, id: number): Promise<RunView> {
  await sequelize.transaction(async (transaction) => {
    const run = await runForWrite(id, transaction);
    const site = await Site.findByPk(run.startSiteId, { transaction });
    const start = site ? pinOf(site) : null;
    if (!start) throw new HttpError(409, 'The start site has no map pin, so no route can be suggested; add its pin on the sites page');
    const stops = (await RunStop.findAll({
      where: { runId: run.id },
      include: [{ model: Recipient, as: 'recipient' }],
      order: [['position', 'ASC']],
      transaction,
    })) as Array<RunStop & { recipient: Recipient }>;
    const pinned = stops.filter((s) => pinOf(s.recipient));
    const rest = stops.filter((s) => !pinOf(s.recipient));
    const plan = suggestRoute(start, pinned.map((s) => pinOf(s.recipient)!));
    await reorder(run, [...plan.order.map((i) => pinned[i]!.id), ...rest.map((s) => s.id)], transaction);
    await touch(run, transaction);
  });
  return getRun(id);
}

export async function addStop(sequelize: Sequelize, id: number, recipientId: number): Promise<RunView> {
  await sequelize.transaction(async (transaction) => {
    const run = await runForWrite(id, transaction);
    await addStopTx(run, recipientId, transaction);
    await touch(run, transaction);
  });
  return getRun(id);
}

export async function removeStop(sequelize: Sequelize, id: number, stopId: number): Promise<RunView> {
  await sequelize.transaction(async (transaction) => {
    const run = await runForWrite(id, transaction);
    const stop = await stopForWrite(run, stopId, transaction);
    if (stop.packedAt || stop.deliveredAt) {
      throw new HttpError(409, `The blankets for ${stop.recipient.name} are ${stop.deliveredAt ? 'delivered' : 'packed'}; unpack them before taking the stop off the run`);
    }
    await RunBlanket.destroy({ where: { stopId: stop.id }, transaction });
    await stop.destroy({ transaction });
    const left = await RunStop.findAll({ where: { runId: run.id }, order: [['position', 'ASC']], transaction });
    await reorder(run, left.map((s) => s.id), transaction);
    await touch(run, transaction);
  });
  return getRun(id);
}

export async function addBlanket(sequelize: Sequelize, id: number, blanketId: number, box: number): Promise<RunView> {
  await sequelize.transaction(async (transaction) => {
    const run = await runForWrite(id, transaction);
    const b = await Blanket.findByPk(blanketId, { transaction });
    if (!b) throw notFound('That blanket');
    const on = await RunBlanket.findOne({ where: { blanketId }, include: [{ model: Run, as: 'run' }], transaction });
    if (on) {
      const other = (on as RunBlanket & { run: Run }).run;
      throw new HttpError(
        409,
        other.id === run.id ? `Blanket ${b.code} is already on this run` : `Blanket ${b.code} is already on the run of ${other.runDate}`,
        [{ path: 'blanketId', message: 'Already on a run' }],
      );
    }
    if (b.status !== 'assigned' || b.recipientId === null) {
      throw new HttpError(409, `Blanket ${b.code} is not assigned to a recipient waiting for delivery`, [{ path: 'blanketId', message: `It is ${b.status}` }]);
    }
    let stop = await RunStop.findOne({ where: { runId: run.id, recipientId: b.recipientId }, transaction });
    if (stop && (stop.packedAt || stop.deliveredAt)) {
      throw new HttpError(409, 'That stop is already packed; unpack it to add a blanket', [{ path: 'blanketId', message: 'Stop already packed' }]);
    }
    if (!stop) {
      if ((await RunStop.count({ where: { runId: run.id }, transaction })) >= MAX_STOPS) {
        throw new HttpError(409, `A run takes at most ${MAX_STOPS} stops; plan a second run for the rest`);
      }
      stop = await RunStop.create({ runId: run.id, recipientId: b.recipientId, position: await nextPosition(run.id, transaction) }, { transaction });
    }
    await RunBlanket.create({ runId: run.id, stopId: stop.id, blanketId, box }, { transaction });
    await touch(run, transaction);
  });
  return getRun(id);
}

export async function removeBlanket(sequelize: Sequelize, id: number, blanketId: number): Promise<RunView> {
  await sequelize.transaction(async (transaction) => {
    const run = await runForWrite(id, transaction);
    const b = await Blanket.findByPk(blanketId, { transaction });
    if (!b) throw notFound('That blanket');
    const item = await RunBlanket.findOne({ where: { blanketId, runId: run.id }, transaction });
    if (!item) throw new HttpError(409, `Blanket ${b.code} is not on this run (any more)`, [{ path: 'blanketId', message: 'Not on this run' }]);
    if (b.status !== 'assigned') {
      throw new HttpError(409, `Blanket ${b.code} is ${b.status}; unpack its stop before taking it off the run`, [{ path: 'blanketId', message: `It is ${b.status}` }]);
    }
    await item.destroy({ transaction });
    await touch(run, transaction);
  });
  return getRun(id);
}

export async function packStop(sequelize: Sequelize, id: number, stopId: number, body: PackBody, actor: Actor): Promise<RunView> {
  await sequelize.transaction(async (transaction) => {
    const run = await runForWrite(id, transaction);
    const stop = await stopForWrite(run, stopId, transaction);
    if (stop.deliveredAt) throw new HttpError(409, `${stop.recipient.name} has already had its blankets delivered`);
    if (stop.packedAt) throw new HttpError(409, `The blankets for ${stop.recipient.name} are already packed`);
    if (stop.items.length === 0) throw new HttpError(409, `There are no blankets on this stop to pack for ${stop.recipient.name}`);
    const byBlanket = new Map(stop.items.map((i) => [i.blanketId, i]));
    for (const [k, { blanketId }] of body.boxes.entries()) {
      if (!byBlanket.has(blanketId)) {
        throw new HttpError(400, 'A box was given for a blanket that is not on this stop', [{ path: `boxes.${k}.blanketId`, message: 'Not on this stop' }]);
      }
    }
    const boxes = new Map(body.boxes.map((x) => [x.blanketId, x.box]));
    for (const item of stop.items) {
      const box = boxes.get(item.blanketId) ?? item.box;
      if (box !== item.box) {
        item.box = box;
        await item.save({ transaction });
      }
      await moveBlanket(
        {
          blanket: item.blanket,
          to: 'packed',
          actor,
          via: 'packing',
          kind: 'packing',
          data: { runId: run.id, stopId: stop.id, runDate: run.runDate, recipient: stop.recipient.name, box },
        },
        transaction,
      );
    }
    stop.packedAt = new Date();
    await stop.save({ transaction });
    await touch(run, transaction);
  });
  return getRun(id);
}

export async function unpackStop(sequelize: Sequelize, id: number, stopId: number, reason: string, actor: Actor): Promise<RunView> {
  await sequelize.transaction(async (transaction) => {
    const run = await runForWrite(id, transaction);
    const stop = await stopForWrite(run, stopId, transaction);
    if (stop.deliveredAt) throw new HttpError(409, `The blankets for ${stop.recipient.name} are delivered; undo the delivery first`);
    if (!stop.packedAt) throw new HttpError(409, `The blankets for ${stop.recipient.name} are not packed`);
    for (const item of stop.items) {
      await moveBlanket(
        { blanket: item.blanket, to: 'assigned', actor, via: 'packing', kind: 'packing', reason, data: { runId: run.id, stopId: stop.id } },
        transaction,
      );
    }
    stop.packedAt = null;
    await stop.save({ transaction });
    await touch(run, transaction);
  });
  return getRun(id);
}

/**
 * The thank-you each maker who opted in is owed for this stop: one message per maker, listing their
 * blankets delivered here that were never thanked for before (a delivery undone and made again
 * thanks nobody twice). It names the recipient by its public name, never who signed for it.
 */
async function thankMakers(stop: { recipient: Recipient; items: Array<RunBlanket & { blanket: Blanket }> }, appUrl: string, transaction: Transaction) {
  const owed = stop.items.map((i) => i.blanket).filter((b) => b.thankedAt === null);
  if (owed.length === 0) return;
  const makers = await User.findAll({
    where: { id: { [Op.in]: [...new Set(owed.map((b) => b.userId))] }, thankYouMail: true, active: true },
    attributes: ['id', 'name', 'email'],
    transaction,
  });
  const now = new Date();
  for (const maker of makers) {
    const theirs = owed.filter((b) => b.userId === maker.id).sort((a, b) => a.code.localeCompare(b.code));
    const first = maker.name.trim().split(/\s+/)[0] ?? maker.name;
    await enqueueMail({ to: maker.email, ...deliveryThankYouMail({ name: first, recipientName: stop.recipient.name, codes: theirs.map((b) => b.code), appUrl }) }, transaction);
    await Blanket.update({ thankedAt: now }, { where: { id: { [Op.in]: theirs.map((b) => b.id) } }, transaction });
  }
}

export async function deliverStop(sequelize: Sequelize, id: number, stopId: number, body: DeliverBody, actor: Actor, appUrl: string): Promise<RunView> {
  await sequelize.transaction(async (transaction) => {
    const run = await runForWrite(id, transaction);
    mayRecordDelivery(run, actor);
    const stop = await stopForWrite(run, stopId, transaction);
    if (stop.deliveredAt) throw new HttpError(409, `The blankets for ${stop.recipient.name} were already marked delivered`);
    if (!stop.packedAt) throw new HttpError(409, `Pack the blankets for ${stop.recipient.name} before marking them delivered`);
    for (const item of stop.items) {
      await moveBlanket(
        {
          blanket: item.blanket,
          to: 'delivered',
          actor,
          via: 'delivery',
          kind: 'delivery',
          data: { runId: run.id, stopId: stop.id, runDate: run.runDate, recipient: stop.recipient.name, signedBy: body.signedBy, receivedCount: body.receivedCount },
        },
        transaction,
      );
    }
    stop.deliveredAt = new Date();
    stop.receivedCount = body.receivedCount;
    stop.signedBy = body.signedBy;
    await stop.save({ transaction });
    await thankMakers(stop, appUrl, transaction);
    await touch(run, transaction);
  });
  return getRun(id);
}

export async function undeliverStop(sequelize: Sequelize, id: number, stopId: number, reason: string, actor: Actor): Promise<RunView> {
  await sequelize.transaction(async (transaction) => {
    const run = await runForWrite(id, transaction);
    mayRecordDelivery(run, actor);
    const stop = await stopForWrite(run, stopId, transaction);
    if (!stop.deliveredAt) throw new HttpError(409, `The blankets for ${stop.recipient.name} are not marked delivered`);
    for (const item of stop.items) {
      await moveBlanket(
        { blanket: item.blanket, to: 'packed', actor, via: 'delivery', kind: 'delivery', reason, data: { runId: run.id, stopId: stop.id } },
        transaction,
      );
    }
    stop.deliveredAt = null;
    stop.receivedCount = null;
    stop.signedBy = null;
    await stop.save({ transaction });
    await touch(run, transaction);
  });
  return getRun(id);
}
