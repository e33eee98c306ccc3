import { describe, expect, it } from 'vitest';
import { FEATURES, POPULATIONS, type BlanketFields, type Population } from '@shared/schemas/blanket';
import { GuidelineSetSchema } from '@shared/schemas/guidelines';
import { check } from '@shared/guidelines/check';
import { defaultGuidelines } from '@shared/guidelines/defaults';
import { sizeCategoryRow } from '@shared/guidelines/size-categories';
import type { SizeCategory } from '@shared/schemas/blanket';
import { plainBlanket } from '../fixtures/blankets';

/** A blanket of the category's nominal size, plain acrylic, from a smoke- and pet-free home. */
const nominal = (category: SizeCategory, over: Partial<BlanketFields> = {}): BlanketFields => {
  const row = sizeCategoryRow(category);
  return plainBlanket({ widthCm: row.nominalCm.width, lengthCm: row.nominalCm.length, ...over });
};

describe('defaultGuidelines', () => {
  it.each(POPULATIONS.map((p) => [p]))('%s defaults pass the guideline schema', (p) => {
    const g = defaultGuidelines(p);
    expect(g.population).toBe(p);
    expect(GuidelineSetSchema.safeParse(g).success).toBe(true);
  });

  it('hands out a fresh copy each time, so editing one set leaves the defaults alone', () => {
    const a = defaultGuidelines('infant');
    a.refusedFeatures.pop();
    a.yarnWeights.push(7);
    expect(defaultGuidelines('infant').refusedFeatures).toEqual([...FEATURES]);
    expect(defaultGuidelines('infant').yarnWeights).not.toContain(7);
  });

  describe.each(['preemie', 'infant'] as const)('%s (the strictest)', (p) => {
    const g = defaultGuidelines(p);
    it('refuses every feature that can come loose or catch', () => {
      expect([...g.refusedFeatures].sort()).toEqual([...FEATURES].sort());
    });
    it('requires machine washable, dryer safe, smoke-free, pet-free and new yarn', () => {
      expect(g).toMatchObject({
        requireMachineWashable: true,
        requireDryerSafe: true,
        requireSmokeFree: true,
        requirePetFree: true,
        requireNewYarn: true,
      });
    });
    it('refuses wool, mohair and alpaca and takes acrylic and cotton', () => {
      expect(g.refusedFibres).toEqual(expect.arrayContaining(['wool', 'mohair', 'alpaca']));
      expect(g.acceptedFibres).toEqual(expect.arrayContaining(['acrylic', 'cotton']));
    });
    it('takes no super bulky or jumbo yarn', () => {
      expect(g.yarnWeights).not.toContain(6);
      expect(g.yarnWeights).not.toContain(7);
    });
  });

  it('elders: no buttons, beads or fringe; washable and dryer safe', () => {
    const g = defaultGuidelines('elder');
    expect(g.refusedFeatures).toEqual(expect.arrayContaining(['buttons', 'beads', 'fringe', 'tassels']));
    expect(g.requireMachineWashable).toBe(true);
    expect(g.requireDryerSafe).toBe(true);
  });

  it('adults are the most relaxed: fringe and wool are welcome', () => {
    const g = defaultGuidelines('adult');
    expect(g.refusedFeatures).toEqual([]);
    expect(g.refusedFibres).toEqual([]);
    expect(check(nominal('throw', { fibres: ['wool'], features: ['fringe'] }), g).ok).toBe(true);
  });

  it('children: no small parts or cords, but fringe is fine', () => {
    const g = defaultGuidelines('child');
    expect(g.refusedFeatures).toEqual(expect.arrayContaining(['buttons', 'beads', 'ribbons']));
    expect(g.refusedFeatures).not.toContain('fringe');
  });

  const fits: Array<[Population, SizeCategory[]]> = [
    ['preemie', ['preemie']],
    ['infant', ['baby', 'crib']],
    ['child', ['child', 'lap']],
    ['teen', ['teen', 'throw']],
    ['adult', ['lap', 'throw', 'twin']],
    ['elder', ['lap']],
  ];
  it.each(fits)('%s defaults take a plain nominal %j blanket', (p, categories) => {
    for (const c of categories) {
      expect(check(nominal(c), defaultGuidelines(p)).reasons).toEqual([]);
    }
  });

  it.each([
    ['preemie', 'twin'],
    ['infant', 'throw'],
    ['elder', 'twin'],
    ['child', 'preemie'],
  ] as const)('%s defaults turn away a nominal %s blanket on size', (p, c) => {
    const rules = check(nominal(c), defaultGuidelines(p)).reasons.map((r) => r.rule);
    expect(rules.some((r) => r.startsWith('size.'))).toBe(true);
  });

  it('size spans come from the size table, rounded outwards to whole cm', () => {
    const g = defaultGuidelines('preemie');
    const row = sizeCategoryRow('preemie');
    expect(g.minWidthCm).toBe(Math.floor(row.rangeCm.minWidth));
    expect(g.maxWidthCm).toBe(Math.ceil(row.rangeCm.maxWidth));
    expect(g.minWidthCm).toBeLessThanOrEqual(row.rangeCm.minWidth);
    expect(g.maxLengthCm).toBeGreaterThanOrEqual(row.rangeCm.maxLength);
  });
});
