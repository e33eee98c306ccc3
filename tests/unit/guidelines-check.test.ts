import { describe, expect, it } from 'vitest';
import type { BlanketFields } from '@shared/schemas/blanket';
import { GuidelineCheckResultSchema, type GuidelineSet } from '@shared/schemas/guidelines';
import { check, REMOVABLE_FEATURES } from '@shared/guidelines/check';
import { defaultGuidelines } from '@shared/guidelines/defaults';
import { plainBlanket } from '../fixtures/blankets';
import { roundWard as ward } from '../fixtures/guidelines';

/** A preemie-sized blanket in light yarn that meets every rule of the round-numbered ward. */
const good = (over: Partial<BlanketFields> = {}): BlanketFields => plainBlanket({ widthCm: 45, lengthCm: 50, yarnWeight: 3, ...over });

const rules = (b: BlanketFields, g: GuidelineSet) => check(b, g).reasons.map((r) => r.rule);

describe('check: a blanket that meets every rule', () => {
  it('is ready, with no reasons', () => {
    const result = check(good(), ward());
    expect(result).toMatchObject({ ok: true, verdict: 'ready', reasons: [], alsoFits: [] });
    expect(GuidelineCheckResultSchema.parse(result)).toEqual(result);
  });
});

describe('check: size', () => {
  it('explains an oversize blanket in cm with the range and the tolerance', () => {
    const [width, length] = check(good({ widthCm: 95, lengthCm: 120 }), ward()).reasons;
    expect(width?.rule).toBe('size.width');
    expect(width?.message).toContain('It measures 95 × 120 cm; this unit takes 40–55 cm wide (±2 cm)');
    expect(width?.message).toContain('40 cm too wide');
    expect(length?.rule).toBe('size.length');
    expect(length?.message).toContain('40–55 cm long (±2 cm)');
    expect(length?.message).toContain('65 cm too long');
  });

  it('names the size category an odd-sized blanket would suit', () => {
    const [width] = check(good({ widthCm: 91, lengthCm: 122 }), ward()).reasons;
    expect(width?.message).toContain('lap blanket');
  });

  it('says too narrow and too short when undersize', () => {
    const messages = check(good({ widthCm: 30, lengthCm: 30 }), ward()).reasons.map((r) => r.message);
    expect(messages[0]).toContain('10 cm too narrow');
    expect(messages[1]).toContain('10 cm too short');
  });

  it('matches either way round, and says so in a note', () => {
    const g = ward({ minWidthCm: 40, maxWidthCm: 50, minLengthCm: 55, maxLengthCm: 65, toleranceValue: 0 });
    const upright = check(good({ widthCm: 45, lengthCm: 60 }), g);
    expect(upright.ok).toBe(true);
    expect(upright.notes).toEqual([]);
    const turned = check(good({ widthCm: 60, lengthCm: 45 }), g);
    expect(turned.ok).toBe(true);
    expect(turned.verdict).toBe('ready');
    expect(turned.notes[0]).toMatch(/turned the other way round/);
  });

  it('reports against the nearer way round and says both were tried', () => {
    const g = ward({ minWidthCm: 40, maxWidthCm: 50, minLengthCm: 55, maxLengthCm: 65, toleranceValue: 0 });
    // As measured both sides miss; turned, 45 wide fits and only 80 long misses: one reason.
    const result = check(good({ widthCm: 80, lengthCm: 45 }), g);
    expect(result.reasons.map((r) => r.rule)).toEqual(['size.length']);
    expect(result.reasons[0]?.message).toContain('whichever way round');
    expect(result.reasons[0]?.message).toContain('15 cm too long');
  });

  describe('tolerance in cm: the boundary itself passes', () => {
    const g = ward({ toleranceUnit: 'cm', toleranceValue: 2 });
    it.each([
      [38, true],
      [37.99, false],
      [57, true],
      [57.01, false],
    ])('width %s cm → fits %s', (w, fits) => {
      expect(rules(good({ widthCm: w, lengthCm: 45 }), g).includes('size.width')).toBe(!fits);
    });
  });

  describe('tolerance in percent: the boundary itself passes', () => {
    // 5% of 40 is 2, of 55 is 2.75: so 38 and 57.75 are the last readings that fit.
    const g = ward({ toleranceUnit: 'percent', toleranceValue: 5 });
    it.each([
      [38, true],
      [37.99, false],
      [57.75, true],
      [57.76, false],
    ])('length %s cm → fits %s', (l, fits) => {
      expect(rules(good({ widthCm: 45, lengthCm: l }), g).includes('size.length')).toBe(!fits);
    });
    it('a bound that binary fractions nudge still holds the reading on it', () => {
      // In floating point 25 × 1.15 is 28.749999999999996, yet 28.75 cm is inside 25 cm + 15%.
      const g15 = ward({ minLengthCm: 20, maxLengthCm: 25, toleranceUnit: 'percent', toleranceValue: 15 });
      expect(rules(good({ widthCm: 45, lengthCm: 28.75 }), g15)).not.toContain('size.length');
      expect(rules(good({ widthCm: 45, lengthCm: 28.76 }), g15)).toContain('size.length');
    });
    it('shows the tolerance as a percentage', () => {
      const [reason] = check(good({ widthCm: 45, lengthCm: 70 }), g).reasons;
      expect(reason?.message).toContain('(±5%)');
    });
  });

  it('with no tolerance the exact bounds still pass', () => {
    const g = ward({ toleranceValue: 0 });
    expect(check(good({ widthCm: 40, lengthCm: 55 }), g).ok).toBe(true);
    const over = check(good({ widthCm: 40, lengthCm: 55.01 }), g);
    expect(over.reasons[0]?.message).toContain('no leeway');
    expect(over.reasons[0]?.message).toContain('a touch too long');
  });
});

