import { Op, col, fn } from 'sequelize';
import { Need } from '../../db/models/need';
import { Pledge } from '../../db/models/pledge';
import { Recipient } from '../../db/models/recipient';
import type { OpenNeed } from '@shared/schemas/pledge';
import { recipientBrief } from './recipient-brief';
import { driveToday } from '../bookings/drive-clock';
import { needCounts } from './need-counts';
import type { Actor } from '../../auth/actor';

/**
 * Open needs (deadline today or later, recipient active) with what is promised against each.
 * Pledged comes from needCounts, shared with the recipient pages and the charts.
 */
export async function listOpenNeeds(actor: Actor): Promise<OpenNeed[]> {
  const today = await driveToday();
  const needs = await Need.findAll({
    where: { deadline: { [Op.gte]: today } },
    include: [{ model: Recipient, as: 'recipient', where: { active: true } }],
    order: [['deadline', 'ASC'], ['id', 'ASC']],
  });
  const counts = await needCounts(needs.map((n) => n.id), { blankets: false });
  const mine = new Map<number, number>();
  if (needs.length > 0) {
    const rows = (await Pledge.findAll({
      attributes: ['needId', [fn('SUM', col('quantity')), 'total']],
      where: { userId: actor.id, needId: { [Op.in]: needs.map((n) => n.id) }, status: 'active' },
      group: ['needId'],
      raw: true,
    })) as unknown as Array<{ needId: number; total: number }>;
    for (const r of rows) mine.set(r.needId, Number(r.total));
  }
  const briefs = new Map<number, ReturnType<typeof recipientBrief>>();
  return needs.map((n) => {
    const total = counts.get(n.id)?.pledged ?? 0;
    const r = n.recipient!;
    if (!briefs.has(r.id)) briefs.set(r.id, recipientBrief(r));
    return {
      id: n.id,
      sizeCategory: n.sizeCategory,
      quantity: n.quantity,
      deadline: n.deadline,
      preferences: n.preferences ?? null,
      pledged: total,
      stillWanted: Math.max(0, n.quantity - total),
      overPledged: Math.max(0, total - n.quantity),
      myPledged: mine.get(n.id) ?? 0,
      recipient: briefs.get(r.id)!,
    };
  });
}
