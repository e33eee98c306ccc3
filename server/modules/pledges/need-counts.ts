import { QueryTypes, type Transaction } from 'sequelize';
import { Need } from '../../db/models/need';
import { ASSIGNED_STATUSES, FINISHED_STATUSES, WITH_ORGANISERS } from '@shared/blankets/status';
import type { NeedCounts } from '@shared/schemas/pledge';

/** The pledges whose blankets are promised: a fulfilled pledge still counts, its blankets are made. */
export const PROMISING_PLEDGE_STATUSES = ['active', 'fulfilled'] as const;

const list = (xs: readonly string[]) => xs.map((s) => `'${s}'`).join(', ');

/**
 * Wanted, pledged, finished, in hand and assigned for each of these needs, in one aggregate query.
 * Every page and chart that shows these figures takes them from here, so they agree.
 * `blankets: false` skips the blanket figures (left at 0) for pages that only show what is
 * promised, such as "What's needed", so they don't walk every blanket of the drive.
 */
export async function needCounts(
  needIds: readonly number[],
  opts: { blankets?: boolean; transaction?: Transaction } = {},
): Promise<Map<number, NeedCounts>> {
  const out = new Map<number, NeedCounts>();
  if (needIds.length === 0) return out;
  const withBlankets = opts.blankets !== false;
  // The status lists are constants of the code, never input, so they are written into the SQL.
  const blanketColumns = withBlankets
    ? `, COALESCE(b.finished, 0) AS finished, COALESCE(b.inHand, 0) AS inHand, COALESCE(b.assigned, 0) AS assigned`
    : `, 0 AS finished, 0 AS inHand, 0 AS assigned`;
  const blanketJoin = withBlankets
    ? `LEFT JOIN (
         SELECT p.needId AS needId,
           SUM(CASE WHEN bl.status IN (${list(FINISHED_STATUSES)}) THEN 1 ELSE 0 END) AS finished,
           SUM(CASE WHEN bl.status IN (${list(WITH_ORGANISERS)}) THEN 1 ELSE 0 END) AS inHand,
           SUM(CASE WHEN bl.status IN (${list(ASSIGNED_STATUSES)}) THEN 1 ELSE 0 END) AS assigned
         FROM pledges p JOIN blankets bl ON bl.pledgeId = p.id
         WHERE p.needId IN (:needIds) AND p.status IN (${list(PROMISING_PLEDGE_STATUSES)})
         GROUP BY p.needId
       ) b ON b.needId = n.id`
    : '';
  const rows = await Need.sequelize!.query<{
    needId: number;
    recipientId: number;
    wanted: number;
    pledged: number;
    finished: number;
    inHand: number;
    assigned: number;
  }>(
    `SELECT n.id AS needId, n.recipientId AS recipientId, n.quantity AS wanted,
       COALESCE(pl.pledged, 0) AS pledged${blanketColumns}
     FROM needs n
     LEFT JOIN (
       SELECT needId, SUM(quantity) AS pledged FROM pledges
       WHERE needId IN (:needIds) AND status IN (${list(PROMISING_PLEDGE_STATUSES)})
       GROUP BY needId
     ) pl ON pl.needId = n.id
     ${blanketJoin}
     WHERE n.id IN (:needIds)`,
    { replacements: { needIds: [...needIds] }, type: QueryTypes.SELECT, transaction: opts.transaction },
  );
  for (const r of rows) {
    out.set(r.needId, {
      needId: r.needId,
      recipientId: r.recipientId,
      wanted: Number(r.wanted),
      pledged: Number(r.pledged),
      finished: Number(r.finished),
      inHand: Number(r.inHand),
      assigned: Number(r.assigned),
    });
  }
  return out;
}

/** The figures for a need that has none yet (just created, or not found). */
export const noCounts = (needId: number, recipientId: number, wanted: number): NeedCounts => ({
  needId,
  recipientId,
  wanted,
  pledged: 0,
  finished: 0,
  inHand: 0,
  assigned: 0,
});
