import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { layoutDrawing } from '../../src/features/planner/components/drawing-geometry';
import { computePlanner, parsePatternText, toPlanInput, DEFAULTS, defaultDepth, initialPlannerState, followSwatch, countsInUse, type PlannerState } from '../../src/features/planner/hooks/use-planner';
import { rowCount } from '@shared/border/row-ends';
import { planBorder } from '@shared/border/plan';
import { BORDER_LIBRARY, borderById, borderPlanOptions } from '@shared/border/library';
import { EDGE_ORDER } from '@shared/border/round';
import { PlanInputSchema } from '@shared/schemas/plan';
import * as checks from '@shared/schemas/border-fit';

const shell = borderById('five-dc-shell')!;
const state = (patch: Partial<PlannerState> = {}): PlannerState => ({ ...DEFAULTS, borderDepth: defaultDepth(shell, 'cm'), depthTouched: false, countsTouched: true, ...patch });

describe('the planner screen state', () => {
  it('starts from our own example, not the check values of the border maths', () => {
    expect([DEFAULTS.across, DEFAULTS.rows]).toEqual(['42', '31']);
    for (const v of [DEFAULTS.across, DEFAULTS.rows, DEFAULTS.gaugeStitches, DEFAULTS.gaugeRows]) expect(['30', '23', '25', '17']).not.toContain(v);
  });

  it('plans 30 × 23 plain rows with the five-dc shell as the shared engine does', () => {
    const r = computePlanner(state({ across: '30', rows: '23', rowPreset: 'plain' }), checks);
    expect(r.errors.across).toBeUndefined();
    expect(r.plan?.edges.top).toMatchObject({ change: 3, fitted: 33 });
    expect(r.plan?.edges.right).toMatchObject({ change: 2, fitted: 25 });
    expect(r.plan).toEqual(planBorder({ across: 30, rows: 23, multiple: 4, offset: 1, lead: shell.lead, centre: shell.centre, strategy: 'add', mode: 'per-edge' }));
  });

  it('names the field of a bad count in the words on screen and keeps the text', () => {
    const s = state({ across: '2500', rows: '-3' });
    const r = computePlanner(s, checks);
    expect(r.errors.across).toMatch(/^Stitches across over 2,000/);
    expect(r.errors.rows).toMatch(/^Rows must be at least 1/);
    expect(r.plan).toBeNull();
    expect(s.across).toBe('2500');
    expect(computePlanner(state({ across: '' }), checks).errors.across).toMatch(/enter/);
    expect(computePlanner(state({ across: '12.5' }), checks).errors.across).toMatch(/whole number/);
  });

  it('reads a custom row pattern in the chosen terms: UK "dc, tr" is US "sc, dc"', () => {
    expect(parsePatternText('dc, tr', 'uk')).toEqual({ pattern: ['sc', 'dc'] });
    expect(parsePatternText('sc dc', 'us')).toEqual({ pattern: ['sc', 'dc'] });
    expect(parsePatternText('sc, puff', 'us').error).toMatch(/"puff"/);
    expect(parsePatternText('hdc', 'uk').error).toMatch(/"hdc"/);
  });

  it('saves only what the server accepts', () => {
    const s = state();
    const input = toPlanInput(s, computePlanner(s, checks));
    expect(input).not.toBeNull();
    expect(PlanInputSchema.safeParse(input).success).toBe(true);
    expect(toPlanInput(state({ across: 'x' }), computePlanner(state({ across: 'x' }), checks))).toBeNull();
  });

  it('estimates yarn and sizes only from a valid swatch', () => {
    expect(computePlanner(state(), checks).yarn?.totalMetres).toBeGreaterThan(0);
    const r = computePlanner(state({ gaugeStitches: '0' }), checks);
    expect(r.gauge).toBeNull();
    expect(r.yarn).toBeNull();
    expect(r.errors.gaugeStitches).toMatch(/^Swatch stitches/);
  });
});

describe('the blanket drawing', () => {
  it('marks each changed stitch once: 3 on top and bottom, 2 on each side for 30 × 23', () => {
    const plan = planBorder({ across: 30, rows: 23, multiple: 4, offset: 1, lead: 1, centre: 1 });
    const d = layoutDrawing(plan, shell, 30, 23, 23, 640);
    const by = (edge: string) => d.marks.filter((m) => m.edge === edge).length;
    expect([by('top'), by('right'), by('bottom'), by('left')]).toEqual([3, 2, 3, 2]);
    expect(d.repeats).toHaveLength(plan.round.repeats);
    expect(d.corners.filter((c) => c.centred)).toHaveLength(4);
  });

  it('puts every mark on its own edge of the foundation line, in working order', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 3, max: 400 }),
        fc.integer({ min: 3, max: 400 }),
        fc.constantFrom(...BORDER_LIBRARY),
        fc.constantFrom('add' as const, 'fewest' as const),
        fc.constantFrom('per-edge' as const, 'continuous' as const),
        fc.integer({ min: 260, max: 1200 }),
        (across, rows, border, strategy, mode, width) => {
          const plan = planBorder({ across, rows, ...borderPlanOptions(border, mode), strategy, mode });
          const d = layoutDrawing(plan, border, across, rows, rows, width);
          const f = d.foundation;
          const eps = 1e-6;
          for (const edge of EDGE_ORDER) {
            const marks = d.marks.filter((m) => m.edge === edge);
            expect(marks.length).toBe(new Set(plan.edges[edge].positions).size);
            for (const m of marks) {
              if (edge === 'top') expect(Math.abs(m.y - f.y)).toBeLessThan(eps);
              if (edge === 'bottom') expect(Math.abs(m.y - (f.y + f.h))).toBeLessThan(eps);
              if (edge === 'right') expect(Math.abs(m.x - (f.x + f.w))).toBeLessThan(eps);
              if (edge === 'left') expect(Math.abs(m.x - f.x)).toBeLessThan(eps);
            }
            // Counted from the corner where the edge begins: top runs left to right, bottom right to left.
            const along = marks.map((m) => (edge === 'top' ? m.x : edge === 'right' ? m.y : edge === 'bottom' ? -m.x : -m.y));
            expect(along).toEqual([...along].sort((a, b) => a - b));
          }
          for (const s of [...d.marks, ...d.repeats]) {
            expect(s.x).toBeGreaterThanOrEqual(0);
            expect(s.y).toBeGreaterThanOrEqual(0);
            expect(s.x).toBeLessThanOrEqual(d.width);
            expect(s.y).toBeLessThanOrEqual(d.height);
          }
          expect(d.repeats.length).toBe(border.multiple === 1 ? 0 : plan.round.repeats);
        },
      ),
      { numRuns: 150 },
    );
  });

  it('squeezes a very long, thin blanket and says so', () => {
    const plan = planBorder({ across: 600, rows: 20, multiple: 4, offset: 1 });
    const d = layoutDrawing(plan, shell, 600, 20, 20, 640);
    expect(d.squeezed).toBe(true);
    expect(d.body.w / d.body.h).toBeCloseTo(5, 5);
  });
});

