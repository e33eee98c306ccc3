import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { fitEdge, fitDown, fitUp, nearestFit } from '@shared/border/fit';

const legal = (x: number, n: number, m: number) => x >= m && x >= 1 && (x - m) % n === 0;

describe('fitEdge', () => {
  it('adds the fewest stitches that reach a multiple of 4 plus 1', () => {
    expect(fitEdge(30, 4, 1, 'add')).toEqual({ count: 30, change: 3, fitted: 33, repeats: 8 });
    expect(fitEdge(26, 4, 1, 'add')).toEqual({ count: 26, change: 3, fitted: 29, repeats: 7 });
    expect(fitEdge(29, 4, 1, 'add')).toEqual({ count: 29, change: 0, fitted: 29, repeats: 7 });
  });

  it("defaults to 'add'", () => {
    expect(fitEdge(30, 4, 1)).toEqual(fitEdge(30, 4, 1, 'add'));
  });

  it("'fewest' skips when skipping changes fewer stitches, and adds on a tie", () => {
    expect(fitEdge(30, 4, 1, 'fewest')).toEqual({ count: 30, change: -1, fitted: 29, repeats: 7 });
    // 23: up 2 to 25 or down 2 to 21 — a tie, so add.
    expect(fitEdge(23, 4, 1, 'fewest')).toEqual({ count: 23, change: 2, fitted: 25, repeats: 6 });
    expect(fitEdge(24, 4, 1, 'fewest').change).toBe(1);
    expect(fitEdge(22, 4, 1, 'fewest').change).toBe(-1);
  });

  it('accepts an offset of the multiple or more ("a multiple of 4 plus 5")', () => {
    expect(fitEdge(3, 4, 5, 'add')).toEqual({ count: 3, change: 2, fitted: 5, repeats: 0 });
    expect(fitEdge(3, 4, 5, 'fewest')).toEqual({ count: 3, change: 2, fitted: 5, repeats: 0 });
    expect(fitEdge(6, 4, 5, 'fewest')).toEqual({ count: 6, change: -1, fitted: 5, repeats: 0 });
    expect(fitEdge(8, 4, 5, 'add')).toEqual({ count: 8, change: 1, fitted: 9, repeats: 1 });
  });

  it('never fits below the offset, or to zero stitches, when skipping', () => {
    // With offset 0, skipping 1 stitch to 0 would be "fewer" but is not a border.
    expect(fitEdge(1, 4, 0, 'fewest')).toEqual({ count: 1, change: 3, fitted: 4, repeats: 1 });
    expect(fitEdge(5, 4, 5, 'fewest').fitted).toBe(5);
    expect(fitEdge(2, 10, 1, 'fewest').fitted).toBe(1);
  });

  it('works for multiple 1 (plain borders): no change', () => {
    for (const count of [1, 2, 17, 200]) expect(fitEdge(count, 1, 0, 'add')).toMatchObject({ change: 0, fitted: count });
    expect(fitEdge(17, 1, 0, 'fewest')).toMatchObject({ change: 0, repeats: 17 });
  });

  it('rejects counts, multiples and offsets that are not whole numbers in range', () => {
    expect(() => fitEdge(-1, 4, 1)).toThrow(/count/);
    expect(() => fitEdge(2.5, 4, 1)).toThrow(/count/);
    expect(() => fitEdge(10, 0, 1)).toThrow(/multiple/);
    expect(() => fitEdge(10, 4, -1)).toThrow(/offset/);
    expect(() => fitEdge(10, 4, 1, 'sideways' as never)).toThrow(/strategy/);
  });
});

describe('fitUp, fitDown and nearestFit', () => {
  it('find the neighbouring legal counts', () => {
    expect(fitUp(30, 4, 1)).toBe(33);
    expect(fitDown(30, 4, 1)).toBe(29);
    expect(fitDown(4, 4, 5)).toBeUndefined();
    expect(fitDown(3, 4, 0)).toBeUndefined();
  });

  it('rounds an estimate to the nearest legal count', () => {
    expect(nearestFit(117.6, 2, 1)).toBe(117);
    expect(nearestFit(118.2, 2, 1)).toBe(119);
    expect(nearestFit(0.3, 2, 1)).toBe(1);
    expect(nearestFit(63.4, 1, 0)).toBe(63);
    expect(() => nearestFit(Number.NaN, 2, 1)).toThrow(/finite/);
  });
});

describe('fitEdge properties', () => {
  const arb = fc.record({
    count: fc.integer({ min: 0, max: 3000 }),
    n: fc.integer({ min: 1, max: 60 }),
    m: fc.integer({ min: 0, max: 100 }),
  });

  it('always lands on a legal count: fitted ≡ M (mod N), fitted ≥ M, fitted ≥ 1', () => {
    fc.assert(
      fc.property(arb, fc.constantFrom('add' as const, 'fewest' as const), ({ count, n, m }, strategy) => {
        const fit = fitEdge(count, n, m, strategy);
        expect(legal(fit.fitted, n, m)).toBe(true);
        expect(fit.fitted).toBe(count + fit.change);
        expect(fit.repeats).toBe((fit.fitted - m) / n);
        expect(Number.isInteger(fit.repeats)).toBe(true);
      }),
    );
  });

  it('changes fewer than N stitches whenever the count already reaches the offset', () => {
    fc.assert(
      fc.property(arb, fc.constantFrom('add' as const, 'fewest' as const), ({ count, n, m }, strategy) => {
        fc.pre(count >= m && count >= 1);
        expect(Math.abs(fitEdge(count, n, m, strategy).change)).toBeLessThan(n);
      }),
    );
  });

  it("'add' never skips; 'fewest' changes no more than 'add'", () => {
    fc.assert(
      fc.property(arb, ({ count, n, m }) => {
        const add = fitEdge(count, n, m, 'add');
        const fewest = fitEdge(count, n, m, 'fewest');
        expect(add.change).toBeGreaterThanOrEqual(0);
        expect(Math.abs(fewest.change)).toBeLessThanOrEqual(Math.abs(add.change));
      }),
    );
  });

  it("'add' and 'fewest' are optimal against a brute-force search", () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 0, max: 200 }),
        fc.integer({ min: 1, max: 12 }),
        fc.integer({ min: 0, max: 20 }),
        (count, n, m) => {
          let bestUp = Infinity;
          let bestAny = Infinity;
          for (let x = 1; x <= count + n + m + 1; x++) {
            if (!legal(x, n, m)) continue;
            if (x >= count) bestUp = Math.min(bestUp, x - count);
            bestAny = Math.min(bestAny, Math.abs(x - count));
          }
          expect(fitEdge(count, n, m, 'add').change).toBe(bestUp);
          const fewest = fitEdge(count, n, m, 'fewest');
          expect(Math.abs(fewest.change)).toBe(bestAny);
          // Ties add: a skip is chosen only when strictly fewer.
          if (fewest.change < 0) expect(-fewest.change).toBeLessThan(bestUp);
        },
      ),
    );
  });
});
