import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { perStitch, spreadPositions } from '@shared/border/spacing';

/** Plain stitches before the first change, between changes, and after the last. */
function runs(n: number, positions: number[]): number[] {
  const out = [positions[0]! - 1];
  for (let i = 1; i < positions.length; i++) out.push(positions[i]! - positions[i - 1]! - 1);
  out.push(n - positions[positions.length - 1]!);
  return out;
}

describe('spreadPositions', () => {
  it('spreads 3 extra stitches over a 30-stitch edge every 7 or 8 stitches', () => {
    const p = spreadPositions(30, 3);
    expect(p).toEqual([7, 15, 23]);
    expect(runs(30, p)).toEqual([6, 7, 7, 7]);
  });

  it('puts a single change near the middle', () => {
    expect(spreadPositions(30, 1)).toEqual([15]);
    expect(spreadPositions(3, 1)).toEqual([2]);
  });

  it('returns nothing for no change, even on an empty edge', () => {
    expect(spreadPositions(10, 0)).toEqual([]);
    expect(spreadPositions(0, 0)).toEqual([]);
  });

  it('keeps one plain stitch at each corner side when changes outnumber plain stitches', () => {
    // 8 stitches, 5 changes: 3 plain stitches for 6 runs, so some inner runs are empty.
    const p = spreadPositions(8, 5);
    expect(p).toEqual([2, 3, 4, 5, 7]);
    expect(runs(8, p)[0]).toBe(1);
    expect(runs(8, p).at(-1)).toBe(1);
  });

  it('uses the corner-side stitches only when nothing else is left (k > n − 2)', () => {
    expect(spreadPositions(4, 3)).toEqual([2, 3, 4]);
    expect(spreadPositions(4, 4)).toEqual([1, 2, 3, 4]);
    expect(spreadPositions(1, 1)).toEqual([1]);
    expect(spreadPositions(2, 1)).toEqual([2]);
  });

  it('repeats stitch numbers when there are more changes than stitches', () => {
    expect(spreadPositions(2, 3)).toEqual([1, 2, 2]);
    expect(spreadPositions(1, 3)).toEqual([1, 1, 1]);
    expect(perStitch(spreadPositions(2, 5))).toEqual([
      { stitch: 1, times: 2 },
      { stitch: 2, times: 3 },
    ]);
  });

  it('rejects impossible input', () => {
    expect(() => spreadPositions(0, 1)).toThrow(/no stitches/);
    expect(() => spreadPositions(-1, 0)).toThrow(/n must/);
    expect(() => spreadPositions(5, 1.5)).toThrow(/k must/);
  });
});

describe('spreadPositions properties', () => {
  const sane = fc
    .integer({ min: 3, max: 2000 })
    .chain((n) => fc.record({ n: fc.constant(n), k: fc.integer({ min: 1, max: n - 2 }) }));

  it('k ≤ n − 2: k distinct, strictly increasing positions within 2..n−1', () => {
    fc.assert(
      fc.property(sane, ({ n, k }) => {
        const p = spreadPositions(n, k);
        expect(p).toHaveLength(k);
        for (let i = 0; i < p.length; i++) {
          expect(p[i]).toBeGreaterThanOrEqual(2);
          expect(p[i]).toBeLessThanOrEqual(n - 1);
          if (i > 0) expect(p[i]).toBeGreaterThan(p[i - 1]!);
        }
      }),
    );
  });

  it('k ≤ n − 2: all k + 1 plain runs, the two end runs included, differ by at most one', () => {
    fc.assert(
      fc.property(sane, ({ n, k }) => {
        const r = runs(n, spreadPositions(n, k));
        expect(r.reduce((a, b) => a + b, 0)).toBe(n - k);
        expect(Math.max(...r) - Math.min(...r)).toBeLessThanOrEqual(1);
        expect(r[0]).toBeGreaterThanOrEqual(1);
        expect(r.at(-1)).toBeGreaterThanOrEqual(1);
      }),
    );
  });

  it('any k: the changes per stitch differ by at most one once k ≥ n, and the list has k entries', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 40 }), fc.integer({ min: 0, max: 200 }), (n, k) => {
        const p = spreadPositions(n, k);
        expect(p).toHaveLength(k);
        for (let i = 1; i < p.length; i++) expect(p[i]).toBeGreaterThanOrEqual(p[i - 1]!);
        for (const s of p) {
          expect(s).toBeGreaterThanOrEqual(1);
          expect(s).toBeLessThanOrEqual(n);
        }
        if (k <= n) expect(new Set(p).size).toBe(k);
        else {
          const times = perStitch(p).map((g) => g.times);
          expect(times).toHaveLength(n);
          expect(Math.max(...times) - Math.min(...times)).toBeLessThanOrEqual(1);
        }
      }),
    );
  });
});
