import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { bodyCountsFromGauge, finishedSizeFromCounts, gaugePerCm } from '@shared/sizing/gauge';
import { startingChain } from '@shared/sizing/turning-chains';

describe('gaugePerCm', () => {
  it('reads "per 4 in" as 10.16 cm, not 10 cm', () => {
    expect(gaugePerCm({ stitches: 16, rows: 12, over: 4, unit: 'in' }).stitchesPerCm).toBeCloseTo(16 / 10.16, 12);
    expect(gaugePerCm({ stitches: 14, rows: 10, over: 10, unit: 'cm' })).toEqual({ stitchesPerCm: 1.4, rowsPerCm: 1 });
    expect(() => gaugePerCm({ stitches: 0, rows: 10, over: 10, unit: 'cm' })).toThrow(/gauge.stitches/);
  });
});

describe('bodyCountsFromGauge', () => {
  it('subtracts the border on both sides and rounds to the body pattern (odd chain for 2 plus 1)', () => {
    // Body 84 × 104 cm at 1.4 st/cm and 1 row/cm: 117.6 stitches → 117 (odd, nearest), 104 rows.
    const plan = bodyCountsFromGauge({
      gauge: { stitches: 14, rows: 10, over: 10, unit: 'cm' },
      target: { width: 90, length: 110, unit: 'cm' },
      borderDepth: 3,
      bodyStitch: 'dc',
      stitchMultiple: 2,
      stitchOffset: 1,
      rowMultiple: 2,
    });
    expect(plan.exact.stitches).toBeCloseTo(117.6, 10);
    expect(plan.stitches).toBe(117);
    expect(plan.rows).toBe(104);
    // dc: the 3 turning chains count as the first dc, so 117 − 1 + 3 chains, first dc in the 4th.
    expect(plan.startingChain).toMatchObject({ chains: 119, firstStitchIntoChain: 4, countsAsStitch: true });
    expect(plan.body.width).toBeCloseTo(117 / 1.4, 10);
    expect(plan.finished.width).toBeCloseTo(117 / 1.4 + 6, 10);
    expect(plan.finished.unit).toBe('cm');
  });

  it('works in inches: 16 sts and 12 rows per 4 in, 30 × 36 in with a 1 in border', () => {
    const plan = bodyCountsFromGauge({
      gauge: { stitches: 16, rows: 12, over: 4, unit: 'in' },
      target: { width: 30, length: 36, unit: 'in' },
      borderDepth: 1,
      bodyStitch: 'sc',
    });
    expect(plan.stitches).toBe(112);
    expect(plan.rows).toBe(102);
    expect(plan.startingChain).toMatchObject({ chains: 113, firstStitchIntoChain: 2, countsAsStitch: false });
    expect(plan.finished.width).toBeCloseTo(30, 10);
    expect(plan.finished.length).toBeCloseTo(36, 10);
  });

  it('rejects a border that leaves no body', () => {
    expect(() =>
      bodyCountsFromGauge({
        gauge: { stitches: 14, rows: 10, over: 10, unit: 'cm' },
        target: { width: 10, length: 110, unit: 'cm' },
        borderDepth: 5,
        bodyStitch: 'dc',
      }),
    ).toThrow(/borderDepth/);
  });

  it('finishedSizeFromCounts is the reverse of bodyCountsFromGauge', () => {
    const back = finishedSizeFromCounts({ gauge: { stitches: 16, rows: 12, over: 4, unit: 'in' }, stitches: 112, rows: 102, borderDepth: 1, unit: 'in' });
    expect(back.body.width).toBeCloseTo(28, 10);
    expect(back.finished.length).toBeCloseTo(36, 10);
    const cm = finishedSizeFromCounts({ gauge: { stitches: 16, rows: 12, over: 4, unit: 'in' }, stitches: 112, rows: 102, borderDepth: 2.54, unit: 'cm' });
    expect(cm.finished.width).toBeCloseTo(30 * 2.54, 10);
  });

  it('round trip: the rounded counts land within one stitch and one row of the target', () => {
    fc.assert(
      fc.property(
        fc.record({
          sts: fc.integer({ min: 5, max: 40 }),
          rows: fc.integer({ min: 3, max: 40 }),
          width: fc.integer({ min: 40, max: 250 }),
          length: fc.integer({ min: 40, max: 250 }),
          border: fc.integer({ min: 0, max: 10 }),
          n: fc.integer({ min: 1, max: 12 }),
          m: fc.integer({ min: 0, max: 5 }),
        }),
        ({ sts, rows, width, length, border, n, m }) => {
          const gauge = { stitches: sts, rows, over: 10, unit: 'cm' as const };
          const plan = bodyCountsFromGauge({ gauge, target: { width, length, unit: 'cm' }, borderDepth: border, bodyStitch: 'hdc', stitchMultiple: n, stitchOffset: m });
          expect((plan.stitches - m) % n).toBe(0);
          expect(Math.abs(plan.stitches - plan.exact.stitches)).toBeLessThanOrEqual(Math.max(n / 2, m - plan.exact.stitches, 0) + 1e-9);
          const back = finishedSizeFromCounts({ gauge, stitches: plan.stitches, rows: plan.rows, borderDepth: border, unit: 'cm' });
          expect(back.finished.width).toBeCloseTo(plan.finished.width, 9);
          expect(Math.abs(back.finished.length - length)).toBeLessThanOrEqual(0.5 / (rows / 10) + 1e-9);
        },
      ),
    );
  });
});

describe('startingChain', () => {
  it('adds the turning chain, less the first stitch where the chain counts as one', () => {
    expect(startingChain(20, 'sc')).toMatchObject({ chains: 21, firstStitchIntoChain: 2 });
    expect(startingChain(20, 'hdc')).toMatchObject({ chains: 21, firstStitchIntoChain: 3 });
    expect(startingChain(20, 'dc')).toMatchObject({ chains: 22, firstStitchIntoChain: 4 });
    expect(startingChain(20, 'tr')).toMatchObject({ chains: 23, firstStitchIntoChain: 5 });
    expect(startingChain(20, 'dc').note).toBe(
      'Chain 22; work the first dc into the 4th chain from the hook. The 3 skipped chains count as the first stitch, so the row has 20 stitches.',
    );
    expect(startingChain(1, 'sc').note).toMatch(/2nd chain from the hook/);
    expect(() => startingChain(0, 'sc')).toThrow(/stitches/);
  });
});
