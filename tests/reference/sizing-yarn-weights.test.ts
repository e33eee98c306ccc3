import { describe, it, expect } from 'vitest';
import {
  CATEGORY_6_GAUGE_BEFORE_2015,
  CATEGORY_6_HOOK_MM_ALTERNATIVE,
  CYC_SOURCE,
  REGIONAL_NAMES_SOURCE,
  REGIONAL_YARN_NAMES,
  YARN_WEIGHTS,
} from '@shared/sizing/yarn-weights';

// Source: Craft Yarn Council — Standard Yarn Weight System (crochet columns), as reprinted in craft
// magazines (e.g. Crochet World, Oct 2018); the council marks all of it "guidelines only".
const CYC = 'Craft Yarn Council — Standard Yarn Weight System (crochet columns)';

describe(`${CYC}`, () => {
  it('names its source', () => {
    expect(CYC_SOURCE).toContain(CYC);
    expect(CYC_SOURCE).toContain('guidelines only');
  });

  it.each([
    // [#, name, typical yarns, gauge min, max, stitch, hook mm min, max, hook US]
    [0, 'Lace', ['fingering', 'size-10 thread'], 32, 42, 'dc', 1.5, 2.25, 'steel 8 to B-1'],
    [1, 'Super Fine', ['sock', 'fingering', 'baby'], 21, 32, 'sc', 2.25, 3.5, 'B-1 to E-4'],
    [2, 'Fine', ['sport', 'baby'], 16, 20, 'sc', 3.5, 4.5, 'E-4 to 7'],
    [3, 'Light', ['DK', 'light worsted'], 12, 17, 'sc', 4.5, 5.5, '7 to I-9'],
    [4, 'Medium', ['worsted', 'afghan', 'aran'], 11, 14, 'sc', 5.5, 6.5, 'I-9 to K-10½'],
    [5, 'Bulky', ['chunky', 'craft', 'rug'], 8, 11, 'sc', 6.5, 9, 'K-10½ to M/N-13'],
    [6, 'Super Bulky', ['super chunky', 'roving'], 6, 9, 'sc', 9, 16, 'M/N-13 to Q'],
    [7, 'Jumbo', ['jumbo', 'roving'], null, 5, 'sc', 16, null, 'Q and larger'],
  ] as const)(`${CYC}: category %i (%s)`, (category, name, yarns, gMin, gMax, stitch, hMin, hMax, us) => {
    const row = YARN_WEIGHTS.find((r) => r.category === category)!;
    expect(row.name).toBe(name);
    expect(row.typicalYarns).toEqual(yarns);
    expect(row.crochetGauge).toEqual({ min: gMin, max: gMax, stitch });
    expect(row.hookMm).toEqual({ min: hMin, max: hMax });
    expect(row.hookUs).toBe(us);
  });

  it(`${CYC}: category 6 gauge before 2015 was 5–9; some reprints give its hooks as 9–15 mm (unresolved)`, () => {
    expect(CATEGORY_6_GAUGE_BEFORE_2015).toEqual({ min: 5, max: 9 });
    expect(CATEGORY_6_HOOK_MM_ALTERNATIVE).toEqual({ min: 9, max: 15 });
    const six = YARN_WEIGHTS.find((r) => r.category === 6)!;
    expect(six.notes.join(' ')).toMatch(/Before 2015/);
    expect(six.notes.join(' ')).toMatch(/9–15 mm.*unresolved/);
  });

  it(`${CYC}: category 7 was added in 2015`, () => {
    expect(YARN_WEIGHTS.find((r) => r.category === 7)!.notes).toContain('Added in 2015.');
  });
});

describe('regional yarn names: common practice (no published source)', () => {
  it('are marked as common practice and cover every category', () => {
    expect(REGIONAL_NAMES_SOURCE).toMatch(/^common practice \(no published source\)/);
    expect(REGIONAL_YARN_NAMES.map((r) => r.category)).toEqual([0, 1, 2, 3, 4, 5, 6, 7]);
    // DK and aran as UK names appear among the council's own typical yarns for #3 and #4.
    expect(REGIONAL_YARN_NAMES.find((r) => r.category === 3)!.uk).toBe('DK');
    expect(REGIONAL_YARN_NAMES.find((r) => r.category === 4)!.uk).toBe('aran');
    expect(REGIONAL_YARN_NAMES.find((r) => r.category === 3)!.au).toBe('8-ply');
  });
});
