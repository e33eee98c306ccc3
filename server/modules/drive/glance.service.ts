import { Op, QueryTypes } from 'sequelize';
import { Need } from '../../db/models/need';
import { Recipient } from '../../db/models/recipient';
import { STEP_STATUSES, riskOf, weekAfter, weekOf, type GlanceStep } from '@shared/drive/glance';
import type { DriveGlance, GlanceNeed, GlanceWeek, StepCounts } from '@shared/schemas/glance';
import { needCounts, PROMISING_PLEDGE_STATUSES } from '../pledges/need-counts';
import { driveNow, type DriveNow } from '../bookings/drive-clock';
import { listRuns } from '../runs/runs.service';
import { listExports } from '../runs/manifest.service';
import { DAY_MS, arrivalJoin, needOfBlanket, sqlList, stepCase, weekOfSql, zoneSpans } from './glance-sql';

const emptySteps = (): StepCounts => ({ finished: 0, received: 0, checked: 0, assigned: 0, packed: 0, delivered: 0 });

/** How many weeks the timeline goes back at most. */
export const MAX_WEEKS = 52;
/** How many blankets each step lists as waiting longest. */
export const LONGEST = 3;
/** The steps a blanket can wait at; delivered is the end of the line. */
const WAITING_STEPS: GlanceStep[] = ['finished', 'received', 'checked', 'assigned', 'packed'];

/** A timestamp as SQLite hands it back from a raw query ("2026-11-30 09:15:00.000 +00:00"). */
function storedDate(v: string | Date): Date {
  if (v instanceof Date) return v;
  const m = /^(\d{4}-\d{2}-\d{2}) (\d{2}:\d{2}:\d{2}(?:\.\d+)?) ?([+-]\d{2}:\d{2}|Z)?$/.exec(v);
  return m ? new Date(`${m[1]}T${m[2]}${m[3] ?? 'Z'}`) : new Date(v);
}

/**
 * The whole drive for the coordinator and organisers, in aggregate queries only (a drive can hold
 * tens of thousands of blankets): blankets now at each step per open need and in all; per week, how
 * many were pledged and how many reached each step (from the history); the needs at risk; the
 * blankets waiting longest at each step; the next runs and the latest exports.
 */
export async function driveGlance(): Promise<DriveGlance> {
  const sequelize = Need.sequelize!;
  // Open needs, runs and the history's weeks all go by the drive's own day (decision 0015).
  const clock = await driveNow();
  const today = clock.today;
  const now = new Date(clock.nowMs);

  // Open needs of active recipients: the same needs as the home page's charts and "What's needed".
  const needs = await Need.findAll({
    attributes: ['id', 'recipientId', 'sizeCategory', 'deadline'],
    where: { deadline: { [Op.gte]: today } },
    include: [{ model: Recipient, as: 'recipient', attributes: ['id', 'name'], where: { active: true } }],
    order: [['deadline', 'ASC'], ['id', 'ASC']],
  });
  const counts = await needCounts(needs.map((n) => n.id));

  // Blankets now at each step, per need: one grouped query over the blankets.
  const byNeedStep = await sequelize.query<{ needId: number | null; step: GlanceStep | null; n: number }>(
    `SELECT ${needOfBlanket('b.id', 'b.pledgeId')} AS needId, ${stepCase('b.status')} AS step, COUNT(*) AS n
     FROM blankets b GROUP BY 1, 2`,
    { type: QueryTypes.SELECT },
  );
  const totalsByStatus = await sequelize.query<{ status: string; n: number }>(`SELECT status, COUNT(*) AS n FROM blankets GROUP BY status`, { type: QueryTypes.SELECT });
  const nowByNeed = new Map<number, StepCounts>();
  const totals = emptySteps();
  for (const r of byNeedStep) {
    if (!r.step) continue;
    totals[r.step] += Number(r.n);
    if (r.needId === null) continue;
    const row = nowByNeed.get(r.needId) ?? emptySteps();
    row[r.step] += Number(r.n);
    nowByNeed.set(r.needId, row);
  }
  const statusCount = (s: string) => Number(totalsByStatus.find((r) => r.status === s)?.n ?? 0);

  const glanceNeeds: GlanceNeed[] = [];
  for (const n of needs) {
    const c = counts.get(n.id);
    if (!c) continue;
    const risk = riskOf({ deadline: n.deadline, wanted: c.wanted, pledged: c.pledged, assigned: c.assigned }, today);
    glanceNeeds.push({
      needId: n.id,
      recipientId: n.recipientId,
      recipientName: n.recipient!.name,
      sizeCategory: n.sizeCategory,
      deadline: n.deadline,
      wanted: c.wanted,
      pledged: c.pledged,
      assignedSoFar: c.assigned,
      now: nowByNeed.get(n.id) ?? emptySteps(),
      ...risk,
    });
  }

  return {
    today,
    totals: {
      ...totals,
      wanted: glanceNeeds.reduce((s, n) => s + n.wanted, 0),
      pledged: glanceNeeds.reduce((s, n) => s + n.pledged, 0),
      inProgress: statusCount('in_progress'),
      declined: statusCount('declined'),
    },
    needs: glanceNeeds,
    weeks: await timeline(clock),
    waiting: await waitingLongest(now),
    upcomingRuns: await listRuns({ when: 'upcoming', page: 1, pageSize: 5 }).then((p) => ({ items: p.items, total: p.total })),
    recentExports: await listExports({ page: 1, pageSize: 5 }).then((p) => ({ items: p.items, total: p.total })),
  };
}

