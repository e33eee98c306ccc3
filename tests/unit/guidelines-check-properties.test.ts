import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  FEATURES,
  FIBRES,
  POPULATIONS,
  YARN_WEIGHTS,
  type BlanketFields,
  type Feature,
  type Fibre,
} from '@shared/schemas/blanket';
import {
  GuidelineCheckResultSchema,
  GuidelineSetSchema,
  RULE_IDS,
  type GuidelineSet,
} from '@shared/schemas/guidelines';
import { check, REMOVABLE_FEATURES } from '@shared/guidelines/check';
import { defaultGuidelines } from '@shared/guidelines/defaults';

const cm = (lo: number, hi: number) => fc.double({ min: lo, max: hi, noNaN: true, noDefaultInfinity: true });

/** Any valid guideline set, leaving at least one fibre that it takes. */
const guidelineSet: fc.Arbitrary<GuidelineSet> = fc
  .record({
    population: fc.constantFrom(...POPULATIONS),
    minWidthCm: cm(10, 200),
    widthSpan: cm(0, 100),
    minLengthCm: cm(10, 200),
    lengthSpan: cm(0, 100),
    toleranceUnit: fc.constantFrom('cm' as const, 'percent' as const),
    toleranceValue: cm(0, 20),
    yarnWeights: fc.uniqueArray(fc.constantFrom(...YARN_WEIGHTS), { minLength: 1 }),
    fibreSplit: fc.array(fc.constantFrom('accepted', 'refused', 'neither'), {
      minLength: FIBRES.length,
      maxLength: FIBRES.length,
    }),
    refusedFeatures: fc.uniqueArray(fc.constantFrom(...FEATURES)),
    requireMachineWashable: fc.boolean(),
    requireDryerSafe: fc.boolean(),
    requireSmokeFree: fc.boolean(),
    requirePetFree: fc.boolean(),
    requireNewYarn: fc.boolean(),
  })
  .map(({ widthSpan, lengthSpan, fibreSplit, ...r }) => ({
    ...r,
    maxWidthCm: r.minWidthCm + widthSpan,
    maxLengthCm: r.minLengthCm + lengthSpan,
    acceptedFibres: FIBRES.filter((_, i) => fibreSplit[i] === 'accepted'),
    refusedFibres: FIBRES.filter((_, i) => fibreSplit[i] === 'refused'),
  }))
  .filter((g) => takenFibres(g).length > 0);

function takenFibres(g: GuidelineSet): Fibre[] {
  const pool = g.acceptedFibres.length > 0 ? g.acceptedFibres : FIBRES;
  return pool.filter((f) => !g.refusedFibres.includes(f));
}

/** Any blanket the schema allows. */
const anyBlanket: fc.Arbitrary<BlanketFields> = fc.record({
  widthCm: cm(1, 400),
  lengthCm: cm(1, 400),
  yarnWeight: fc.constantFrom(...YARN_WEIGHTS),
  fibres: fc.uniqueArray(fc.constantFrom(...FIBRES), { minLength: 1, maxLength: 6 }),
  features: fc.uniqueArray(fc.constantFrom(...FEATURES)),
  machineWashable: fc.boolean(),
  dryerSafe: fc.boolean(),
  smokeFree: fc.boolean(),
  petFree: fc.boolean(),
  newYarn: fc.boolean(),
});

const allowedFeatures = (g: GuidelineSet): Feature[] => FEATURES.filter((f) => !g.refusedFeatures.includes(f));

/** A blanket made to meet `g`, measured either way round. */
const blanketFor = (g: GuidelineSet): fc.Arbitrary<BlanketFields> =>
  fc
    .record({
      w: cm(g.minWidthCm, g.maxWidthCm),
      l: cm(g.minLengthCm, g.maxLengthCm),
      turned: fc.boolean(),
      yarnWeight: fc.constantFrom(...g.yarnWeights),
      fibres: fc.uniqueArray(fc.constantFrom(...takenFibres(g)), { minLength: 1, maxLength: 6 }),
      features:
        allowedFeatures(g).length > 0
          ? fc.uniqueArray(fc.constantFrom(...allowedFeatures(g)))
          : fc.constant<Feature[]>([]),
      extra: fc.record({
        machineWashable: fc.boolean(),
        dryerSafe: fc.boolean(),
        smokeFree: fc.boolean(),
        petFree: fc.boolean(),
        newYarn: fc.boolean(),
      }),
    })
    .map(({ w, l, turned, extra, ...rest }) => ({
      ...rest,
      widthCm: turned ? l : w,
      lengthCm: turned ? w : l,
      machineWashable: extra.machineWashable || g.requireMachineWashable,
      dryerSafe: extra.dryerSafe || g.requireDryerSafe,
      smokeFree: extra.smokeFree || g.requireSmokeFree,
      petFree: extra.petFree || g.requirePetFree,
      newYarn: extra.newYarn || g.requireNewYarn,
    }));

const others = fc.array(
  fc.record({ recipientId: fc.integer({ min: 1, max: 50 }), name: fc.string(), guidelines: guidelineSet }),
  { maxLength: 4 },
);

const ruleSet = (b: BlanketFields, g: GuidelineSet) => new Set(check(b, g).reasons.map((r) => r.rule));

