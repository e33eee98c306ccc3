import { describe, expect, it } from 'vitest';
import type { GuidelineSet } from '@shared/schemas/guidelines';
import { describeGuidelines } from '@shared/guidelines/describe';
import { defaultGuidelines } from '@shared/guidelines/defaults';
import { roundWard } from '../fixtures/guidelines';

// Its lists are out of the house order and shorter than the check tests' ward, so the lines show the ordering and the joining words.
const ward: GuidelineSet = roundWard({
  acceptedFibres: ['cotton', 'acrylic'],
  refusedFibres: ['mohair', 'wool'],
  refusedFeatures: ['buttons', 'fringe', 'tassels', 'pompoms'],
});

describe('describeGuidelines', () => {
  it('sums up a strict ward in plain lines', () => {
    expect(describeGuidelines(ward)).toEqual([
      'Sizes 40–55 × 40–55 cm (about 16–22 × 16–22 in), ±2 cm, either way round',
      'Yarn weights 2–4 (fine to medium)',
      'Acrylic or cotton only',
      'No wool or mohair',
      'No fringe, tassels, pompoms or buttons',
      'Machine washable and dryer safe',
      'Smoke-free and pet-free homes',
      'New yarn only',
    ]);
  });

  it('leaves out what is not asked', () => {
    const relaxed: GuidelineSet = {
      ...ward,
      toleranceUnit: 'percent',
      toleranceValue: 0,
      yarnWeights: [4],
      acceptedFibres: [],
      refusedFibres: [],
      refusedFeatures: [],
      requireMachineWashable: false,
      requireDryerSafe: false,
      requireSmokeFree: false,
      requirePetFree: false,
      requireNewYarn: false,
    };
    expect(describeGuidelines(relaxed)).toEqual([
      'Sizes 40–55 × 40–55 cm (about 16–22 × 16–22 in), either way round',
      'Yarn weight 4 (medium)',
    ]);
  });

  it('shows percentages, gaps in yarn weights and single requirements', () => {
    const lines = describeGuidelines({
      ...ward,
      toleranceUnit: 'percent',
      toleranceValue: 5,
      yarnWeights: [6, 2, 4],
      requireDryerSafe: false,
      requirePetFree: false,
    });
    expect(lines[0]).toContain('±5%');
    expect(lines).toContain('Yarn weights 2, 4 and 6');
    expect(lines).toContain('Machine washable');
    expect(lines).toContain('Smoke-free homes');
  });

  it('shows pet-free or dryer safe on their own', () => {
    const lines = describeGuidelines({ ...ward, requireMachineWashable: false, requireSmokeFree: false });
    expect(lines).toContain('Dryer safe');
    expect(lines).toContain('Pet-free homes');
  });

  it('a fixed size reads as one number', () => {
    const [size] = describeGuidelines({ ...ward, minWidthCm: 50, maxWidthCm: 50 });
    expect(size).toMatch(/^Sizes 50 × 40–55 cm \(about 20 × 16–22 in\)/);
  });

  it('every default set describes to non-empty lines starting with a capital', () => {
    for (const p of ['preemie', 'infant', 'child', 'teen', 'adult', 'elder'] as const) {
      const lines = describeGuidelines(defaultGuidelines(p));
      expect(lines.length).toBeGreaterThanOrEqual(3);
      for (const line of lines) expect(line).toMatch(/^[A-Z]/);
    }
  });
});