describe('check: yarn weight', () => {
  it('refuses a weight outside the list, naming both', () => {
    const [reason] = check(good({ yarnWeight: 6 }), ward()).reasons;
    expect(reason?.rule).toBe('yarn-weight');
    expect(reason?.message).toBe(
      "It's made in yarn weight 6 (super bulky); this unit takes yarn weights 2–4 (fine to medium).",
    );
    expect(reason?.fix).toBeUndefined();
  });
});

describe('check: fibres', () => {
  it('wool on a preemie blanket is refused, with the reason', () => {
    const result = check(good({ fibres: ['wool'] }), defaultGuidelines('preemie'));
    expect(result.reasons.map((r) => r.rule)).toEqual(['fibre.refused']);
    expect(result.reasons[0]?.message).toMatch(/^It contains wool; this unit does not take it\./);
    expect(result.reasons[0]?.message).toMatch(/felt/);
    expect(result.verdict).toBe('decline');
  });

  it('lists several refused fibres in one reason', () => {
    const [reason] = check(good({ fibres: ['acrylic', 'mohair', 'alpaca'] }), ward()).reasons;
    expect(reason?.message).toMatch(/^It contains mohair and alpaca; this unit does not take them\./);
    expect(reason?.message).toMatch(/shed/);
  });

  it('a fibre neither refused nor on the accepted list is not accepted', () => {
    const result = check(good({ fibres: ['acrylic', 'silk'] }), ward());
    expect(result.reasons).toEqual([
      { rule: 'fibre.not-accepted', message: 'It contains silk; this unit takes only acrylic or cotton.' },
    ]);
  });

  it('a refused fibre is not reported twice', () => {
    expect(rules(good({ fibres: ['wool'] }), ward())).toEqual(['fibre.refused']);
  });

  it('an empty accepted list takes any fibre that is not refused', () => {
    const g = ward({ acceptedFibres: [] });
    expect(check(good({ fibres: ['silk', 'bamboo'] }), g).ok).toBe(true);
    expect(rules(good({ fibres: ['silk', 'wool'] }), g)).toEqual(['fibre.refused']);
  });
});

