import { describe, expect, it } from 'vitest';
import { recipientProgress, statusCounts } from '../../src/features/progress/components/progress-data';

describe('drive progress figures', () => {
  it('puts the recipients that want the most first and keeps the server’s counts', () => {
    const rows = recipientProgress([
      { recipientId: 1, name: 'Newborn unit', wanted: 15, pledged: 9, finished: 4, inHand: 2, assigned: 1 },
      { recipientId: 2, name: 'Ward', wanted: 20, pledged: 1, finished: 1, inHand: 0, assigned: 1 },
      { recipientId: 3, name: 'Annexe', wanted: 15, pledged: 0, finished: 0, inHand: 0, assigned: 0 },
    ]);
    expect(rows).toEqual([
      { name: 'Ward', wanted: 20, pledged: 1, inHand: 0, assigned: 1 },
      { name: 'Annexe', wanted: 15, pledged: 0, inHand: 0, assigned: 0 },
      { name: 'Newborn unit', wanted: 15, pledged: 9, inHand: 2, assigned: 1 },
    ]);
  });
  it('shows every status in the order of a blanket’s life, zero where none stand', () => {
    const counts = statusCounts([
      { status: 'delivered', count: 1 },
      { status: 'booked', count: 2 },
    ]);
    expect(counts.map((c) => c.status)).toEqual(['in_progress', 'finished', 'booked', 'received', 'needs_fix', 'declined', 'checked', 'assigned', 'packed', 'delivered']);
    expect(counts.find((c) => c.status === 'booked')!.count).toBe(2);
    expect(counts.find((c) => c.status === 'received')!.count).toBe(0);
    expect(counts.reduce((s, c) => s + c.count, 0)).toBe(3);
  });
});
