import { QueryTypes, type Transaction } from 'sequelize';
import { Need } from '../../db/models/need';
import { keptUntilWrite } from '../../db/kept';
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
  if (needIds.length === 0) return new Map();
  const withBlankets = opts.blankets !== false;
  // Inside a transaction the caller may be looking at its own uncommitted writes: no cache.
  if (opts.transaction) return countNeeds(needIds, withBlankets, opts.transaction);
  // Kept until anything is written (server/db/kept.ts): every page and chart asks for these.
  const key = `need-counts:${withBlankets ? 'b' : 'p'}:${[...needIds].sort((a, b) => a - b).join(',')}`;
  return keptUntilWrite(Need.sequelize!, key, () => countNeeds(needIds, withBlankets));
}

async function countNeeds(needIds: readonly number[], withBlankets: boolean, transaction?: Transaction): Promise<Map<number, NeedCounts>> {
  const out = new Map<number, NeedCounts>();
  // The status lists are constants of the code, never input, so they are written into the SQL.
  const blanketColumns = withBlankets
    ? `, COALESCE(b.finished, 0) AS finished, COALESCE(b.inHand, 0) AS inHand, COALESCE(a.assigned, 0) AS assigned`
    : `, 0 AS finished, 0 AS inHand, 0 AS assigned`;
  // Assigned counts the need's live assignments, whoever pledged the blanket: a blanket pledged for
  // "wherever needed most" or redirected at intake fills the need it was assigned to. A blanket given
  // out with no assignment on record (moved by a script, say) still counts for its pledge's need.
  const blanketJoin = withBlankets
    ? `LEFT JOIN (
         SELECT p.needId AS needId,
           SUM(CASE WHEN bl.status IN (${list(FINISHED_STATUSES)}) THEN 1 ELSE 0 END) AS finished,
           SUM(CASE WHEN bl.status IN (${list(WITH_ORGANISERS)}) THEN 1 ELSE 0 END) AS inHand
         FROM pledges p JOIN blankets bl ON bl.pledgeId = p.id
         WHERE p.needId IN (:needIds) AND p.status IN (${list(PROMISING_PLEDGE_STATUSES)})
         GROUP BY p.needId
       ) b ON b.needId = n.id
       LEFT JOIN (
         SELECT needId, COUNT(*) AS assigned FROM (
           SELECT ag.needId AS needId
           FROM assignments ag JOIN blankets ab ON ab.id = ag.blanketId
           WHERE ag.needId IN (:needIds) AND ag.endedAt IS NULL AND ab.status IN (${list(ASSIGNED_STATUSES)})
           UNION ALL
           SELECT p.needId AS needId
           FROM pledges p JOIN blankets bl ON bl.pledgeId = p.id
           WHERE p.needId IN (:needIds) AND p.status IN (${list(PROMISING_PLEDGE_STATUSES)}) AND bl.status IN (${list(ASSIGNED_STATUSES)})
             AND NOT EXISTS (SELECT 1 FROM assignments x WHERE x.blanketId = bl.id AND x.endedAt IS NULL)
         ) GROUP BY needId
       ) a ON a.needId = n.id`
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
    { replacements: { needIds: [...needIds] }, type: QueryTypes.SELECT, transaction },
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
