import { Op, col, fn } from 'sequelize';
import { Blanket } from '../../db/models/blanket';
import { Need } from '../../db/models/need';
import { Recipient } from '../../db/models/recipient';
import type { BlanketStatus } from '@shared/schemas/blanket';
import type { DriveProgress } from '@shared/schemas/pledge';
import { needCounts } from '../pledges/need-counts';
import { keptUntilWrite } from '../../db/kept';
import { driveToday } from '../bookings/drive-clock';

/**
 * The staff home page's charts: per recipient, its open needs' figures summed (the same needs and
 * the same counts as "What's needed" and the recipient pages), and how many blankets stand at each step.
 */
export async function driveProgress(): Promise<DriveProgress> {
  const needs = await Need.findAll({
    attributes: ['id', 'recipientId'],
    where: { deadline: { [Op.gte]: await driveToday() } },
    include: [{ model: Recipient, as: 'recipient', attributes: ['id', 'name'], where: { active: true } }],
    order: [['id', 'ASC']],
  });
  const counts = await needCounts(needs.map((n) => n.id));
  const rows = new Map<number, DriveProgress['recipients'][number]>();
  for (const n of needs) {
    const c = counts.get(n.id);
    if (!c) continue;
    const row = rows.get(n.recipientId) ?? { recipientId: n.recipientId, name: n.recipient!.name, wanted: 0, pledged: 0, finished: 0, inHand: 0, assigned: 0 };
    row.wanted += c.wanted;
    row.pledged += c.pledged;
    row.finished += c.finished;
    row.inHand += c.inHand;
    row.assigned += c.assigned;
    rows.set(n.recipientId, row);
  }
  // Walks every blanket of the drive; kept until anything is written.
  const byStatus = await keptUntilWrite(
    Blanket.sequelize!,
    'blankets-by-status',
    async () =>
      (await Blanket.findAll({
        attributes: ['status', [fn('COUNT', col('id')), 'count']],
        group: ['status'],
        raw: true,
      })) as unknown as Array<{ status: BlanketStatus; count: number }>,
  );
  return {
    recipients: [...rows.values()].sort((a, b) => b.wanted - a.wanted || a.name.localeCompare(b.name)),
    statuses: byStatus.map((r) => ({ status: r.status, count: Number(r.count) })),
  };
}
