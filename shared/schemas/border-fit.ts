import { z } from 'zod';
import { ROW_TYPES, type RowType } from '../border/row-ends';
import { FIT_STRATEGIES } from '../border/fit';
import { ROUND_MODES } from '../border/round';
import { BODY_STITCHES_FOR_CHAIN } from '../sizing/gauge';
import { MAX_CORNER_STITCHES, MAX_EDGE_STITCHES, MAX_MULTIPLE, MAX_OFFSET, MAX_PATTERN_ROWS } from './border-fit-values';

export { MAX_CORNER_STITCHES, MAX_EDGE_STITCHES, MAX_MULTIPLE, MAX_OFFSET, MAX_PATTERN_ROWS };

const wholeCount = (field: string, noun: 'stitches' | 'rows') =>
  z
    .number({ error: `${field} must be a number of ${noun}` })
    .int(`${field} must be a whole number of ${noun}`)
    .min(1, `${field} must be at least 1`)
    .max(MAX_EDGE_STITCHES, `${field} over 2,000 ${noun} is too large to plan; check the count`);

const RowsPatternSchema = z.object({
  count: wholeCount('rows.count', 'rows'),
  pattern: z
    .array(z.enum(ROW_TYPES, { error: `rows.pattern entries must be one of ${ROW_TYPES.join(', ')}` }), {
      error: 'rows.pattern must be a list of row types',
    })
    .min(1, 'rows.pattern must name at least 1 row type')
    .max(MAX_PATTERN_ROWS, `rows.pattern can name at most ${MAX_PATTERN_ROWS} row types`),
});

/*
 * rows is a number or an object. Choosing the branch by type first (instead of a plain union)
 * lets a bad number report "rows over 2,000 ..." rather than a generic "invalid input".
 */
const RowsSchema = z.unknown().transform((value, ctx) => {
  const schema = typeof value === 'number' ? wholeCount('rows', 'rows') : RowsPatternSchema;
  if (typeof value !== 'number' && (typeof value !== 'object' || value === null || Array.isArray(value))) {
    ctx.addIssue({ code: 'custom', message: 'rows must be a number of rows or { count, pattern }' });
    return z.NEVER;
  }
  const parsed = schema.safeParse(value);
  if (!parsed.success) {
    for (const issue of parsed.error.issues) ctx.addIssue({ code: 'custom', message: issue.message, path: issue.path });
    return z.NEVER;
  }
  return parsed.data as number | z.infer<typeof RowsPatternSchema>;
});

export const BorderFitRequestSchema = z
  .object({
    across: wholeCount('across', 'stitches'),
    rows: RowsSchema,
    multiple: z
      .number({ error: 'multiple must be a number' })
      .int('multiple must be a whole number')
      .min(2, 'multiple must be at least 2 (a plain border needs no fitting)')
      .max(MAX_MULTIPLE, `multiple must be at most ${MAX_MULTIPLE}`),
    offset: z
      .number({ error: 'offset must be a number' })
      .int('offset must be a whole number')
      .min(0, 'offset must be 0 or more')
      .max(MAX_OFFSET, `offset must be at most ${MAX_OFFSET}`),
    strategy: z.enum(FIT_STRATEGIES as ['add', 'fewest'], { error: "strategy must be 'add' or 'fewest'" }).default('add'),
    mode: z
      .enum(ROUND_MODES as ['per-edge', 'continuous'], { error: "mode must be 'per-edge' or 'continuous'" })
      .default('per-edge'),
    lead: z.number({ error: 'lead must be a number' }).int('lead must be a whole number').min(0, 'lead must be 0 or more').optional(),
    centre: z
      .number({ error: 'centre must be a number' })
      .int('centre must be a whole number')
      .min(0, 'centre must be 0 or more')
      .optional(),
    cornerStitches: z
      .number({ error: 'cornerStitches must be a number' })
      .int('cornerStitches must be a whole number')
      .min(1, 'cornerStitches must be at least 1')
      .max(MAX_CORNER_STITCHES, `cornerStitches must be at most ${MAX_CORNER_STITCHES}`)
      .optional(),
  })
  .superRefine((req, ctx) => {
    if (req.lead !== undefined && req.lead > req.offset) {
      ctx.addIssue({ code: 'custom', path: ['lead'], message: 'lead cannot be more than offset' });
    }
    if (req.centre !== undefined && req.centre >= req.multiple) {
      ctx.addIssue({ code: 'custom', path: ['centre'], message: 'centre must be less than multiple' });
    }
  });

