import { z } from 'zod';
import { YARN_WEIGHTS, FIBRES, FEATURES, SIZE_CATEGORIES, POPULATIONS, POPULATION_LABELS, BODY_STITCHES, BLANKET_STATUSES, MAX_SIDE_CM, pickBlanketFields } from './blanket-values';

export { YARN_WEIGHTS, FIBRES, FEATURES, SIZE_CATEGORIES, POPULATIONS, POPULATION_LABELS, BODY_STITCHES, BLANKET_STATUSES, MAX_SIDE_CM, pickBlanketFields };

export const YarnWeightSchema = z
  .number({ error: 'Yarn weight must be a number from 0 to 7' })
  .int('Yarn weight must be a whole number')
  .min(0, 'Yarn weight must be from 0 to 7')
  .max(7, 'Yarn weight must be from 0 to 7');

export const FibreSchema = z.enum(FIBRES);
export type Fibre = z.infer<typeof FibreSchema>;

export const FeatureSchema = z.enum(FEATURES);
export type Feature = z.infer<typeof FeatureSchema>;

export const SizeCategorySchema = z.enum(SIZE_CATEGORIES);
export type SizeCategory = z.infer<typeof SizeCategorySchema>;

export const PopulationSchema = z.enum(POPULATIONS);
export type Population = z.infer<typeof PopulationSchema>;

export const BodyStitchSchema = z.enum(BODY_STITCHES);
export type BodyStitch = z.infer<typeof BodyStitchSchema>;

export const BlanketStatusSchema = z.enum(BLANKET_STATUSES);
export type BlanketStatus = z.infer<typeof BlanketStatusSchema>;

export const LabelNameSchema = z.enum(['first-name', 'anonymous']);
/** What a blanket's tag says of its maker: their first name, or "Anonymous". */
export type LabelName = z.infer<typeof LabelNameSchema>;


const sideCm = (label: string) =>
  z
    .number({ error: `${label} must be a number of centimetres` })
    .positive(`${label} must be more than 0 cm`)
    .max(MAX_SIDE_CM, `${label} over ${MAX_SIDE_CM} cm is not a blanket we can take`);

/**
 * The fields of a blanket that the guideline check reads. The blanket log, the intake
 * re-measure and POST /api/guidelines/check all speak in these names.
 */
export const BlanketFieldsSchema = z.object({
  widthCm: sideCm('Width'),
  lengthCm: sideCm('Length'),
  yarnWeight: YarnWeightSchema,
  fibres: z.array(FibreSchema).min(1, 'Name at least one fibre').max(6),
  features: z.array(FeatureSchema).max(FEATURES.length).default([]),
  machineWashable: z.boolean(),
  dryerSafe: z.boolean().default(false),
  smokeFree: z.boolean(),
  petFree: z.boolean(),
  newYarn: z.boolean().default(true),
});
export type BlanketFields = z.infer<typeof BlanketFieldsSchema>;


/** The size a blanket is held to: measured at intake where it has been, else as its maker logged it. */
export function sizeOnRecord(b: { widthCm: number; lengthCm: number; measuredWidthCm?: number | null; measuredLengthCm?: number | null }): {
  widthCm: number;
  lengthCm: number;
  measured: boolean;
} {
  const measured = b.measuredWidthCm != null && b.measuredLengthCm != null;
  return measured
    ? { widthCm: b.measuredWidthCm!, lengthCm: b.measuredLengthCm!, measured }
    : { widthCm: b.widthCm, lengthCm: b.lengthCm, measured };
}

/** The fields a guideline check reads, with the size on record (measured where it was). */
export function fieldsForCheck<T extends Record<keyof BlanketFields, unknown> & { measuredWidthCm?: number | null; measuredLengthCm?: number | null }>(
  b: T,
): Pick<T, keyof BlanketFields> {
  const size = sizeOnRecord(b as unknown as Parameters<typeof sizeOnRecord>[0]);
  return { ...pickBlanketFields(b), widthCm: size.widthCm, lengthCm: size.lengthCm } as Pick<T, keyof BlanketFields>;
}
