import { describe, it, expect } from 'vitest';
import { CM_PER_INCH, METRES_PER_YARD, UNITS_SOURCE, fromCm, toCm, yardsToMetres, metresToYards } from '@shared/sizing/units';

// Source: international yard and pound agreement, 1959 — 1 in = 2.54 cm and 1 yd = 0.9144 m exactly.
describe('international yard and pound agreement, 1959', () => {
  it('1 in = 2.54 cm exactly (international yard and pound agreement, 1959)', () => {
    expect(UNITS_SOURCE).toBe('international yard and pound agreement, 1959');
    expect(CM_PER_INCH).toBe(2.54);
    expect(toCm(1, 'in')).toBe(2.54);
    expect(toCm(36, 'in')).toBeCloseTo(91.44, 12);
    expect(fromCm(2.54, 'in')).toBe(1);
    expect(toCm(7, 'cm')).toBe(7);
  });

  it('1 yd = 0.9144 m exactly (international yard and pound agreement, 1959)', () => {
    expect(METRES_PER_YARD).toBe(0.9144);
    expect(METRES_PER_YARD).toBeCloseTo((36 * CM_PER_INCH) / 100, 15);
    expect(yardsToMetres(100)).toBeCloseTo(91.44, 12);
    expect(metresToYards(0.9144)).toBe(1);
  });
});
