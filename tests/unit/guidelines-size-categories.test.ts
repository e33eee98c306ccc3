import { describe, expect, it } from 'vitest';
import { SIZE_CATEGORIES } from '@shared/schemas/blanket';
import { toCm } from '@shared/sizing/units';
import { SIZE_CATEGORY_TABLE, sizeCategoryFor, sizeCategoryRow } from '@shared/guidelines/size-categories';

const inchesToCm = (inches: number) => toCm(inches, 'in');

describe('size category table', () => {
  it('has one row for each size category, in the schema order', () => {
    expect(SIZE_CATEGORY_TABLE.map((r) => r.category)).toEqual([...SIZE_CATEGORIES]);
  });

  it.each(SIZE_CATEGORY_TABLE.map((r) => [r.category, r]))('%s: nominal sits inside its span', (_, row) => {
    const { nominalCm: n, rangeCm: r, nominalIn, rangeIn } = row;
    expect(r.minWidth).toBeLessThanOrEqual(n.width);
    expect(n.width).toBeLessThanOrEqual(r.maxWidth);
    expect(r.minLength).toBeLessThanOrEqual(n.length);
    expect(n.length).toBeLessThanOrEqual(r.maxLength);
    expect(nominalIn.width).toBeLessThanOrEqual(nominalIn.length);
    expect(n.width).toBeCloseTo(inchesToCm(nominalIn.width), 10);
    expect(r.maxLength).toBeCloseTo(inchesToCm(rangeIn.maxLength), 10);
    expect(row.source.length).toBeGreaterThan(0);
    expect(row.basis.length).toBeGreaterThan(0);
  });

  it('sizeCategoryRow throws for a name not in the table', () => {
    expect(() => sizeCategoryRow('king' as never)).toThrow(/Unknown size category/);
  });
});

describe('sizeCategoryFor', () => {
  it.each(SIZE_CATEGORY_TABLE.map((r) => [r.category, r]))('a nominal %s is a %s', (category, row) => {
    expect(sizeCategoryFor(row.nominalCm.width, row.nominalCm.length)).toBe(category);
  });

  it('does not care which way round it is measured', () => {
    expect(sizeCategoryFor(152.4, 127)).toBe('throw');
    expect(sizeCategoryFor(127, 152.4)).toBe('throw');
  });

  it('picks the nearest nominal where spans overlap', () => {
    // 32 × 36 in is inside both baby (22–36 square) and crib (27–34 × 33–42): crib is nearer.
    expect(sizeCategoryFor(inchesToCm(32), inchesToCm(36))).toBe('crib');
    expect(sizeCategoryFor(inchesToCm(29), inchesToCm(30))).toBe('baby');
  });

  it('a 21 in square falls in the bridged gap between preemie and baby', () => {
    expect(sizeCategoryFor(inchesToCm(21), inchesToCm(21))).not.toBeNull();
  });

  it.each([
    [10, 10],
    [20, 300],
    [400, 400],
    [0, 50],
    [-5, 50],
    [Number.NaN, 50],
    [50, Number.POSITIVE_INFINITY],
  ])('%s × %s cm fits no category', (w, l) => {
    expect(sizeCategoryFor(w, l)).toBeNull();
  });
});
