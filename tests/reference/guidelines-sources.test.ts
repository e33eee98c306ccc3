import { describe, expect, it } from 'vitest';
import {
  AAP_SAFE_SLEEP_2022,
  CPSC_CORDS_5095,
  CPSC_SMALL_PARTS,
  SMALL_PARTS_CYLINDER_IN,
  cautionsFor,
} from '@shared/guidelines/cautions';
import { CM_PER_INCH } from '@shared/sizing/units';
import { SIZE_CATEGORY_TABLE, sizeCategoryRow } from '@shared/guidelines/size-categories';

const caution = (id: string) => cautionsFor('preemie').find((c) => c.id === id);

describe('infant cautions name their published sources', () => {
  it('American Academy of Pediatrics, "Sleep-Related Infant Deaths: Updated 2022 Recommendations for Reducing Infant Deaths in the Sleep Environment", Pediatrics 150(1), 2022: no blanket in the sleep area', () => {
    expect(AAP_SAFE_SLEEP_2022).toBe(
      'American Academy of Pediatrics, "Sleep-Related Infant Deaths: Updated 2022 Recommendations for Reducing Infant Deaths in the Sleep Environment", Pediatrics 150(1), 2022',
    );
    const c = caution('infant.supervised-only');
    expect(c?.source).toBe(AAP_SAFE_SLEEP_2022);
    expect(c?.text).toMatch(/never leave it loose in a baby's sleep space/i);
  });

  it('US CPSC small parts rule, 16 CFR 1501: test cylinder 1.25 in across, 1.00 in deep at the short side, 2.25 in at the long side', () => {
    // US CPSC small parts rule, 16 CFR 1501
    expect(SMALL_PARTS_CYLINDER_IN).toEqual({ diameter: 1.25, shortDepth: 1.0, longDepth: 2.25 });
    const c = caution('infant.small-parts');
    expect(c?.source).toBe('US CPSC small parts rule, 16 CFR 1501');
    expect(c?.source).toBe(CPSC_SMALL_PARTS);
    expect(c?.text).toContain('1.25 in');
    expect(c?.text).toContain('1.00 to 2.25 in');
    // the same in cm at 2.54 cm to the inch: 3.175 cm, 2.54 to 5.715 cm, shown to 0.1 cm
    expect(c?.text).toContain('3.2 cm');
    expect(c?.text).toContain('2.5 to 5.7 cm');
    expect(c?.text).toMatch(/buttons, beads and safety eyes/i);
  });

  it('CPSC, "Strings, Cords, and Necklaces Can Strangle Infants" (doc 5095): no cords', () => {
    const c = caution('infant.no-cords');
    expect(c?.source).toBe('CPSC, "Strings, Cords, and Necklaces Can Strangle Infants" (doc 5095)');
    expect(c?.source).toBe(CPSC_CORDS_5095);
    expect(c?.text).toMatch(/cords, ribbons/i);
  });

  it('open stitches for infants: common practice (no published source)', () => {
    expect(caution('infant.open-stitches')?.source).toBe('common practice (no published source)');
  });

  it('elder cautions: common practice (no published source)', () => {
    for (const c of cautionsFor('elder').filter((x) => x.id.startsWith('elder.'))) {
      expect(c.source).toBe('common practice (no published source)');
    }
  });
});

describe('blanket size table: common practice (no published source)', () => {
  it('every row is marked common practice (no published source)', () => {
    for (const row of SIZE_CATEGORY_TABLE) expect(row.source).toBe('common practice (no published source)');
  });

  // Sizes charity drives publish, as collected in REFERENCES.md: common practice (no published source).
  it.each([
    ['preemie', 15, 20, 15, 20], // preemie/newborn 15–20 in square
    ['baby', 24, 36, 24, 36], // baby 24–36 in
    ['crib', 30, 30, 36, 36], // crib ~30 × 36 in
    ['child', 40, 40, 50, 60], // child 40 × 50–60 in
    ['teen', 45, 45, 65, 72], // teen 45 × 65–72 in
    ['lap', 36, 36, 48, 48], // lap ~36 × 48 in
    ['throw', 50, 50, 60, 60], // throw ~50 × 60 in
    ['twin', 66, 66, 90, 90], // twin ~66 × 90 in
  ] as const)('%s: the published %s–%s × %s–%s in lies inside the row and holds its nominal', (cat, w0, w1, l0, l1) => {
    const { rangeIn: r, nominalIn: n } = sizeCategoryRow(cat);
    expect(r.minWidth).toBeLessThanOrEqual(w0);
    expect(r.maxWidth).toBeGreaterThanOrEqual(w1);
    expect(r.minLength).toBeLessThanOrEqual(l0);
    expect(r.maxLength).toBeGreaterThanOrEqual(l1);
    expect(n.width).toBeGreaterThanOrEqual(w0);
    expect(n.width).toBeLessThanOrEqual(w1);
    expect(n.length).toBeGreaterThanOrEqual(l0);
    expect(n.length).toBeLessThanOrEqual(l1);
  });
});

describe('cm ↔ in at 2.54 exactly (the international inch of 1959, from memory)', () => {
  it('the size table converts through 1 in = 2.54 cm', () => {
    expect(CM_PER_INCH).toBe(2.54);
    expect(sizeCategoryRow('lap').nominalCm.width).toBeCloseTo(91.44, 10); // 36 in
    expect(sizeCategoryRow('throw').nominalCm.length).toBeCloseTo(152.4, 10); // 60 in
  });

  it('every row in cm is its inches × 2.54', () => {
    for (const row of SIZE_CATEGORY_TABLE) {
      expect(row.nominalCm.width).toBeCloseTo(row.nominalIn.width * 2.54, 10);
      expect(row.nominalCm.length).toBeCloseTo(row.nominalIn.length * 2.54, 10);
      expect(row.rangeCm.minWidth).toBeCloseTo(row.rangeIn.minWidth * 2.54, 10);
      expect(row.rangeCm.maxLength).toBeCloseTo(row.rangeIn.maxLength * 2.54, 10);
    }
    expect(sizeCategoryRow('twin').nominalCm).toEqual({ width: 66 * 2.54, length: 90 * 2.54 });
  });
});
