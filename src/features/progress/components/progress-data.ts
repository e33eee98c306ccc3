import type { BlanketStatus } from '@shared/schemas/blanket';
import { STATUS_LABELS } from '@shared/blankets/status';

export interface NeedLike {
  quantity: number;
  pledged: number;
  recipient: { id: number; name: string };
}
export interface BlanketLike {
  status: BlanketStatus;
  recipientId: number | null;
}

/** Statuses from which a blanket is in the organisers' hands or beyond. */
export const IN_HAND: readonly BlanketStatus[] = ['received', 'checked', 'assigned', 'packed', 'delivered'];

export interface RecipientProgress {
  name: string;
  wanted: number;
  pledged: number;
  inHand: number;
}

/** Wanted, pledged and in hand per recipient: the drive's progress in one picture. */
export function recipientProgress(needs: NeedLike[], blankets: BlanketLike[]): RecipientProgress[] {
  const rows = new Map<number, RecipientProgress>();
  for (const n of needs) {
    const row = rows.get(n.recipient.id) ?? { name: n.recipient.name, wanted: 0, pledged: 0, inHand: 0 };
    row.wanted += n.quantity;
    row.pledged += n.pledged;
    rows.set(n.recipient.id, row);
  }
  for (const b of blankets) {
    if (b.recipientId === null || !IN_HAND.includes(b.status)) continue;
    const row = rows.get(b.recipientId);
    if (row) row.inHand += 1;
  }
  return [...rows.values()].sort((a, b) => b.wanted - a.wanted);
}

const ORDER: BlanketStatus[] = ['in_progress', 'finished', 'booked', 'received', 'needs_fix', 'declined', 'checked', 'assigned', 'packed', 'delivered'];

/** How many blankets stand at each step, in the order of a blanket's life. */
export function statusCounts(blankets: BlanketLike[]): Array<{ status: BlanketStatus; label: string; count: number }> {
  return ORDER.map((status) => ({ status, label: STATUS_LABELS[status], count: blankets.filter((b) => b.status === status).length }));
}
