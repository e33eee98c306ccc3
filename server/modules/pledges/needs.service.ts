import { Op } from 'sequelize';
import { Need } from '../../db/models/need';
import { Pledge } from '../../db/models/pledge';
import { Recipient } from '../../db/models/recipient';
import type { OpenNeed } from '@shared/schemas/pledge';
import { recipientBrief, todayIso } from './recipient-brief';
import type { Actor } from './pledges.service';

/**
 * Open needs (deadline today or later, recipient active) with what is promised against each.
 * Fulfilled pledges still count: those blankets are made, so they are no longer wanted.
 */
export async function listOpenNeeds(actor: Actor): Promise<OpenNeed[]> {
  const today = todayIso();
  const needs = await Need.findAll({
    where: { deadline: { [Op.gte]: today } },
    include: [{ model: Recipient, as: 'recipient', where: { active: true } }],
    order: [['deadline', 'ASC'], ['id', 'ASC']],
  });
  const pledges = await Pledge.findAll({
    attributes: ['needId', 'userId', 'quantity', 'status'],
    where: { needId: { [Op.in]: needs.map((n) => n.id) }, status: { [Op.in]: ['active', 'fulfilled'] } },
  });
  const pledged = new Map<number, number>();
  const mine = new Map<number, number>();
  for (const p of pledges) {
    pledged.set(p.needId!, (pledged.get(p.needId!) ?? 0) + p.quantity);
    if (p.userId === actor.id && p.status === 'active') mine.set(p.needId!, (mine.get(p.needId!) ?? 0) + p.quantity);
  }
  const briefs = new Map<number, ReturnType<typeof recipientBrief>>();
  return needs.map((n) => {
    const total = pledged.get(n.id) ?? 0;
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
