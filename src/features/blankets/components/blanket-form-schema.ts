import { z } from 'zod';
import { MAX_SIDE_CM } from '@shared/schemas/blanket-values';
import { FeatureSchema, YarnWeightSchema, BodyStitchSchema, LabelNameSchema } from '@shared/schemas/blanket';
import { BlanketCreateSchema, INITIAL_STATUSES } from '@shared/schemas/blanket-log';
import { fromCm, toCm } from '@shared/sizing/units';

const S = BlanketCreateSchema.shape;

const side = (label: string) =>
  z.number({ error: `Enter the ${label.toLowerCase()} you measured` }).positive(`${label} must be more than 0`);

/**
 * The log as the form holds it: sizes in the unit the maker measured in, converted to cm on the
 * way out. Every other field is the shared schema's own, so the form and the server agree. The
 * form loads this after it has painted (see ./blanket-form-values.ts for what it needs at once).
 */
export const BlanketFormSchema = z
  .object({
    pledgeId: S.pledgeId,
    unit: z.enum(['cm', 'in']),
    width: side('Width'),
    length: side('Length'),
    yarnWeight: YarnWeightSchema,
    fibres: S.fibres,
    features: z.array(FeatureSchema),
    machineWashable: z.boolean(),
    dryerSafe: z.boolean(),
    smokeFree: z.boolean(),
    petFree: z.boolean(),
    newYarn: z.boolean(),
    colours: S.colours.removeDefault(),
    bodyStitch: BodyStitchSchema,
    borderId: z.string(),
    planId: z.string(),
    labelName: LabelNameSchema,
    notes: S.notes.removeDefault(),
    status: z.enum(INITIAL_STATUSES),
  })
  .superRefine((v, ctx) => {
    for (const key of ['width', 'length'] as const) {
      if (toCm(v[key], v.unit) > MAX_SIDE_CM) {
        const max = v.unit === 'cm' ? `${MAX_SIDE_CM} cm` : `${Math.round(fromCm(MAX_SIDE_CM, 'in'))} in`;
        ctx.addIssue({ code: 'custom', path: [key], message: `Over ${max} is not a blanket we can take; check the measurement` });
      }
    }
  });
export type BlanketFormValues = z.infer<typeof BlanketFormSchema>;