describe('check: features', () => {
  it('fringe on an infant blanket is a mend, explained and with the fix', () => {
    const result = check(good({ widthCm: 76, lengthCm: 76, features: ['fringe'] }), defaultGuidelines('infant'));
    expect(result.verdict).toBe('mend');
    expect(result.ok).toBe(false);
    expect(result.reasons).toHaveLength(1);
    expect(result.reasons[0]).toEqual({
      rule: 'feature.fringe',
      message: 'Fringe can wrap around tiny fingers and toes; this unit does not take it.',
      fix: 'Take the fringe off and finish the edge with a round of single crochet.',
    });
  });

  it('every trim but open lace can be taken off at home (common practice, no published source)', () => {
    expect([...REMOVABLE_FEATURES].sort()).toEqual(['applique', 'beads', 'buttons', 'fringe', 'pompoms', 'ribbons', 'tassels']);
  });

  it.each(REMOVABLE_FEATURES.map((f) => [f]))('%s is removable: a mend with a fix', (feature) => {
    const result = check(good({ features: [feature] }), ward());
    expect(result.verdict).toBe('mend');
    expect(result.reasons[0]?.rule).toBe(`feature.${feature}`);
    expect(result.reasons[0]?.fix).toBeTruthy();
  });

  it('open lace is part of the fabric: no fix, and decline when nowhere else fits', () => {
    const result = check(good({ features: ['open-lace'] }), ward());
    expect(result.reasons[0]?.rule).toBe('feature.open-lace');
    expect(result.reasons[0]?.fix).toBeUndefined();
    expect(result.reasons[0]?.message).toContain("can't be changed at home");
    expect(result.verdict).toBe('decline');
  });

  it('a feature the unit allows is no reason at all', () => {
    expect(check(good({ features: ['fringe'] }), ward({ refusedFeatures: [] })).ok).toBe(true);
  });

  it('speaks of wheelchairs and walkers for elders', () => {
    const g = defaultGuidelines('elder');
    const [reason] = check(good({ widthCm: 91, lengthCm: 122, fibres: ['acrylic'], features: ['fringe'] }), g).reasons;
    expect(reason?.message).toMatch(/wheelchair/);
  });

  it('for other recipients names the feature plainly', () => {
    const g = { ...defaultGuidelines('teen'), refusedFeatures: ['beads' as const] };
    const [reason] = check(good({ widthCm: 120, lengthCm: 170, features: ['beads'] }), g).reasons;
    expect(reason?.message).toBe('It has beads; this unit does not take them.');
  });
});

describe('check: care and home', () => {
  it.each([
    ['washable', { machineWashable: false }],
    ['dryer-safe', { dryerSafe: false }],
    ['smoke-free', { smokeFree: false }],
    ['pet-free', { petFree: false }],
    ['new-yarn', { newYarn: false }],
  ] as const)('%s is required and cannot be fixed at home', (rule, over) => {
    const result = check(good(over), ward());
    expect(result.reasons.map((r) => r.rule)).toEqual([rule]);
    expect(result.reasons[0]?.fix).toBeUndefined();
    expect(result.verdict).toBe('decline');
  });

  it('nothing is asked that the unit does not require', () => {
    const relaxed = ward({
      requireMachineWashable: false,
      requireDryerSafe: false,
      requireSmokeFree: false,
      requirePetFree: false,
      requireNewYarn: false,
    });
    const b = good({ machineWashable: false, dryerSafe: false, smokeFree: false, petFree: false, newYarn: false });
    expect(check(b, relaxed).ok).toBe(true);
  });

  it('a smoking home goes elsewhere only where smoke-free is not required', () => {
    const b = good({ smokeFree: false });
    const alsoStrict = { recipientId: 2, name: 'Second ward', guidelines: ward() };
    expect(check(b, ward(), [alsoStrict]).verdict).toBe('decline');
    const relaxed = { recipientId: 3, name: 'Outreach', guidelines: ward({ requireSmokeFree: false }) };
    const result = check(b, ward(), [alsoStrict, relaxed]);
    expect(result.verdict).toBe('reroute');
    expect(result.alsoFits).toEqual([{ recipientId: 3, name: 'Outreach' }]);
  });
});

