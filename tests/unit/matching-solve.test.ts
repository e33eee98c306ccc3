import { describe, expect, it } from 'vitest';
import { solveMatching, type MatchProblem } from '@shared/matching/solve';
import { randomInstance } from '../fixtures/matching-instances';

/** Every way to place the rows (or leave them out), for instances small enough to list. */
function bruteForce(p: MatchProblem): { placed: number; cost: number } {
  let best = { placed: -1, cost: Infinity };
  const used = new Array<number>(p.capacities.length).fill(0);
  const walk = (i: number, placed: number, cost: number) => {
    if (i === p.rows.length) {
      if (placed > best.placed || (placed === best.placed && cost < best.cost)) best = { placed, cost };
      return;
    }
    walk(i + 1, placed, cost);
    for (const e of p.rows[i]!) {
      if (used[e.col]! >= p.capacities[e.col]!) continue;
      used[e.col]! += 1;
      walk(i + 1, placed + 1, cost + e.cost);
      used[e.col]! -= 1;
    }
  };
  walk(0, 0, 0);
  return best;
}

describe('solveMatching', () => {
  it('agrees with trying every placement on 150 small random instances', () => {
    for (let seed = 1; seed <= 150; seed++) {
      const p = randomInstance(seed, 1 + (seed % 7), 1 + (seed % 4), [0.3, 0.6, 1][seed % 3]!);
      // Capacities that do not add up to the rows, too.
      const q: MatchProblem = seed % 2 ? p : { ...p, capacities: p.capacities.map((c) => Math.max(0, c - 1)) };
      const got = solveMatching(q);
      const want = bruteForce(q);
      expect({ placed: got.placed, cost: got.cost }, `seed ${seed}`).toEqual(want);
    }
  });

  it('respects capacities and only uses listed pairs', () => {
    const p = randomInstance(42, 60, 6, 0.5);
    const s = solveMatching(p);
    const count = new Array<number>(6).fill(0);
    s.colOf.forEach((j, i) => {
      if (j < 0) return;
      count[j]! += 1;
      expect(p.rows[i]!.some((e) => e.col === j)).toBe(true);
    });
    count.forEach((c, j) => expect(c).toBeLessThanOrEqual(p.capacities[j]!));
  });

  it('places more before it saves cost: two cheap pairs lose to three dear ones', () => {
    // Row 0 could take column 0 cheaply, but only by leaving row 1 with nowhere to go.
    const s = solveMatching({
      rows: [[{ col: 0, cost: 0 }, { col: 1, cost: 100 }], [{ col: 0, cost: 100 }]],
      capacities: [1, 1],
    });
    expect(s.placed).toBe(2);
    expect(Array.from(s.colOf)).toEqual([1, 0]);
    expect(s.cost).toBe(200);
  });

  it('handles no rows, no columns and rows with no possible column', () => {
    expect(solveMatching({ rows: [], capacities: [] })).toMatchObject({ placed: 0, cost: 0 });
    const s = solveMatching({ rows: [[], []], capacities: [3] });
    expect(Array.from(s.colOf)).toEqual([-1, -1]);
  });

  it('refuses fractional or negative costs and unknown columns', () => {
    expect(() => solveMatching({ rows: [[{ col: 0, cost: 1.5 }]], capacities: [1] })).toThrow(/whole number/);
    expect(() => solveMatching({ rows: [[{ col: 0, cost: -1 }]], capacities: [1] })).toThrow(/whole number/);
    expect(() => solveMatching({ rows: [[{ col: 2, cost: 1 }]], capacities: [1] })).toThrow(/no column/);
  });
});
