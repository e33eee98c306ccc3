import { DateTime } from 'luxon';
import { GLANCE_STEPS, STEP_STATUSES, arrivalMoves, type GlanceStep } from '@shared/drive/glance';

/*
 * SQL pieces shared by the drive at a glance and the blanket list it links to, so a figure and the
 * list behind it count with the same words. Every value written into the SQL here is a constant of the
 * code (status names), never input.
 */

const quote = (s: string) => `'${s}'`;
export const sqlList = (xs: readonly string[]) => xs.map(quote).join(', ');

/** The need a blanket counts for: its live assignment's need, or else its pledge's need. */
export const needOfBlanket = (blanketId: string, pledgeId: string) =>
  `COALESCE((SELECT ag.needId FROM assignments ag WHERE ag.blanketId = ${blanketId} AND ag.endedAt IS NULL), (SELECT pl.needId FROM pledges pl WHERE pl.id = ${pledgeId}))`;

/** A history entry (alias `e`) that means its blanket reached this step. */
export function arrivalIn(step: GlanceStep, e = 'e'): string {
  const moves = arrivalMoves(step);
  const logged = moves.filter((m) => m.from === null).map((m) => m.to);
  const moved = moves.filter((m) => m.from !== null).map((m) => `(${e}.fromStatus = ${quote(m.from!)} AND ${e}.toStatus = ${quote(m.to)})`);
  return `((${e}.fromStatus IS NULL AND ${e}.toStatus IN (${sqlList(logged)}))${moved.map((m) => ` OR ${m}`).join('')})`;
}

/**
 * Every (from, to, step) that means reaching a step, as a table to join history entries (alias `e`)
 * to: `m.step` is the step reached. A blanket logged straight into a step has from ''.
 */
export function arrivalJoin(e = 'e'): string {
  const rows = GLANCE_STEPS.flatMap((step) => arrivalMoves(step).map((m) => `(${quote(m.from ?? '')}, ${quote(m.to)}, ${quote(step)})`));
  return `JOIN (SELECT column1 AS fromStatus, column2 AS toStatus, column3 AS step FROM (VALUES ${rows.join(', ')})) m
    ON m.toStatus = ${e}.toStatus AND m.fromStatus = COALESCE(${e}.fromStatus, '')`;
}

/** The step a blanket status belongs to, as SQL over a status column. */
export function stepCase(statusColumn: string): string {
  return `CASE ${GLANCE_STEPS.map((s) => `WHEN ${statusColumn} IN (${sqlList(STEP_STATUSES[s])}) THEN ${quote(s)}`).join(' ')} ELSE NULL END`;
}

/**
 * The UTC day of a stored timestamp. Sequelize keeps times in UTC as text beginning YYYY-MM-DD, so the
 * day is its first ten characters: cheaper than parsing each one with date(), which a count over the
 * whole history would pay for every row.
 */
export const dayOf = (column: string) => `substr(${column}, 1, 10)`;

/** A stretch of time over which the drive's zone keeps one offset from UTC. */
export interface ZoneSpan {
  /** Where the next stretch begins, as stored text ("2026-10-25 01:00:00"); null for the last. */
  untilUtc: string | null;
  offsetMinutes: number;
}

const MINUTE_MS = 60_000;
/** A day in milliseconds, for the ranges of instants whose clock changes a query needs. */
export const DAY_MS = 86_400_000;
const STEP_MS = 7 * DAY_MS;
const stored = (ms: number) => new Date(ms).toISOString().slice(0, 19).replace('T', ' ');

/**
 * The zone's offsets from UTC between two instants, split where they change (a clock change). Steps a
 * week at a time, then finds the changing minute by halving: zones change at most a few times a
 * year, never twice within a week, and each offset asked of luxon costs tens of microseconds.
 */
export function zoneSpans(zone: string, fromMs: number, toMs: number): ZoneSpan[] {
  const offsetAt = (ms: number) => DateTime.fromMillis(ms, { zone }).offset;
  const start = Math.floor(fromMs / MINUTE_MS) * MINUTE_MS;
  const spans: ZoneSpan[] = [];
  let offset = offsetAt(start);
  for (let at = start + STEP_MS; at - STEP_MS < toMs; at += STEP_MS) {
    if (offsetAt(at) === offset) continue;
    let lo = at - STEP_MS; // still the old offset
    let hi = at; // already the new one
    while (hi - lo > MINUTE_MS) {
      const mid = lo + Math.floor((hi - lo) / 2 / MINUTE_MS) * MINUTE_MS;
      if (offsetAt(mid) === offset) lo = mid;
      else hi = mid;
    }
    spans.push({ untilUtc: stored(hi), offsetMinutes: offset });
    offset = offsetAt(hi);
  }
  spans.push({ untilUtc: null, offsetMinutes: offset });
  return spans;
}

const hhmm = (minutes: number) => `${String(Math.floor(minutes / 60)).padStart(2, '0')}:${String(minutes % 60).padStart(2, '0')}`;

/** The local day at one fixed offset: the UTC day, moved a day on or back only near UTC midnight. */
function dayAtOffset(column: string, offsetMinutes: number): string {
  const utcDay = dayOf(column);
  const time = `substr(${column}, 12, 5)`;
  if (offsetMinutes > 0) return `CASE WHEN ${time} >= '${hhmm(1440 - offsetMinutes)}' THEN date(${utcDay}, '+1 day') ELSE ${utcDay} END`;
  if (offsetMinutes < 0) return `CASE WHEN ${time} < '${hhmm(-offsetMinutes)}' THEN date(${utcDay}, '-1 day') ELSE ${utcDay} END`;
  return utcDay;
}

/**
 * The drive's local day of a stored UTC timestamp (decision 0015: days are the drive's), as SQL. A
 * comparison of the time's first five characters per row, and date() only for the rows near UTC
 * midnight that move to the day before or after; the spans come from zoneSpans for the range asked.
 * Times before the first span's range are read at its offset.
 */
export function localDayOf(column: string, spans: ZoneSpan[]): string {
  if (spans.length === 1) return dayAtOffset(column, spans[0]!.offsetMinutes);
  const arms = spans.map((s) => (s.untilUtc === null ? `ELSE ${dayAtOffset(column, s.offsetMinutes)}` : `WHEN ${column} < '${s.untilUtc}' THEN ${dayAtOffset(column, s.offsetMinutes)}`));
  return `CASE ${arms.join(' ')} END`;
}

/** The Monday that starts the drive-local week of a stored timestamp. */
export const weekOfSql = (column: string, spans: ZoneSpan[]) => `date(${localDayOf(column, spans)}, '-6 days', 'weekday 1')`;
