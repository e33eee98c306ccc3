import { describe, expect, it } from 'vitest';
import {
  GuidelineCheckBodySchema,
  GuidelineSetSchema,
  PutRecipientGuidelinesBodySchema,
  RULE_IDS,
} from '@shared/schemas/guidelines';
import { defaultGuidelines } from '@shared/guidelines/defaults';

const valid = () => defaultGuidelines('preemie');

function issuesOf(input: unknown) {
  const r = PutRecipientGuidelinesBodySchema.safeParse(input);
  expect(r.success).toBe(false);
  return r.success ? [] : r.error.issues.map((i) => ({ path: i.path.join('.'), message: i.message }));
}

describe('GuidelineSetSchema (PUT /api/recipients/:id/guidelines body)', () => {
  it('accepts a default set unchanged', () => {
    expect(GuidelineSetSchema.parse(valid())).toEqual(valid());
  });

  it('min above max width is refused, naming the field', () => {
    const issues = issuesOf({ ...valid(), minWidthCm: 60, maxWidthCm: 50 });
    expect(issues).toEqual([
      { path: 'maxWidthCm', message: 'Largest width (50 cm) must be at least the smallest width (60 cm)' },
    ]);
  });

  it('min above max length is refused, naming the field', () => {
    const issues = issuesOf({ ...valid(), minLengthCm: 60, maxLengthCm: 50 });
    expect(issues[0]?.path).toBe('maxLengthCm');
    expect(issues[0]?.message).toMatch(/Largest length .* smallest length/);
  });

  it('min equal to max is allowed', () => {
    expect(GuidelineSetSchema.safeParse({ ...valid(), minWidthCm: 50, maxWidthCm: 50 }).success).toBe(true);
  });

  it.each([
    [{ minWidthCm: 0 }, 'minWidthCm', /Smallest width must be more than 0 cm/],
    [{ maxLengthCm: 401 }, 'maxLengthCm', /at most 400 cm/],
    [{ maxWidthCm: '50' }, 'maxWidthCm', /Largest width must be a number/],
    [{ toleranceValue: -1 }, 'toleranceValue', /cannot be negative/],
    [{ toleranceUnit: 'cm', toleranceValue: 21 }, 'toleranceValue', /at most 20 cm/],
    [{ toleranceUnit: 'percent', toleranceValue: 25 }, 'toleranceValue', /at most 20%/],
    [{ toleranceUnit: 'inch' }, 'toleranceUnit', /'cm' or 'percent'/],
    [{ yarnWeights: [] }, 'yarnWeights', /at least one/],
    [{ yarnWeights: [8] }, 'yarnWeights.0', /0 to 7/],
    [{ yarnWeights: [3, 3] }, 'yarnWeights', /list each yarn weight once/],
    [{ acceptedFibres: ['linen'] }, 'acceptedFibres.0', /./],
    [{ refusedFeatures: ['fringe', 'fringe'] }, 'refusedFeatures', /repeated: fringe/],
    [{ acceptedFibres: ['acrylic', 'wool'] }, 'refusedFibres', /wool cannot be both accepted and refused/],
    [{ requirePetFree: 'yes' }, 'requirePetFree', /Pet-free home must be true or false/],
    [{ population: 'toddler' }, 'population', /./],
  ] as const)('%j is refused at %s', (over, path, message) => {
    const issues = issuesOf({ ...valid(), ...over });
    const hit = issues.find((i) => i.path === path);
    expect(hit, JSON.stringify(issues)).toBeDefined();
    expect(hit?.message).toMatch(message);
  });

  it('a missing field is refused by name', () => {
    const { requireNewYarn: _omit, ...rest } = valid();
    expect(issuesOf(rest).map((i) => i.path)).toContain('requireNewYarn');
  });
});

describe('GuidelineCheckBodySchema (POST /api/guidelines/check body)', () => {
  const blanket = {
    widthCm: 45,
    lengthCm: 50,
    yarnWeight: 3,
    fibres: ['acrylic'],
    machineWashable: true,
    smokeFree: true,
    petFree: true,
  };

  it('accepts a recipient id and a blanket, filling the blanket defaults', () => {
    const body = GuidelineCheckBodySchema.parse({ recipientId: 3, blanket });
    expect(body.blanket).toMatchObject({ features: [], dryerSafe: false, newYarn: true });
  });

  it.each([
    [{ recipientId: 0, blanket }, 'recipientId'],
    [{ recipientId: 1.5, blanket }, 'recipientId'],
    [{ recipientId: '3', blanket }, 'recipientId'],
    [{ recipientId: 3, blanket: { ...blanket, widthCm: -1 } }, 'blanket.widthCm'],
    [{ recipientId: 3, blanket: { ...blanket, fibres: [] } }, 'blanket.fibres'],
    [{ recipientId: 3 }, 'blanket'],
  ])('%j is refused at %s', (input, path) => {
    const r = GuidelineCheckBodySchema.safeParse(input);
    expect(r.success).toBe(false);
    if (!r.success) expect(r.error.issues.map((i) => i.path.join('.'))).toContain(path);
  });
});

describe('RULE_IDS', () => {
  it('holds the stable ids the API and UI key on', () => {
    expect(RULE_IDS).toEqual(
      expect.arrayContaining([
        'size.width',
        'size.length',
        'yarn-weight',
        'fibre.refused',
        'fibre.not-accepted',
        'feature.fringe',
        'feature.open-lace',
        'washable',
        'dryer-safe',
        'smoke-free',
        'pet-free',
        'new-yarn',
      ]),
    );
    expect(new Set(RULE_IDS).size).toBe(RULE_IDS.length);
  });
});
