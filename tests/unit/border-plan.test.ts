import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { planBorder } from '@shared/border/plan';
import { EDGE_ORDER } from '@shared/border/round';
import { ROW_TYPES } from '@shared/border/row-ends';

describe('planBorder, per edge', () => {
  const plan = planBorder({ across: 30, rows: 23, multiple: 4, offset: 1, strategy: 'add' });

  it('fits top and sides to a multiple of 4 plus 1 and copies them to the opposite edges', () => {
    expect(plan.edges.top).toEqual({ count: 30, change: 3, fitted: 33, repeats: 8, positions: [7, 15, 23] });
    expect(plan.edges.right).toEqual({ count: 23, change: 2, fitted: 25, repeats: 6, positions: [8, 16] });
    expect(plan.edges.bottom).toEqual({ ...plan.edges.top, sameAs: 'top' });
    expect(plan.edges.left).toEqual({ ...plan.edges.right, sameAs: 'right' });
  });

  it('counts the corners and the round', () => {
    expect(plan.corners).toEqual({ perCorner: 3, total: 12 });
    expect(plan.round).toMatchObject({ before: 118, total: 128, change: 10, repeats: 32 });
    expect(plan.cornerReport.every((c) => c.centred)).toBe(true);
    expect(plan.mode).toBe('per-edge');
    expect(plan).toMatchObject({ lead: 1, centre: 1 });
  });

  it('says what to do on each edge in plain English', () => {
    expect(plan.sentences).toEqual({
      top: 'Top edge: work 2 hdc in the 7th, 15th and 23rd stitch (3 extra stitches, 33 in all).',
      right:
        'Right side: of the 23 stitches worked into the row ends, work an extra hdc into the same row end as the 8th and 16th (2 extra stitches, 25 in all).',
      bottom: 'Bottom edge: as the top edge, work 2 hdc in the 7th, 15th and 23rd stitch (3 extra stitches, 33 in all).',
      left:
        'Left side: as the right side, of the 23 stitches worked into the row ends, work an extra hdc into the same row end as the 8th and 16th (2 extra stitches, 25 in all).',
    });
    expect(plan.notes).toContain('Corners: work 3 hdc into each corner stitch (12 corner stitches in all).');
    expect(plan.notes).toContain('A repeat is centred on every corner.');
  });

  it("words skips for 'fewest'", () => {
    const p = planBorder({ across: 30, rows: 22, multiple: 4, offset: 1, strategy: 'fewest' });
    expect(p.edges.top).toMatchObject({ change: -1, fitted: 29, positions: [15] });
    expect(p.sentences.top).toBe('Top edge: skip the 15th stitch and work 1 hdc in each other stitch (1 fewer stitch, 29 in all).');
    expect(p.sentences.right).toBe(
      'Right side: of the 22 stitches worked into the row ends, leave out the 11th (1 fewer stitch, 21 in all).',
    );
  });

  it('says so when an edge already fits', () => {
    const p = planBorder({ across: 25, rows: 17, multiple: 4, offset: 1, strategy: 'add' });
    expect(p.sentences.top).toBe('Top edge: the 25 stitches already fit a multiple of 4 plus 1; work 1 hdc in each (25 in all).');
    expect(p.edges.right.positions).toEqual([]);
  });

  it('counts the sides from a row pattern: 23 rows of sc, dc → 12·1 + 11·2 = 34', () => {
    const p = planBorder({ across: 30, rows: { count: 23, pattern: ['sc', 'dc'] }, multiple: 4, offset: 1 });
    expect(p.edges.right).toMatchObject({ count: 34, change: 3, fitted: 37 });
    expect(p.strategy).toBe('add');
  });

  it('words a stitch that takes more than one extra stitch', () => {
    // 2 stitches across, multiple 8 plus 0: 6 extra over 2 stitches, 3 each.
    const p = planBorder({ across: 2, rows: 8, multiple: 8, offset: 0 });
    expect(p.edges.top.positions).toEqual([1, 1, 1, 2, 2, 2]);
    expect(p.sentences.top).toBe('Top edge: work 4 hdc in the 1st and 2nd stitch (6 extra stitches, 8 in all).');
    const q = planBorder({ across: 2, rows: 8, multiple: 5, offset: 0 });
    expect(q.sentences.top).toBe('Top edge: work 2 hdc in the 1st stitch and 3 hdc in the 2nd stitch (3 extra stitches, 5 in all).');
  });

  it('handles multiple 1 (a plain border): nothing changes', () => {
    const p = planBorder({ across: 30, rows: 23, multiple: 1, offset: 0, lead: 0, centre: 0 });
    for (const e of EDGE_ORDER) expect(p.edges[e].change).toBe(0);
    expect(p.round.total).toBe(118);
    expect(p.sentences.top).toBe('Top edge: the 30 stitches need no change; work 1 hdc in each (30 in all).');
  });

  it('rejects bad input with the field named', () => {
    expect(() => planBorder({ across: 0, rows: 23, multiple: 4, offset: 1 })).toThrow(/across/);
    expect(() => planBorder({ across: 30, rows: { count: 5, pattern: [] }, multiple: 4, offset: 1 })).toThrow(/pattern/);
    expect(() => planBorder({ across: 30, rows: 23, multiple: 4, offset: 1, centre: 4 })).toThrow(/centre/);
    expect(() => planBorder({ across: 30, rows: 23, multiple: 4, offset: 1, mode: 'spiral' as never })).toThrow(/mode/);
  });
});