export type BorderFitRequest = z.infer<typeof BorderFitRequestSchema>;
/** What a client sends (defaults optional); rows is spelled out because the schema reads it as unknown. */
export type BorderFitRequestInput = Omit<z.input<typeof BorderFitRequestSchema>, 'rows'> & {
  rows: number | { count: number; pattern: RowType[] };
};

const positiveNumber = (field: string, max: number) =>
  z
    .number({ error: `${field} must be a number` })
    .positive(`${field} must be more than 0`)
    .max(max, `${field} must be at most ${max}`);

const LengthUnitSchema = z.enum(['cm', 'in'], { error: "unit must be 'cm' or 'in'" });

export const GaugeSchema = z.object({
  stitches: positiveNumber('gauge.stitches', 200),
  rows: positiveNumber('gauge.rows', 200),
  over: positiveNumber('gauge.over', 100),
  unit: LengthUnitSchema,
});

/** Inputs of bodyCountsFromGauge. Sizes in target.unit; 400 cm ≈ 157 in is beyond any blanket. */
export const SizeFromGaugeRequestSchema = z
  .object({
    gauge: GaugeSchema,
    target: z.object({
      width: positiveNumber('target.width', 400),
      length: positiveNumber('target.length', 400),
      unit: LengthUnitSchema,
    }),
    borderDepth: z
      .number({ error: 'borderDepth must be a number' })
      .min(0, 'borderDepth must be 0 or more')
      .max(50, 'borderDepth must be at most 50'),
    bodyStitch: z.enum(BODY_STITCHES_FOR_CHAIN as ['sc', 'hdc', 'dc', 'tr', 'dtr'], {
      error: `bodyStitch must be one of ${BODY_STITCHES_FOR_CHAIN.join(', ')}`,
    }),
    stitchMultiple: z.number().int('stitchMultiple must be a whole number').min(1).max(MAX_MULTIPLE).default(1),
    stitchOffset: z.number().int('stitchOffset must be a whole number').min(0).max(MAX_OFFSET).default(0),
    rowMultiple: z.number().int('rowMultiple must be a whole number').min(1).max(MAX_MULTIPLE).default(1),
    rowOffset: z.number().int('rowOffset must be a whole number').min(0).max(MAX_OFFSET).default(0),
  })
  .superRefine((req, ctx) => {
    if (2 * req.borderDepth >= Math.min(req.target.width, req.target.length)) {
      ctx.addIssue({ code: 'custom', path: ['borderDepth'], message: 'borderDepth leaves no room for the body' });
    }
  });
export type SizeFromGaugeRequest = z.infer<typeof SizeFromGaugeRequestSchema>;

/** Inputs of estimateYarn. */
export const YarnEstimateRequestSchema = z.object({
  body: z.object({
    width: positiveNumber('body.width', 400),
    length: positiveNumber('body.length', 400),
    unit: LengthUnitSchema,
  }),
  yarnWeight: z
    .number({ error: 'yarnWeight must be a number' })
    .int('yarnWeight must be a whole number')
    .min(1, 'yarnWeight must be from 1 to 7 (no estimate for lace)')
    .max(7, 'yarnWeight must be from 1 to 7'),
  border: z
    .object({
      depth: z.number({ error: 'border.depth must be a number' }).min(0, 'border.depth must be 0 or more').max(50),
      yarnFactor: positiveNumber('border.yarnFactor', 5).optional(),
    })
    .optional(),
  margin: z.number({ error: 'margin must be a number' }).min(0, 'margin must be 0 or more').max(1, 'margin must be at most 1').default(0.1),
  skein: z
    .object({
      length: positiveNumber('skein.length', 10000),
      unit: z.enum(['m', 'yd'], { error: "skein.unit must be 'm' or 'yd'" }),
    })
    .optional(),
  yardsPerSqIn: positiveNumber('yardsPerSqIn', 20).optional(),
});
export type YarnEstimateRequest = z.infer<typeof YarnEstimateRequestSchema>;
