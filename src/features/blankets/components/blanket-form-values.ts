/**
 * What the blanket form needs before its schema has loaded: its field names, the unit arithmetic,
 * the fields the guideline check reads and the payloads it sends. No zod here.
 */
import type { BlanketFields } from '@shared/schemas/blanket';
import { pickBlanketFields } from '@shared/schemas/blanket-values';
import type { BlanketCreateInput, BlanketUpdate } from '@shared/schemas/blanket-log';
import { fromCm, toCm, type LengthUnit } from '@shared/sizing/units';
import type { BlanketFormValues } from './blanket-form-schema';

export type { BlanketFormValues };

/** The form's fields, in the schema's order (a test holds them to BlanketFormSchema). */
export const FORM_FIELDS: ReadonlyArray<keyof BlanketFormValues> = [
  'pledgeId', 'unit', 'width', 'length', 'yarnWeight', 'fibres', 'features', 'machineWashable', 'dryerSafe', 'smokeFree', 'petFree', 'newYarn',
  'colours', 'bodyStitch', 'borderId', 'planId', 'labelName', 'notes', 'status',
];

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
    // The fields the guideline check reads, the sides in cm.
    ...pickBlanketFields({ ...v, widthCm: cmFrom(v.width, v.unit), lengthCm: cmFrom(v.length, v.unit) }),
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
