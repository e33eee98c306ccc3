import { describe, it, expect } from 'vitest';
import { HOOK_CHART_SOURCE, HOOK_SIZES, mmForUsLabel, usLabelForMm } from '@shared/sizing/hooks';

// Source: from memory. REFERENCES.md lists these pairs as agreeing across published charts, but no
// chart we can name was checked. Brands disagree on two: some give B-1 as 2.0 mm and C-2 as 2.5 mm.
const CHART = 'Crochet hook sizes, mm ↔ US (from memory)';

const PUBLISHED: [number, string][] = [
  [2.25, 'B-1'],
  [2.75, 'C-2'],
  [3.25, 'D-3'],
  [3.5, 'E-4'],
  [3.75, 'F-5'],
  [4.0, 'G-6'],
  [4.5, '7'],
  [5.0, 'H-8'],
  [5.5, 'I-9'],
  [6.0, 'J-10'],
  [6.5, 'K-10½'],
  [8.0, 'L-11'],
  [9.0, 'M/N-13'],
  [10.0, 'N/P-15'],
  [15, 'P/Q'],
  [16, 'Q'],
];

describe(CHART, () => {
  it('names its source', () => {
    expect(HOOK_CHART_SOURCE).toMatch(/^Crochet hook sizes, mm ↔ US: from memory/);
  });

  it(`${CHART}: exactly the published pairs, stored in mm`, () => {
    expect(HOOK_SIZES.map((h) => [h.mm, h.us])).toEqual(PUBLISHED);
  });

  it.each(PUBLISHED)(`${CHART}: %f mm ↔ %s`, (mm, us) => {
    expect(usLabelForMm(mm)).toBe(us);
    expect(mmForUsLabel(us)).toBe(mm);
  });

  it(`${CHART}: brands disagree on B-1 (2.0 vs 2.25 mm) and C-2 (2.5 vs 2.75 mm)`, () => {
    expect(HOOK_SIZES.find((h) => h.us === 'B-1')).toEqual({ mm: 2.25, us: 'B-1', brandVariantMm: 2.0 });
    expect(HOOK_SIZES.find((h) => h.us === 'C-2')).toEqual({ mm: 2.75, us: 'C-2', brandVariantMm: 2.5 });
    expect(HOOK_SIZES.filter((h) => h.brandVariantMm !== undefined)).toHaveLength(2);
  });
});