describe('one set of counts for the plan, the swatch panel and the yarn estimate', () => {
  it('80 × 100 cm at 15 sts and 11 rows per 10 cm: the plan and the yarn estimate use the 111 × 103 the swatch panel gives', () => {
    const s = initialPlannerState();
    const r = computePlanner(s, checks);
    expect(r.sizing).toMatchObject({ stitches: 111, rows: 103 });
    expect([r.across, rowCount(r.rows!)]).toEqual([111, 103]);
    // The yarn is worked out for the same body the swatch panel describes.
    expect(r.sizes!.body.width).toBeCloseTo(r.sizing!.body.width, 6);
    expect(r.sizes!.body.length).toBeCloseTo(r.sizing!.body.length, 6);
    expect(countsInUse(s, r)).toEqual({ source: 'swatch', matchesSwatch: true });
    // What the plan saves (and prints) carries those counts.
    expect(toPlanInput(s, r)).toMatchObject({ across: 111 });
  });

  it('counts the maker typed are kept, said to be their own, and the yarn follows them', () => {
    const s = followSwatch({ ...initialPlannerState(), across: '42', rows: '31', countsTouched: true }, checks);
    const r = computePlanner(s, checks);
    expect(r.across).toBe(42);
    expect(countsInUse(s, r)).toEqual({ source: 'own', matchesSwatch: false });
    expect(r.sizes!.body.width).toBeLessThan(r.sizing!.body.width);
  });

  it('until the maker types counts, changing the swatch changes the plan', () => {
    const s = followSwatch({ ...initialPlannerState(), gaugeStitches: '20' }, checks);
    expect(computePlanner(s, checks).across).toBe(computePlanner(s, checks).sizing!.stitches);
    expect(Number(s.across)).toBeGreaterThan(111);
  });
});

describe('before the checks have loaded', () => {
  const figures = (r: ReturnType<typeof computePlanner>) => ({ across: r.across, rows: r.rows, plan: r.plan, gauge: r.gauge, sizing: r.sizing, sizes: r.sizes, yarn: r.yarn });

  it('draws the same plan, sizes and yarn as the checked planner for whatever the checks accept', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 600 }),
        fc.integer({ min: 1, max: 600 }),
        fc.constantFrom('hdc' as const, 'sc-dc' as const, 'plain' as const),
        fc.constantFrom(...BORDER_LIBRARY.map((b) => b.id)),
        fc.constantFrom('cm' as const, 'in' as const),
        fc.integer({ min: 5, max: 40 }),
        fc.integer({ min: 5, max: 40 }),
        fc.boolean(),
        (across, rows, rowPreset, borderId, unit, gaugeStitches, gaugeRows, countsTouched) => {
          const s = state({ across: String(across), rows: String(rows), rowPreset, borderId, unit, gaugeStitches: String(gaugeStitches), gaugeRows: String(gaugeRows), countsTouched });
          const checked = computePlanner(s, checks);
          const unchecked = computePlanner(s, null);
          // Every figure the checked planner shows, the unchecked one shows the same.
          const a = figures(unchecked);
          const b = figures(checked);
          for (const key of Object.keys(b) as Array<keyof typeof b>) if (b[key] != null) expect(a[key]).toEqual(b[key]);
          if (checked.sizing) expect(followSwatch(s, null)).toEqual(followSwatch(s, checks));
        },
      ),
      { numRuns: 200 },
    );
    expect(computePlanner(initialPlannerState(), null).plan).not.toBeNull();
  });

  it('names only a blank field, works from nothing it cannot use, and leaves the rest to the checks', () => {
    const blank = computePlanner(state({ across: '' }), null);
    expect(blank.errors.across).toMatch(/enter/);
    const bad = computePlanner(state({ across: '2500', rows: '-3', gaugeStitches: '0' }), null);
    expect(bad.plan).toBeNull();
    expect(bad.gauge).toBeNull();
    expect(bad.errors).toEqual({});
    expect(computePlanner(state({ across: '12.5' }), null).across).toBeUndefined();
  });
});
