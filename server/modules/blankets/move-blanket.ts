import type { Transaction } from 'sequelize';
import { Blanket } from '../../db/models/blanket';
import { BlanketEvent } from '../../db/models/blanket-event';
import { HttpError } from '../../lib/http-error';
import { enqueueMail, type OutgoingMail } from '../../mail/outbox';
import type { BlanketStatus } from '@shared/schemas/blanket';
import { STATUS_LABELS, checkTransition, moveChannel, type MoveChannel, type TransitionRefusal } from '@shared/blankets/status';
import { refreshPledgeStatus } from '../pledges/pledges.service';
import type { Actor } from '../../auth/actor';

/** One refusal, one HTTP status, wherever the move was asked for. */
export const REFUSAL_STATUS: Record<TransitionRefusal | 'channel', number> = {
  same: 409,
  skip: 409,
  role: 403,
  reason: 400,
  channel: 409,
};

/** Where each kind of move is made, in the words a refusal uses to send a person there. */
const CHANNEL_PLACE: Record<MoveChannel, string> = {
  plain: 'the blanket page',
  intake: 'the intake page, where the measurements, checklist and check are recorded with the move',
  assignment: 'the assignment board, where the recipient and need are recorded with the move',
  booking: 'the drop-off booking page, where the site and time are recorded with the move',
  packing: 'the delivery run, where the stop and box are recorded with the move',
  delivery: 'the delivery run, where the stop and who signed for it are recorded with the move',
};

export interface MoveRequest {
  blanket: Blanket;
  to: BlanketStatus;
  actor: Actor;
  /** Which door the move comes through; each move of the status machine has exactly one. */
  via?: MoveChannel;
  reason?: string | null;
  /** The history entry's kind: 'status' for a bare move, or the step that made it ('intake', …). */
  kind?: string;
  /** What the history keeps about the move (measurements, the check, the stop…). */
  data?: unknown;
  /** Other fields of the blanket that change with the move, saved in the same write. */
  changes?: Partial<Pick<Blanket, 'siteId' | 'recipientId' | 'receivedAt' | 'widthCm' | 'lengthCm'>> & Record<string, unknown>;
  /** Mail the move owes, sent only if the move commits. */
  mail?: OutgoingMail[];
}

/** Thrown for a refused move, with the field the client should point at. */
function refusal(kind: TransitionRefusal | 'channel', message: string) {
  const path = kind === 'reason' ? 'reason' : 'status';
  return new HttpError(REFUSAL_STATUS[kind], message, [{ path, message }]);
}

/**
 * The one way a blanket changes status. It checks the move against the status machine (who may make
 * it, whether it skips a step, whether a backwards move has its reason, and whether it comes through
 * the door it belongs to), saves the blanket with the fields that change with it, writes the history
 * entry, brings the pledge's status in step with a recount, and enqueues the mail it owes — all in the
 * caller's transaction, so a move and its bookkeeping commit or roll back together.
 */
export async function moveBlanket(req: MoveRequest, transaction: Transaction): Promise<BlanketEvent> {
  const { blanket: b, to, actor } = req;
  const via = req.via ?? 'plain';
  const from: BlanketStatus = b.status;
  const verdict = checkTransition(from, to, { role: actor.role, isMaker: b.userId === actor.id }, req.reason);
  if (!verdict.ok) throw refusal(verdict.refusal, verdict.message);
  const belongs = moveChannel(verdict.move);
  if (belongs !== via) {
    throw refusal(
      'channel',
      `Moving a blanket from ${STATUS_LABELS[from].toLowerCase()} to ${STATUS_LABELS[to].toLowerCase()} is done on ${CHANNEL_PLACE[belongs]}`,
    );
  }
  const pledgeBefore = b.pledgeId ?? null;
  b.set({ ...(req.changes ?? {}), status: to });
  if (to === 'received' && !req.changes?.receivedAt) b.receivedAt = new Date();
  await b.save({ transaction });
  const event = await BlanketEvent.create(
    {
      blanketId: b.id,
      actorId: actor.id,
      kind: req.kind ?? 'status',
      fromStatus: from,
      toStatus: to,
      reason: verdict.reason,
      data: (req.data ?? null) as BlanketEvent['data'],
    },
    { transaction },
  );
  await refreshPledgeStatus(b.pledgeId, transaction);
  if (pledgeBefore !== null && pledgeBefore !== (b.pledgeId ?? null)) await refreshPledgeStatus(pledgeBefore, transaction);
  for (const mail of req.mail ?? []) await enqueueMail(mail, transaction);
  return event;
}
