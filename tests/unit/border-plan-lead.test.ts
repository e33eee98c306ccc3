import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { planBorder } from '@shared/border/plan';

const centred = (p: ReturnType<typeof planBorder>) => p.cornerReport.filter((c) => c.centred).length;

describe('continuous round: where the first repeat begins', () => {
  it('begins where the most corners get a centred repeat, and says so', () => {
    // 6 plus 1 round a 20 × 20 body: beginning after 1 stitch centres no corner, after 2 centres all four.
    const usual = planBorder({ across: 20, rows: 20, multiple: 6, offset: 1, mode: 'continuous', lead: 1, keepLead: true });
    const chosen = planBorder({ across: 20, rows: 20, multiple: 6, offset: 1, mode: 'continuous' });
    expect(centred(usual)).toBe(0);
    expect(chosen.lead).toBe(2);
    expect(centred(chosen)).toBe(4);
    expect(chosen.notes.some((n) => /after 2 stitches of the top edge rather than 1/.test(n))).toBe(true);
    // The round itself is the same: only where the repeats fall moves.
    expect(chosen.round.total).toBe(usual.round.total);
    expect(chosen.round.repeats).toBe(usual.round.repeats);
  });

  it('keeps the start when asked to, and treats a given lead as the usual start otherwise', () => {
    expect(planBorder({ across: 20, rows: 20, multiple: 6, offset: 1, mode: 'continuous', lead: 1, keepLead: true }).lead).toBe(1);
    expect(planBorder({ across: 20, rows: 20, multiple: 6, offset: 1, mode: 'continuous', lead: 1 }).lead).toBe(2);
  });

  it('leaves edge-by-edge plans as they were', () => {
    expect(planBorder({ across: 20, rows: 20, multiple: 6, offset: 1 }).lead).toBe(1);
  });

  it('never centres fewer corners than the usual start (property)', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 4, max: 200 }),
        fc.integer({ min: 4, max: 200 }),
        fc.integer({ min: 2, max: 12 }),
        fc.integer({ min: 0, max: 6 }),
        (across, rows, multiple, offset) => {
          const usual = planBorder({ across, rows, multiple, offset, mode: 'continuous', lead: Math.ceil(offset / 2), keepLead: true });
          const chosen = planBorder({ across, rows, multiple, offset, mode: 'continuous' });
          expect(centred(chosen)).toBeGreaterThanOrEqual(centred(usual));
          expect(chosen.lead).toBeGreaterThanOrEqual(0);
          expect(chosen.lead).toBeLessThan(Math.max(multiple, Math.ceil(offset / 2) + 1));
          if (chosen.lead === usual.lead) expect(chosen.cornerReport).toEqual(usual.cornerReport);
        },
      ),
      { numRuns: 300 },
    );
  });
});
