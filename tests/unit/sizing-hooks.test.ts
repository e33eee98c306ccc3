import { describe, it, expect } from 'vitest';
import { HOOK_SIZES, mmForUsLabel, usLabelForMm } from '@shared/sizing/hooks';
import { yarnWeight, YARN_WEIGHTS } from '@shared/sizing/yarn-weights';

describe('hook look-ups', () => {
  it('find the US label for a size in mm, brand variants included', () => {
    expect(usLabelForMm(5)).toBe('H-8');
    expect(usLabelForMm(2.0)).toBe('B-1');
    expect(usLabelForMm(2.5)).toBe('C-2');
    expect(usLabelForMm(0.1 + 0.2 + 2.45)).toBe('C-2');
    expect(usLabelForMm(7)).toBeUndefined();
  });

  it('read US labels however they are typed', () => {
    expect(mmForUsLabel('H-8')).toBe(5);
    expect(mmForUsLabel('h8')).toBe(5);
    expect(mmForUsLabel('K-10 1/2')).toBe(6.5);
    expect(mmForUsLabel('k10.5')).toBe(6.5);
    expect(mmForUsLabel('m/n 13')).toBe(9);
    expect(mmForUsLabel('7')).toBe(4.5);
    expect(mmForUsLabel('Z-99')).toBeUndefined();
  });

  it('keeps the chart in increasing millimetres', () => {
    for (let i = 1; i < HOOK_SIZES.length; i++) expect(HOOK_SIZES[i]!.mm).toBeGreaterThan(HOOK_SIZES[i - 1]!.mm);
  });
});

describe('yarn weight look-up', () => {
  it('finds each category and rejects the rest', () => {
    expect(yarnWeight(4).name).toBe('Medium');
    expect(YARN_WEIGHTS.map((r) => r.category)).toEqual([0, 1, 2, 3, 4, 5, 6, 7]);
    expect(() => yarnWeight(8)).toThrow(/0 to 7/);
  });
});
