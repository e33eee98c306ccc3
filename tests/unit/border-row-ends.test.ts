import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { foundationCounts, sideStitches, rowCount, ROW_END_ALLOWANCES, ROW_TYPES } from '@shared/border/row-ends';

describe('foundation counts', () => {
  it('plain rows take one stitch each; top and bottom one per stitch across', () => {
    expect(foundationCounts(30, 23)).toEqual({ top: 30, right: 23, bottom: 30, left: 23 });
    expect(rowCount(23)).toBe(23);
  });

  it('a repeating row pattern sums the allowances in order from the first row', () => {
    expect(sideStitches({ count: 23, pattern: ['sc', 'dc'] })).toBe(12 * 1 + 11 * 2);
    expect(sideStitches({ count: 24, pattern: ['sc', 'dc'] })).toBe(12 + 24);
    expect(sideStitches({ count: 3, pattern: ['dc', 'sc', 'sc', 'hdc'] })).toBe(2 + 1 + 1);
    expect(sideStitches({ count: 5, pattern: ['tr'] })).toBe(5 * ROW_END_ALLOWANCES.tr.stitches);
    expect(rowCount({ count: 9, pattern: ['dc'] })).toBe(9);
  });

  it('rejects empty or broken rows, naming the field', () => {
    expect(() => sideStitches(0)).toThrow(/rows/);
    expect(() => sideStitches({ count: 0, pattern: ['sc'] })).toThrow(/rows.count/);
    expect(() => sideStitches({ count: 4, pattern: [] })).toThrow(/rows.pattern/);
    expect(() => sideStitches({ count: 4, pattern: ['zz' as never] })).toThrow(/unknown row type/);
    expect(() => foundationCounts(1.5, 3)).toThrow(/across/);
  });

  it('a pattern of one type is that allowance times the rows', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 2000 }), fc.constantFrom(...ROW_TYPES), (count, type) => {
        expect(sideStitches({ count, pattern: [type] })).toBe(count * ROW_END_ALLOWANCES[type].stitches);
      }),
    );
  });
});