/**
 * Per week: blankets pledged (on promises still standing) and distinct blankets that reached each
 * step. For one need: its pledges, and the blankets that count for it now (assigned to it, or else
 * pledged for it), through their whole history.
 */
async function timeline(clock: DriveNow, needId?: number): Promise<GlanceWeek[]> {
  const sequelize = Need.sequelize!;
  const last = weekOf(clock.today);
  // At most MAX_WEEKS: a long drive shows its latest year.
  const earliest = new Date(Date.parse(`${last}T00:00:00Z`) - (MAX_WEEKS - 1) * 7 * DAY_MS).toISOString().slice(0, 10);
  // The zone's offsets over the weeks shown (a day either side for the zone's own offset); weeks
  // further back are not shown, so their rows may be read at the first span's offset.
  const spans = zoneSpans(clock.zone, Date.parse(`${earliest}T00:00:00Z`) - 2 * DAY_MS, clock.nowMs + 2 * DAY_MS);
  const forNeed = needId === undefined ? '' : `AND e.blanketId IN (SELECT b.id FROM blankets b WHERE ${needOfBlanket('b.id', 'b.pledgeId')} = :needId)`;
  const reached = await sequelize.query<{ week: string; step: GlanceStep; n: number }>(
    `SELECT ${weekOfSql('e.createdAt', spans)} AS week, m.step AS step, COUNT(DISTINCT e.blanketId) AS n
     FROM blanket_events e ${arrivalJoin('e')}
     WHERE 1 = 1 ${forNeed}
     GROUP BY week, m.step`,
    { type: QueryTypes.SELECT, replacements: { needId: needId ?? null } },
  );
  const pledged = await sequelize.query<{ week: string; n: number }>(
    `SELECT ${weekOfSql('createdAt', spans)} AS week, SUM(quantity) AS n FROM pledges
     WHERE status IN (${sqlList(PROMISING_PLEDGE_STATUSES)}) ${needId === undefined ? '' : 'AND needId = :needId'}
     GROUP BY week`,
    { type: QueryTypes.SELECT, replacements: { needId: needId ?? null } },
  );
  const firsts = [...reached.map((r) => r.week), ...pledged.map((r) => r.week)].filter((w) => w <= last).sort();
  if (firsts.length === 0) return [];
  let first = firsts[0]!;
  if (first < earliest) first = earliest;
  const weeks: GlanceWeek[] = [];
  for (let w = first; w <= last; w = weekAfter(w)) {
    const row: GlanceWeek = { week: w, pledged: 0, reached: emptySteps() };
    row.pledged = Number(pledged.find((p) => p.week === w)?.n ?? 0);
    for (const r of reached) if (r.week === w) row.reached[r.step] = Number(r.n);
    weeks.push(row);
  }
  return weeks;
}

/** GET /api/drive/glance/weeks: the week-by-week figures of one need. */
export async function glanceWeeks(needId: number): Promise<GlanceWeek[]> {
  return timeline(await driveNow(), needId);
}

/**
 * The blankets that have stood longest at each step, since the history entry that brought them to
 * their present status (or since they were logged, for a blanket with no such entry), and how many
 * stand there in all: one query ranking within each step.
 */
async function waitingLongest(now: Date): Promise<DriveGlance['waiting']> {
  const sequelize = Need.sequelize!;
  const since = `COALESCE((SELECT MAX(e.createdAt) FROM blanket_events e WHERE e.blanketId = b.id AND e.toStatus = b.status), b.createdAt)`;
  // Each step's few longest, then how many stand at each step: a sort per step is cheaper than
  // ranking every blanket of the drive in one window.
  const longest = await sequelize.query<{ id: number; code: string; step: GlanceStep; since: string | Date; recipientName: string | null }>(
    WAITING_STEPS.map(
      (step) => `SELECT * FROM (
        SELECT b.id AS id, b.code AS code, ${quote(step)} AS step, ${since} AS since, r.name AS recipientName
        FROM blankets b LEFT JOIN recipients r ON r.id = b.recipientId
        WHERE b.status IN (${sqlList(STEP_STATUSES[step])})
        ORDER BY since ASC, b.id ASC LIMIT :longest)`,
    ).join(' UNION ALL '),
    { type: QueryTypes.SELECT, replacements: { longest: LONGEST } },
  );
  const counts = await sequelize.query<{ step: GlanceStep | null; n: number }>(`SELECT ${stepCase('status')} AS step, COUNT(*) AS n FROM blankets GROUP BY 1`, {
    type: QueryTypes.SELECT,
  });
  return WAITING_STEPS.map((step) => ({
    step,
    count: Number(counts.find((c) => c.step === step)?.n ?? 0),
    longest: longest
      .filter((r) => r.step === step)
      .map((r) => {
        const at = storedDate(r.since);
        return { id: r.id, code: r.code, since: at.toISOString(), days: Math.max(0, Math.floor((now.getTime() - at.getTime()) / DAY_MS)), recipientName: r.recipientName };
      }),
  }));
}

const quote = (s: string) => `'${s}'`;
