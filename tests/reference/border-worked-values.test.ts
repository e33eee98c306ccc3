import { describe, it, expect } from 'vitest';
import { fitEdge } from '@shared/border/fit';
import {
  CORNER_STITCHES,
  ROW_END_ALLOWANCES,
  ROW_END_COMMON_PRACTICE,
  ROW_END_EXTRAPOLATED,
} from '@shared/border/row-ends';
import { planBorder } from '@shared/border/plan';
import { BORDER_YARN_ADVICE } from '@shared/border/library';
import { usLabelForMm } from '@shared/sizing/hooks';

describe('multiple 4 plus 1: common practice (worked by hand)', () => {
  it.each([
    [25, 0, 25],
    [17, 0, 17],
    [30, 3, 33],
    [23, 2, 25],
  ])('common practice (worked by hand): %i stitches need %i more → %i', (count, more, fitted) => {
    expect(fitEdge(count, 4, 1, 'add')).toMatchObject({ change: more, fitted });
  });

  it('common practice (worked by hand): a 30 × 23 blanket gets a shell centred on each corner', () => {
    const plan = planBorder({ across: 30, rows: 23, multiple: 4, offset: 1 });
    expect(plan.round.total).toBe(33 + 25 + 33 + 25 + 12);
    expect(plan.cornerReport.every((c) => c.centred)).toBe(true);
  });
});

describe('foundation round into row ends: common practice (no published source)', () => {
  it.each([
    ['sc', 1],
    ['hdc', 1],
    ['dc', 2],
  ] as const)('common practice (no published source): a %s row end takes %i stitch(es)', (row, stitches) => {
    expect(ROW_END_ALLOWANCES[row]).toEqual({ row, stitches, source: ROW_END_COMMON_PRACTICE });
    expect(ROW_END_COMMON_PRACTICE).toBe('common practice (no published source)');
  });

  it('common practice (no published source): 3 stitches in each corner stitch', () => {
    expect(CORNER_STITCHES).toBe(3);
    expect(planBorder({ across: 25, rows: 17, multiple: 4, offset: 1 }).corners).toEqual({ perCorner: 3, total: 12 });
  });

  it('tr and dtr row ends (from memory: turning chain less one, no published source)', () => {
    expect(ROW_END_ALLOWANCES.tr).toEqual({ row: 'tr', stitches: 3, source: ROW_END_EXTRAPOLATED });
    expect(ROW_END_ALLOWANCES.dtr).toEqual({ row: 'dtr', stitches: 4, source: ROW_END_EXTRAPOLATED });
    expect(ROW_END_EXTRAPOLATED).toMatch(/^from memory/);
  });
});

describe('yarn and hook for shell borders: common practice (no published source)', () => {
  it('common practice (no published source): medium (#4) yarn with a 5 mm (US H-8) hook, light (#3) if it ruffles', () => {
    expect(BORDER_YARN_ADVICE.source).toBe('common practice (no published source)');
    expect(BORDER_YARN_ADVICE.yarnWeight).toBe(4);
    expect(BORDER_YARN_ADVICE.hookMm).toBe(5);
    expect(usLabelForMm(BORDER_YARN_ADVICE.hookMm)).toBe('H-8');
    expect(BORDER_YARN_ADVICE.ruffleFix.yarnWeight).toBe(3);
  });
});
