import { Op } from 'sequelize';
import { Assignment } from '../models/assignment';
import { Blanket } from '../models/blanket';
import { BlanketEvent } from '../models/blanket-event';
import { Need } from '../models/need';
import { Pledge } from '../models/pledge';
import { addSeedStep } from './demo';

/**
 * The demo's blankets already past "checked" get the assignment record the board would have made:
 * their pledge's need, assigned by the organiser on the day the history says.
 */
addSeedStep(async (ctx) => {
  const { transaction } = ctx;
  const given = await Blanket.findAll({
    where: { status: { [Op.in]: ['assigned', 'packed', 'delivered'] } },
    include: [{ model: Pledge, as: 'pledge', include: [{ model: Need, as: 'need' }] }],
    transaction,
  });
  for (const b of given as Array<Blanket & { pledge?: Pledge & { need?: Need | null } }>) {
    const need = b.pledge?.need;
    if (!need) continue;
    const step = await BlanketEvent.findOne({ where: { blanketId: b.id, toStatus: 'assigned' }, order: [['id', 'ASC']], transaction });
    await Assignment.create(
      {
        blanketId: b.id,
        needId: need.id,
        recipientId: need.recipientId,
        assignedById: step?.actorId ?? ctx.users.organiser.id,
        assignedAt: step?.createdAt ?? ctx.today,
        priorRecipientId: b.recipientId ?? null,
        source: 'board',
      },
      { transaction },
    );
    if (step) await step.update({ kind: 'assignment', data: { needId: need.id, recipientId: need.recipientId, source: 'board' } as BlanketEvent['data'] }, { transaction, silent: true });
  }
});