describe('check properties', () => {
  it('the generated guideline sets are valid', () => {
    fc.assert(fc.property(guidelineSet, (g) => GuidelineSetSchema.safeParse(g).success));
  });

  it('a blanket built to meet a guideline set always passes', () => {
    const pair = guidelineSet.chain((g) => fc.tuple(fc.constant(g), blanketFor(g)));
    fc.assert(
      fc.property(pair, ([g, b]) => {
        const result = check(b, g);
        expect(result.reasons).toEqual([]);
        expect(result.ok).toBe(true);
        expect(result.verdict).toBe('ready');
      }),
      { numRuns: 500 },
    );
  });

  it('the same holds for every population default', () => {
    for (const p of POPULATIONS) {
      const g = defaultGuidelines(p);
      fc.assert(fc.property(blanketFor(g), (b) => check(b, g).ok), { numRuns: 100 });
    }
  });

  it('adding a refused feature never turns a fail into a pass, and keeps every earlier reason', () => {
    const withFeature = guidelineSet
      .filter((g) => g.refusedFeatures.length > 0)
      .chain((g) => fc.tuple(fc.constant(g), anyBlanket, fc.constantFrom(...g.refusedFeatures)));
    fc.assert(
      fc.property(withFeature, ([g, b, f]) => {
        const before = ruleSet(b, g);
        const after = check({ ...b, features: [...new Set<Feature>([...b.features, f])] }, g);
        expect(after.ok).toBe(false);
        expect(after.verdict).not.toBe('ready');
        const afterRules = new Set(after.reasons.map((r) => r.rule));
        expect(afterRules.has(`feature.${f}`)).toBe(true);
        for (const rule of before) expect(afterRules.has(rule)).toBe(true);
      }),
      { numRuns: 500 },
    );
  });

  it('is deterministic and leaves its inputs alone', () => {
    fc.assert(
      fc.property(anyBlanket, guidelineSet, others, (b, g, o) => {
        const snapshot = structuredClone({ b, g, o });
        const first = check(b, g, o);
        expect(check(structuredClone(b), structuredClone(g), structuredClone(o))).toEqual(first);
        expect({ b, g, o }).toEqual(snapshot);
      }),
      { numRuns: 300 },
    );
  });

  it('every reason has a known rule, a non-empty message, and a fix exactly when it is a removable feature', () => {
    fc.assert(
      fc.property(anyBlanket, guidelineSet, (b, g) => {
        for (const r of check(b, g).reasons) {
          expect(RULE_IDS).toContain(r.rule);
          expect(r.message.trim().length).toBeGreaterThan(10);
          const removable = REMOVABLE_FEATURES.some((f) => r.rule === `feature.${f}`);
          expect(r.fix !== undefined).toBe(removable);
          if (r.fix !== undefined) expect(r.fix.trim().length).toBeGreaterThan(10);
        }
      }),
      { numRuns: 500 },
    );
  });

  it('whether it fits does not depend on which side was measured as the width', () => {
    fc.assert(
      fc.property(anyBlanket, guidelineSet, (b, g) => {
        const swapped = { ...b, widthCm: b.lengthCm, lengthCm: b.widthCm };
        const sizeRules = (x: BlanketFields) => [...ruleSet(x, g)].filter((r) => r.startsWith('size.')).length;
        expect(sizeRules(swapped)).toBe(sizeRules(b));
        expect(check(swapped, g).ok).toBe(check(b, g).ok);
      }),
      { numRuns: 500 },
    );
  });

  it('the verdict follows its rules, and matches the result schema', () => {
    fc.assert(
      fc.property(anyBlanket, guidelineSet, others, (b, g, o) => {
        const r = check(b, g, o);
        GuidelineCheckResultSchema.parse(r);
        expect(r.ok).toBe(r.reasons.length === 0);
        expect(r.verdict === 'ready').toBe(r.ok);
        const allFixable = r.reasons.every((x) => x.fix !== undefined);
        if (r.verdict === 'mend') expect(allFixable).toBe(true);
        if (r.verdict === 'reroute') {
          expect(allFixable).toBe(false);
          expect(r.alsoFits.length + r.alsoFitsAfterMend.length).toBeGreaterThan(0);
        }
        if (r.verdict === 'decline') {
          expect(allFixable).toBe(false);
          expect(r.alsoFits).toEqual([]);
          expect(r.alsoFitsAfterMend).toEqual([]);
        }
      }),
      { numRuns: 500 },
    );
  });

  it('every recipient in alsoFits takes the blanket on its own check, and the rest do not', () => {
    fc.assert(
      fc.property(anyBlanket, guidelineSet, others, (b, g, o) => {
        const r = check(b, g, o);
        const listed = new Set(r.alsoFits.map((x) => x.recipientId));
        const firstSeen = new Map<number, GuidelineSet>();
        for (const x of o) if (!firstSeen.has(x.recipientId)) firstSeen.set(x.recipientId, x.guidelines);
        for (const [id, theirs] of firstSeen) expect(listed.has(id)).toBe(check(b, theirs).ok);
        for (const m of r.alsoFitsAfterMend) {
          const theirs = firstSeen.get(m.recipientId);
          expect(theirs).toBeDefined();
          if (theirs) expect(check(b, theirs).verdict).toBe('mend');
        }
      }),
      { numRuns: 300 },
    );
  });

  it('a blanket that passes keeps passing when the tolerance grows', () => {
    // Sizes spread up to 30% either side of the range, so some pass only thanks to the tolerance.
    const near = guidelineSet.chain((g) =>
      fc.tuple(fc.constant(g), blanketFor(g), cm(0.7, 1.3), cm(0.7, 1.3), cm(0, 20)),
    );
    let passed = 0;
    fc.assert(
      fc.property(near, ([g, made, fw, fl, more]) => {
        const b = { ...made, widthCm: made.widthCm * fw, lengthCm: made.lengthCm * fl };
        fc.pre(check(b, g).ok);
        passed += 1;
        const looser = { ...g, toleranceValue: Math.min(20, g.toleranceValue + more) };
        expect(check(b, looser).ok).toBe(true);
      }),
      { numRuns: 300 },
    );
    expect(passed).toBeGreaterThan(50);
  });
});