describe('planBorder, continuous', () => {
  it('fits the whole round to a multiple of N and shares the change out', () => {
    const p = planBorder({ across: 30, rows: 23, multiple: 4, offset: 1, mode: 'continuous' });
    expect(p.round).toMatchObject({ before: 118, total: 120, change: 2, repeats: 30 });
    expect(p.edges.top).toMatchObject({ count: 30, change: 1, fitted: 31, positions: [15] });
    expect(p.edges.bottom).toMatchObject({ change: 1, sameAs: 'top' });
    expect(p.edges.right).toMatchObject({ change: 0, fitted: 23 });
    // Repeats per edge come from the simulation: whatever falls on the edge.
    expect(EDGE_ORDER.reduce((a, e) => a + p.edges[e].repeats, 0)).toBeLessThanOrEqual(30);
    // Shell centres at 3, 7, 11, ...: the corner middles are 33, 59, 93 and 119, so only 59 and 119 take one.
    expect(p.cornerReport.map((c) => [c.middleStitch, c.centred])).toEqual([
      [33, false],
      [59, true],
      [93, false],
      [119, true],
    ]);
    expect(p.notes.some((n) => n.includes('closes onto the first'))).toBe(true);
    expect(p.sentences.right).toBe(
      'Right side: the 23 stitches worked into the row ends need no change for the round; work them as they are (23 in all).',
    );
  });

  it('keeps opposite edges alike when the change splits evenly, and says so when it cannot', () => {
    // 30 + 25 + 30 + 25 + 12 = 122 → 124: +2, one each to top and bottom.
    const even = planBorder({ across: 30, rows: 25, multiple: 4, offset: 1, mode: 'continuous' });
    expect(even.edges.top.change).toBe(1);
    expect(even.edges.bottom).toMatchObject({ change: 1, sameAs: 'top' });
    expect(even.edges.left).toMatchObject({ change: 0, sameAs: 'right' });

    // 30 + 22 + 30 + 22 + 12 = 116 → 120 (multiple 5): +4, one per edge.
    const four = planBorder({ across: 30, rows: 22, multiple: 5, offset: 0, mode: 'continuous' });
    expect(EDGE_ORDER.map((e) => four.edges[e].change)).toEqual([1, 1, 1, 1]);

    // 116 → 119 (multiple 7): +3 to top, bottom and right; the left side gets none.
    const odd = planBorder({ across: 30, rows: 22, multiple: 7, offset: 0, mode: 'continuous' });
    expect(EDGE_ORDER.map((e) => odd.edges[e].change)).toEqual([1, 1, 1, 0]);
    expect(odd.edges.left.sameAs).toBeUndefined();
    expect(odd.notes.at(-1)).toMatch(/opposite edges end with different counts/);
    expect(odd.sentences.left).toMatch(/^Left side: the 22 stitches/);
  });
});

describe('planBorder properties', () => {
  const rows = fc.oneof(
    fc.integer({ min: 1, max: 2000 }),
    fc.record({
      count: fc.integer({ min: 1, max: 2000 }),
      pattern: fc.array(fc.constantFrom(...ROW_TYPES), { minLength: 1, maxLength: 12 }),
    }),
  );
  const input = fc.record({
    across: fc.integer({ min: 1, max: 2000 }),
    rows,
    multiple: fc.integer({ min: 2, max: 60 }),
    offset: fc.integer({ min: 0, max: 100 }),
    strategy: fc.constantFrom('add' as const, 'fewest' as const),
    mode: fc.constantFrom('per-edge' as const, 'continuous' as const),
  });

  it('round total = fitted edges + corners; continuous rounds close; per-edge edges fit N·k + M', () => {
    fc.assert(
      fc.property(input, (inp) => {
        const p = planBorder(inp);
        const sum = EDGE_ORDER.reduce((a, e) => a + p.edges[e].fitted, 0);
        expect(p.round.total).toBe(sum + p.corners.total);
        expect(p.round.total - p.round.before).toBe(p.round.change);
        for (const e of EDGE_ORDER) {
          const edge = p.edges[e];
          expect(edge.fitted).toBe(edge.count + edge.change);
          expect(edge.fitted).toBeGreaterThanOrEqual(1);
          expect(edge.positions).toHaveLength(Math.abs(edge.change));
          for (const pos of edge.positions) {
            expect(pos).toBeGreaterThanOrEqual(1);
            expect(pos).toBeLessThanOrEqual(edge.count);
          }
          if (p.mode === 'per-edge') {
            expect((edge.fitted - inp.offset) % inp.multiple).toBe(0);
            expect(edge.fitted).toBeGreaterThanOrEqual(inp.offset);
          }
        }
        if (p.mode === 'continuous') expect(p.round.total % inp.multiple).toBe(0);
        expect(p.edges.bottom.change).toBe(p.mode === 'per-edge' ? p.edges.top.change : p.edges.bottom.change);
        for (const e of EDGE_ORDER) expect(p.sentences[e]).toMatch(/\(\d+ (extra|fewer) stitch|in all\)\.$/);
      }),
      { numRuns: 60 },
    );
  });
});
