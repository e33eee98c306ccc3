import { z } from 'zod';
import {
  BlanketFieldsSchema,
  FEATURES,
  FeatureSchema,
  FibreSchema,
  MAX_SIDE_CM,
  PopulationSchema,
  YarnWeightSchema,
} from './blanket';

/** Largest leeway an organiser may give on the size range. Past this the range itself is wrong. */
export const MAX_TOLERANCE_CM = 20;
export const MAX_TOLERANCE_PERCENT = 20;

export const TOLERANCE_UNITS = ['cm', 'percent'] as const;
export const ToleranceUnitSchema = z.enum(TOLERANCE_UNITS, {
  error: "Tolerance unit must be 'cm' or 'percent'",
});

const sizeBound = (label: string) =>
  z
    .number({ error: `${label} must be a number of centimetres` })
    .positive(`${label} must be more than 0 cm`)
    .max(MAX_SIDE_CM, `${label} must be at most ${MAX_SIDE_CM} cm`);

const flag = (label: string) => z.boolean({ error: `${label} must be true or false` });

function duplicates<T>(items: readonly T[]): T[] {
  const seen = new Set<T>();
  const twice = new Set<T>();
  for (const item of items) {
    if (seen.has(item)) twice.add(item);
    seen.add(item);
  }
  return [...twice];
}

/**
 * One recipient's guideline set: what the organiser agreed with the receiving unit. Also the
 * body of PUT /api/recipients/:id/guidelines. `acceptedFibres` empty means "any fibre that is
 * not refused"; a non-empty list is the only fibres taken.
 */
export const GuidelineSetSchema = z
  .object({
    population: PopulationSchema,
    minWidthCm: sizeBound('Smallest width'),
    maxWidthCm: sizeBound('Largest width'),
    minLengthCm: sizeBound('Smallest length'),
    maxLengthCm: sizeBound('Largest length'),
    toleranceUnit: ToleranceUnitSchema,
    toleranceValue: z
      .number({ error: 'Tolerance must be a number' })
      .min(0, 'Tolerance cannot be negative'),
    yarnWeights: z.array(YarnWeightSchema).min(1, 'Accepted yarn weights: choose at least one'),
    acceptedFibres: z.array(FibreSchema),
    refusedFibres: z.array(FibreSchema),
    refusedFeatures: z.array(FeatureSchema).max(FEATURES.length),
    requireMachineWashable: flag('Machine washable'),
    requireDryerSafe: flag('Dryer safe'),
    requireSmokeFree: flag('Smoke-free home'),
    requirePetFree: flag('Pet-free home'),
    requireNewYarn: flag('New yarn only'),
  })
  .superRefine((g, ctx) => {
    if (g.minWidthCm > g.maxWidthCm) {
      ctx.addIssue({
        code: 'custom',
        path: ['maxWidthCm'],
        message: `Largest width (${g.maxWidthCm} cm) must be at least the smallest width (${g.minWidthCm} cm)`,
      });
    }
    if (g.minLengthCm > g.maxLengthCm) {
      ctx.addIssue({
        code: 'custom',
        path: ['maxLengthCm'],
        message: `Largest length (${g.maxLengthCm} cm) must be at least the smallest length (${g.minLengthCm} cm)`,
      });
    }
    const maxTolerance = g.toleranceUnit === 'cm' ? MAX_TOLERANCE_CM : MAX_TOLERANCE_PERCENT;
    if (g.toleranceValue > maxTolerance) {
      ctx.addIssue({
        code: 'custom',
        path: ['toleranceValue'],
        message: `Tolerance must be at most ${maxTolerance}${g.toleranceUnit === 'cm' ? ' cm' : '%'}`,
      });
    }
    const lists = [
      ['yarnWeights', g.yarnWeights, 'Accepted yarn weights', 'yarn weight'],
      ['acceptedFibres', g.acceptedFibres, 'Accepted fibres', 'fibre'],
      ['refusedFibres', g.refusedFibres, 'Refused fibres', 'fibre'],
      ['refusedFeatures', g.refusedFeatures, 'Refused features', 'feature'],
    ] as const;
    for (const [field, items, label, noun] of lists) {
      const twice = duplicates<string | number>(items);
      if (twice.length > 0) {
        ctx.addIssue({
          code: 'custom',
          path: [field],
          message: `${label}: list each ${noun} once (repeated: ${twice.join(', ')})`,
        });
      }
    }
    const both = g.acceptedFibres.filter((f) => g.refusedFibres.includes(f));
    if (both.length > 0) {
      ctx.addIssue({
        code: 'custom',
        path: ['refusedFibres'],
        message: `Refused fibres: ${both.join(', ')} cannot be both accepted and refused`,
      });
    }
  });
export type GuidelineSet = z.infer<typeof GuidelineSetSchema>;

/** PUT /api/recipients/:id/guidelines: the whole set, replaced at once. */
export const PutRecipientGuidelinesBodySchema = GuidelineSetSchema;
export type PutRecipientGuidelinesBody = z.infer<typeof PutRecipientGuidelinesBodySchema>;

/** POST /api/guidelines/check */
export const GuidelineCheckBodySchema = z.object({
  recipientId: z
    .number({ error: 'recipientId must be a number' })
    .int('recipientId must be a whole number')
    .positive('recipientId must be more than 0'),
  blanket: BlanketFieldsSchema,
});
export type GuidelineCheckBody = z.infer<typeof GuidelineCheckBodySchema>;

/**
 * Our verdict words. ready: send it as it is. mend: a small fix the maker can do at home
 * (take off a removable trim). reroute: it can't go here but another recipient takes it.
 * decline: no recipient we know of can take it. See docs/decisions/0003-guideline-verdicts.md.
 */
export const VERDICTS = ['ready', 'mend', 'reroute', 'decline'] as const;
export const VerdictSchema = z.enum(VERDICTS);
export type Verdict = z.infer<typeof VerdictSchema>;

export const RULE_IDS = [
  'size.width',
  'size.length',
  'yarn-weight',
  'fibre.refused',
  'fibre.not-accepted',
  ...FEATURES.map((f) => `feature.${f}` as const),
  'washable',
  'dryer-safe',
  'smoke-free',
  'pet-free',
  'new-yarn',
] as const;
export const RuleIdSchema = z.enum(RULE_IDS);
export type RuleId = z.infer<typeof RuleIdSchema>;

export const GuidelineReasonSchema = z.object({
  rule: RuleIdSchema,
  message: z.string().min(1),
  /** Present only when the maker can put it right at home. */
  fix: z.string().min(1).optional(),
});
export type GuidelineReason = z.infer<typeof GuidelineReasonSchema>;

const RecipientRefSchema = z.object({ recipientId: z.number().int().positive(), name: z.string() });

export const GuidelineCheckResultSchema = z.object({
  ok: z.boolean(),
  verdict: VerdictSchema,
  reasons: z.array(GuidelineReasonSchema),
  /** Other recipients whose guidelines the blanket meets exactly as it is. */
  alsoFits: z.array(RecipientRefSchema),
  /** Other recipients it would meet once the at-home fixes are done; `mend` lists those rules. */
  alsoFitsAfterMend: z.array(RecipientRefSchema.extend({ mend: z.array(RuleIdSchema).min(1) })),
  /** Passing remarks that are not failures, e.g. that it fits when turned the other way round. */
  notes: z.array(z.string()),
});
export type GuidelineCheckResult = z.infer<typeof GuidelineCheckResultSchema>;
