import { z } from 'zod';
import { MAX_SIDE_CM } from '@shared/schemas/blanket-values';
import { FeatureSchema, YarnWeightSchema, BodyStitchSchema, LabelNameSchema, type BlanketFields } from '@shared/schemas/blanket';
import { BlanketCreateSchema, INITIAL_STATUSES, type BlanketCreateInput, type BlanketUpdate } from '@shared/schemas/blanket-log';
import { fromCm, toCm, type LengthUnit } from '@shared/sizing/units';

const S = BlanketCreateSchema.shape;

const side = (label: string) =>
  z.number({ error: `Enter the ${label.toLowerCase()} you measured` }).positive(`${label} must be more than 0`);

/**
 * The log as the form holds it: sizes in the unit the maker measured in, converted to cm on the
 * way out. Every other field is the shared schema's own, so the form and the server agree.
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

/** Two decimals of a centimetre is finer than any tape measure; it keeps inch conversions tidy. */
export const cmFrom = (value: number, unit: LengthUnit) => Math.round(toCm(value, unit) * 100) / 100;
export const inUnit = (cm: number, unit: LengthUnit) => Math.round(fromCm(cm, unit) * 10) / 10;

export function guidelineFields(v: Partial<BlanketFormValues>): Partial<BlanketFields> {
  const unit = v.unit ?? 'cm';
  const num = (x: unknown) => (typeof x === 'number' && Number.isFinite(x) ? x : undefined);
  const w = num(v.width);
  const l = num(v.length);
  return {
    widthCm: w === undefined ? undefined : cmFrom(w, unit),
    lengthCm: l === undefined ? undefined : cmFrom(l, unit),
    yarnWeight: num(v.yarnWeight),
    fibres: v.fibres,
    features: v.features ?? [],
    machineWashable: v.machineWashable,
    dryerSafe: v.dryerSafe ?? false,
    smokeFree: v.smokeFree,
    petFree: v.petFree,
    newYarn: v.newYarn ?? true,
  };
}

function logFields(v: BlanketFormValues) {
  return {
    widthCm: cmFrom(v.width, v.unit),
    lengthCm: cmFrom(v.length, v.unit),
    yarnWeight: v.yarnWeight,
    fibres: v.fibres,
    features: v.features,
    machineWashable: v.machineWashable,
    dryerSafe: v.dryerSafe,
    smokeFree: v.smokeFree,
    petFree: v.petFree,
    newYarn: v.newYarn,
    colours: v.colours,
    bodyStitch: v.bodyStitch,
    borderId: v.borderId === '' ? null : v.borderId,
    planId: v.planId === '' ? null : Number(v.planId),
    labelName: v.labelName,
    notes: v.notes,
  };
}

export const toCreatePayload = (v: BlanketFormValues): BlanketCreateInput => ({ pledgeId: v.pledgeId, status: v.status, ...logFields(v) });
export const toUpdatePayload = (v: BlanketFormValues): BlanketUpdate => logFields(v);

/** Server field names as the form knows them. */
export const SERVER_FIELD_RENAMES: Record<string, string> = { widthCm: 'width', lengthCm: 'length' };
