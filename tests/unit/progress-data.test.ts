import { describe, expect, it } from 'vitest';
import { recipientProgress, statusCounts } from '../../src/features/progress/components/progress-data';

const unit = { id: 1, name: 'Newborn unit' };
const ward = { id: 2, name: 'Ward' };

describe('drive progress figures', () => {
  it('adds wanted and pledged across a recipient’s needs and counts blankets in hand', () => {
    const rows = recipientProgress(
      [
        { quantity: 10, pledged: 4, recipient: unit },
        { quantity: 5, pledged: 5, recipient: unit },
        { quantity: 20, pledged: 1, recipient: ward },
      ],
      [
        { status: 'received', recipientId: 1 },
        { status: 'delivered', recipientId: 1 },
        { status: 'booked', recipientId: 1 },
        { status: 'checked', recipientId: null },
        { status: 'packed', recipientId: 2 },
      ],
    );
    expect(rows).toEqual([
      { name: 'Ward', wanted: 20, pledged: 1, inHand: 1 },
      { name: 'Newborn unit', wanted: 15, pledged: 9, inHand: 2 },
    ]);
  });
  it('counts every status in the order of a blanket’s life', () => {
    const counts = statusCounts([{ status: 'booked', recipientId: null }, { status: 'booked', recipientId: 1 }, { status: 'delivered', recipientId: 1 }]);
    expect(counts.map((c) => c.status)).toEqual(['in_progress', 'finished', 'booked', 'received', 'needs_fix', 'declined', 'checked', 'assigned', 'packed', 'delivered']);
    expect(counts.find((c) => c.status === 'booked')!.count).toBe(2);
    expect(counts.reduce((s, c) => s + c.count, 0)).toBe(3);
  });
});
