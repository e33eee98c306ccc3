import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { planBorder } from '@shared/border/plan';
import { simulateRound } from '@shared/border/round';
import { BORDER_LIBRARY, borderById, borderPlanOptions } from '@shared/border/library';
import { fitEdge } from '@shared/border/fit';

/** The stitches each repeat takes, as round stitch numbers (wrapping past the end). */
function spans(starts: number[], multiple: number, total: number): number[] {
  return starts.flatMap((s) => Array.from({ length: multiple }, (_, i) => ((s - 1 + i) % total) + 1));
}

describe('per edge: a repeat begun in a corner is not counted again on the next edge', () => {
  it('41 × 29 rows of sc with a 6 + 1 border and 3-stitch corners: 24 repeats in 160 stitches, none on a corner', () => {
    const p = planBorder({ across: 41, rows: 29, multiple: 6, offset: 1, lead: 1, centre: 2 });
    expect(p.round.total).toBe(160);
    // 43 = 6·7 + 1 across, 31 = 6·5 + 1 down: 7 + 5 + 7 + 5 repeats between the corners.
    expect(p.round.repeats).toBe(24);
    expect(p.round.repeats * 6).toBeLessThanOrEqual(p.round.total);
    expect(p.cornerReport.some((c) => c.centred)).toBe(false);
    expect(p.notes.join(' ')).not.toMatch(/centred on every corner/);
    expect(p.notes.join(' ')).toMatch(/16 stitches between them/);
  });

  it('bobble dots at 61 × 45 no longer claim a bobble centred on every corner', () => {
    const b = borderById('bobble-dots')!;
    const p = planBorder({ across: 61, rows: 45, ...borderPlanOptions(b) });
    expect(p.round.repeats * b.multiple).toBeLessThanOrEqual(p.round.total);
    expect(p.notes).not.toContain('A repeat is centred on every corner.');
  });

  it('the wide scallop takes 5 stitches in each corner, so a scallop sits centred on every corner', () => {
    const b = borderById('wide-scallop')!;
    expect(b.cornerStitches).toBe(5);
    const p = planBorder({ across: 41, rows: 29, ...borderPlanOptions(b) });
    // 43 + 31 + 43 + 31 + 4 · 5 = 168 = 28 · 6: every stitch is in a repeat.
    expect(p.round.total).toBe(168);
    expect(p.round.repeats).toBe(28);
    expect(p.corners).toEqual({ perCorner: 5, total: 20 });
    expect(p.cornerReport.every((c) => c.centred)).toBe(true);
    expect(p.notes).toContain('Corners: work 5 hdc into each corner stitch (20 corner stitches in all).');
  });

  it('a repeat never shares a stitch with another one (per edge, any corner size)', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 400 }),
        fc.integer({ min: 1, max: 400 }),
        fc.integer({ min: 2, max: 12 }),
        fc.integer({ min: 0, max: 6 }),
        fc.integer({ min: 1, max: 7 }),
        fc.nat(),
        (top, right, multiple, offset, corner, c) => {
          const t = fitEdge(top, multiple, offset, 'add').fitted;
          const r = fitEdge(right, multiple, offset, 'add').fitted;
          const lead = Math.ceil(offset / 2);
          const centre = c % multiple;
          const sim = simulateRound({ top: t, right: r, bottom: t, left: r }, { multiple, mode: 'per-edge', lead, centre, cornerStitches: corner });
          const used = spans(sim.repeats.map((x) => x.start), multiple, sim.total);
          expect(new Set(used).size).toBe(used.length);
        },
      ),
    );
  });
});

describe('every library border: repeats × N never exceeds the round', () => {
  for (const b of BORDER_LIBRARY) {
    it(`${b.name} (${b.multiple} plus ${b.offset}), both modes, both strategies`, () => {
      fc.assert(
        fc.property(
          fc.integer({ min: 1, max: 600 }),
          fc.integer({ min: 1, max: 600 }),
          fc.constantFrom('per-edge' as const, 'continuous' as const),
          fc.constantFrom('add' as const, 'fewest' as const),
          (across, rows, mode, strategy) => {
            const p = planBorder({ across, rows, ...borderPlanOptions(b, mode), mode, strategy });
            expect(p.round.repeats * b.multiple).toBeLessThanOrEqual(p.round.total);
            // What the notes claim about the corners is what the simulation found.
            const all = p.cornerReport.every((c) => c.centred);
            expect(p.notes.includes('A repeat is centred on every corner.')).toBe(all);
          },
        ),
      );
    });
  }
});