describe('check: several failures and verdict precedence', () => {
  it('lists every failure, in a fixed order', () => {
    const b = good({
      widthCm: 95,
      lengthCm: 120,
      yarnWeight: 6,
      fibres: ['wool', 'silk'],
      features: ['fringe', 'buttons'],
      machineWashable: false,
      dryerSafe: false,
      smokeFree: false,
      petFree: false,
      newYarn: false,
    });
    expect(rules(b, ward())).toEqual([
      'size.width',
      'size.length',
      'yarn-weight',
      'fibre.refused',
      'fibre.not-accepted',
      'feature.fringe',
      'feature.buttons',
      'washable',
      'dryer-safe',
      'smoke-free',
      'pet-free',
      'new-yarn',
    ]);
  });

  it('several removable features are still a mend', () => {
    expect(check(good({ features: ['fringe', 'tassels', 'beads'] }), ward()).verdict).toBe('mend');
  });

  it('an unfixable failure outranks a fixable one', () => {
    const result = check(good({ yarnWeight: 6, features: ['fringe'] }), ward());
    expect(result.verdict).toBe('decline');
    expect(result.reasons.map((r) => r.rule)).toEqual(['yarn-weight', 'feature.fringe']);
  });

  it('oversize reroutes when another recipient fits, and declines when none does', () => {
    const b = good({ widthCm: 127, lengthCm: 152, fibres: ['acrylic'] });
    const shelter = { recipientId: 7, name: 'Night shelter', guidelines: defaultGuidelines('adult') };
    const nursery = { recipientId: 8, name: 'Nursery', guidelines: defaultGuidelines('infant') };
    const rerouted = check(b, defaultGuidelines('preemie'), [nursery, shelter]);
    expect(rerouted.verdict).toBe('reroute');
    expect(rerouted.alsoFits).toEqual([{ recipientId: 7, name: 'Night shelter' }]);
    expect(check(b, defaultGuidelines('preemie'), [nursery]).verdict).toBe('decline');
  });

  it('mend stays mend even when another recipient takes it as it is', () => {
    const b = good({ features: ['fringe'] });
    const result = check(b, ward(), [{ recipientId: 4, name: 'Day centre', guidelines: ward({ refusedFeatures: [] }) }]);
    expect(result.verdict).toBe('mend');
    expect(result.alsoFits).toEqual([{ recipientId: 4, name: 'Day centre' }]);
  });

  it('reroutes to a recipient that takes it after the home fix', () => {
    const b = good({ yarnWeight: 6, features: ['fringe'] });
    const other = { recipientId: 5, name: 'Hospice', guidelines: ward({ yarnWeights: [5, 6] }) };
    const result = check(b, ward(), [other]);
    expect(result.verdict).toBe('reroute');
    expect(result.alsoFits).toEqual([]);
    expect(result.alsoFitsAfterMend).toEqual([
      { recipientId: 5, name: 'Hospice', mend: ['feature.fringe'] },
    ]);
  });
});

describe('check: alsoFits', () => {
  it('leaves out the recipient being checked and any repeat, keeping input order', () => {
    const b = good();
    const others = [
      { recipientId: 1, name: 'This ward', guidelines: ward() },
      { recipientId: 3, name: 'Third', guidelines: ward() },
      { recipientId: 2, name: 'Second', guidelines: ward() },
      { recipientId: 3, name: 'Third again', guidelines: ward() },
      { recipientId: 9, name: 'Too small for it', guidelines: ward({ maxWidthCm: 41, maxLengthCm: 41, toleranceValue: 0 }) },
    ];
    const result = check(b, ward(), others, { recipientId: 1 });
    expect(result.alsoFits).toEqual([
      { recipientId: 3, name: 'Third' },
      { recipientId: 2, name: 'Second' },
    ]);
  });

  it('does not change the inputs', () => {
    const b = good({ features: ['fringe'] });
    const g = ward();
    const before = JSON.stringify([b, g]);
    check(b, g, [{ recipientId: 2, name: 'x', guidelines: g }]);
    expect(JSON.stringify([b, g])).toBe(before);
  });
});
