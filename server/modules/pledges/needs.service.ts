import { Op } from 'sequelize';
import { Need } from '../../db/models/need';
import { keptUntilWrite } from '../../db/kept';
import { preparedRead } from '../../db/prepared-read';
import { Recipient } from '../../db/models/recipient';
import type { OpenNeed } from '@shared/schemas/pledge';
import { recipientBrief } from './recipient-brief';
import { driveToday } from '../bookings/drive-clock';
import { needCounts } from './need-counts';
import type { Actor } from '../../auth/actor';

/**
 * Open needs (deadline today or later, recipient active) with what is promised against each.
 * Pledged comes from needCounts, shared with the recipient pages and the charts. Everything but the
 * reader's own figure is the same for every volunteer, so it is read once per drive day and kept
 * until a write (server/db/kept.ts); each reader then adds only their own pledges, one indexed
 * query (when fifty makers open the page at once, each had been running the whole read).
 */
export async function listOpenNeeds(actor: Actor): Promise<OpenNeed[]> {
  const today = await driveToday();
  const open = await keptUntilWrite(Need.sequelize!, `open-needs ${today}`, () => openNeedsOn(today));
  if (open.length === 0) return [];
  const rows = await preparedRead<{ needId: number; total: number }>(
    Need.sequelize!,
    "SELECT needId, SUM(quantity) AS total FROM pledges WHERE userId = ? AND status = 'active' GROUP BY needId",
    [actor.id],
  );
  const mine = new Map(rows.map((r) => [r.needId, Number(r.total)]));
  return open.map((n) => ({ ...n, myPledged: mine.get(n.id) ?? 0 }));
}

/** The open needs on a drive day as every volunteer sees them, their own figure left at 0. */
async function openNeedsOn(today: string): Promise<OpenNeed[]> {
  const needs = await Need.findAll({
    where: { deadline: { [Op.gte]: today } },
    include: [{ model: Recipient, as: 'recipient', where: { active: true } }],
    order: [['deadline', 'ASC'], ['id', 'ASC']],
  });
  const counts = await needCounts(needs.map((n) => n.id), { blankets: false });
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
      myPledged: 0,
      recipient: briefs.get(r.id)!,
    };
  });
}
