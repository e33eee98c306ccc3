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
 * The UTC day of a stored timestamp, and the Monday that starts its week. Sequelize keeps times in
 * UTC as text beginning YYYY-MM-DD, so the day is its first ten characters: cheaper than parsing
 * each one with date(), which a count over the whole history would pay for every row.
 */
export const dayOf = (column: string) => `substr(${column}, 1, 10)`;
export const weekOfSql = (column: string) => `date(${dayOf(column)}, '-6 days', 'weekday 1')`;
