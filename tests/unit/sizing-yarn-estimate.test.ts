import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { estimateYarn, yardsPerSqIn, YARN_PER_AREA } from '@shared/sizing/yarn-estimate';

describe('yarn per area table', () => {
  it('keeps the measured #4 value and scales the others by gauge midpoint', () => {
    expect(yardsPerSqIn(4)).toBe(0.87);
    expect(yardsPerSqIn(3)).toBeCloseTo((0.87 * 14.5) / 12.5, 12);
    expect(yardsPerSqIn(5)).toBeCloseTo((0.87 * 9.5) / 12.5, 12);
    expect(YARN_PER_AREA.find((r) => r.category === 4)?.basis).toBe('measured (rule of thumb)');
    expect(YARN_PER_AREA.filter((r) => r.basis === 'scaled estimate')).toHaveLength(6);
    expect(() => yardsPerSqIn(0)).toThrow(/yarn weight 0/);
  });

  it('uses less yarn per square inch the heavier the yarn', () => {
    for (let i = 1; i < YARN_PER_AREA.length; i++) {
      expect(YARN_PER_AREA[i]!.yardsPerSqIn).toBeLessThan(YARN_PER_AREA[i - 1]!.yardsPerSqIn);
    }
  });
});

describe('estimateYarn', () => {
  it('a 36 × 36 in worsted blanket: 1296 sq in × 0.87 = 1127.52 yd, + 10 % → 1241 yd, 1135 m, 7 skeins of 200 yd', () => {
    const e = estimateYarn({ body: { width: 36, length: 36, unit: 'in' }, yarnWeight: 4, skein: { length: 200, unit: 'yd' } });
    expect(e.bodyYards).toBeCloseTo(1127.52, 9);
    expect(e.borderYards).toBe(0);
    expect(e.totalYards).toBe(1241);
    expect(e.totalMetres).toBe(1135);
    expect(e.skeins).toBe(7);
    expect(e.note).toMatch(/rule of thumb/i);
  });

  it('adds a border frame: (38 × 38 − 36 × 36) sq in × 0.87 × factor', () => {
    const e = estimateYarn({ body: { width: 36, length: 36, unit: 'in' }, yarnWeight: 4, border: { depth: 1, yarnFactor: 1.5 }, margin: 0 });
    expect(e.borderYards).toBeCloseTo(148 * 0.87 * 1.5, 9);
    expect(e.totalYards).toBe(Math.ceil(1127.52 + 148 * 0.87 * 1.5));
  });

  it('takes centimetres, metre skeins and a maker’s own rate', () => {
    const e = estimateYarn({
      body: { width: 91.44, length: 91.44, unit: 'cm' },
      yarnWeight: 4,
      skein: { length: 100, unit: 'm' },
      yardsPerSqIn: 1,
      margin: 0,
    });
    expect(e.bodyYards).toBeCloseTo(1296, 9);
    expect(e.totalMetres).toBe(Math.ceil(1296 * 0.9144));
    expect(e.skeins).toBe(12);
    expect(e.note).toMatch(/your own measurement/);
  });

  it('does not round an exact whole number up by a float crumb', () => {
    const e = estimateYarn({ body: { width: 10, length: 10, unit: 'in' }, yarnWeight: 4, yardsPerSqIn: 1, margin: 0, skein: { length: 50, unit: 'yd' } });
    expect(e.totalYards).toBe(100);
    expect(e.skeins).toBe(2);
  });

  it('rejects nonsense, naming what is wrong', () => {
    expect(() => estimateYarn({ body: { width: 0, length: 5, unit: 'in' }, yarnWeight: 4 })).toThrow(/body/);
    expect(() => estimateYarn({ body: { width: 5, length: 5, unit: 'in' }, yarnWeight: 4, margin: 2 })).toThrow(/margin/);
    expect(() => estimateYarn({ body: { width: 5, length: 5, unit: 'in' }, yarnWeight: 0 })).toThrow(/yarn weight/);
    expect(() => estimateYarn({ body: { width: 5, length: 5, unit: 'in' }, yarnWeight: 4, skein: { length: 0, unit: 'm' } })).toThrow(/skein/);
  });

  it('totals are rounded up, never below the estimate with its margin', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 5, max: 400, noNaN: true }),
        fc.double({ min: 5, max: 400, noNaN: true }),
        fc.integer({ min: 1, max: 7 }),
        fc.double({ min: 0, max: 0.5, noNaN: true }),
        (w, l, weight, margin) => {
          const e = estimateYarn({ body: { width: w, length: l, unit: 'cm' }, yarnWeight: weight, margin, skein: { length: 150, unit: 'm' } });
          const need = e.subtotalYards * (1 + margin);
          expect(e.totalYards).toBeGreaterThanOrEqual(need - 1e-6);
          expect(e.totalYards).toBeLessThan(need + 1);
          expect(e.skeins! * 150).toBeGreaterThanOrEqual(need * 0.9144 - 1e-6);
        },
      ),
    );
  });
});
