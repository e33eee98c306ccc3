/**
 * The intake table's requests: receiving a blanket, inspecting it, the day's queue and the tag sheet.
 * The rules they feed (the checklist, the suggested outcome) are in shared/intake/rules.ts, and
 * what the API answers with is in ./intake-views.ts.
 */
import { z } from 'zod';
import { BlanketFieldsSchema, MAX_SIDE_CM } from './blanket';
import { IsoDaySchema } from './recipient';
import { PageQuerySchema } from './page-query';
import { codeFromScan, normaliseCode } from '../blankets/code';

const id = (label: string) =>
  z
    .number({ error: `${label} must be a number` })
    .int(`${label} must be a whole number`)
    .positive(`${label} must be more than 0`);

const sideCm = (label: string) =>
  z
    .number({ error: `${label} must be a number of centimetres` })
    .positive(`${label} must be more than 0 cm`)
    .max(MAX_SIDE_CM, `${label} over ${MAX_SIDE_CM} cm is not a blanket we can take`);

const note = (label: string, max: number) =>
  z.string({ error: `${label} must be text` }).trim().max(max, `${label}: at most ${max} characters`);

/** POST /api/blankets/:id/intake: received at a site, measured again on the table. */
export const IntakeBodySchema = z.object({
  siteId: id('siteId'),
  widthCm: sideCm('Width'),
  lengthCm: sideCm('Length'),
  note: note('Note', 1000).optional(),
  /** The blanket's version as last read, so two organisers can't receive it twice unknowingly. */
  version: z.number({ error: 'version must be a number' }).int().min(0).optional(),
});
export type IntakeBody = z.infer<typeof IntakeBodySchema>;

const yesNo = (label: string) => z.boolean({ error: `${label}: answer yes or no` });

export const ChecklistSchema = z.object({
  endsWovenIn: yesNo('Ends woven in'),
  noFingertipHoles: yesNo('No holes a fingertip passes through'),
  nothingLoose: yesNo('Nothing loose'),
  clean: yesNo('Clean'),
  noSmokeOrPetOdour: yesNo('No smoke or pet odour'),
  matchesLog: yesNo('Matches its log'),
});
export type Checklist = z.infer<typeof ChecklistSchema>;

export const INSPECTION_OUTCOMES = ['checked', 'needs_fix', 'declined', 'redirect'] as const;
export const InspectionOutcomeSchema = z.enum(INSPECTION_OUTCOMES, {
  error: `outcome must be one of ${INSPECTION_OUTCOMES.join(', ')}`,
});
export type InspectionOutcome = z.infer<typeof InspectionOutcomeSchema>;

/** Corrections to the log found on the table; the check runs on the corrected blanket. */
const log = BlanketFieldsSchema.shape;
// Built field by field rather than with .partial(): the log's defaults (no features, not dryer
// safe, new yarn) must not fill in fields the organiser did not correct.
export const CorrectionsSchema = z
  .strictObject({
    widthCm: log.widthCm.optional(),
    lengthCm: log.lengthCm.optional(),
    yarnWeight: log.yarnWeight.optional(),
    fibres: log.fibres.optional(),
    features: log.features.unwrap().optional(),
    machineWashable: log.machineWashable.optional(),
    dryerSafe: log.dryerSafe.unwrap().optional(),
    smokeFree: log.smokeFree.optional(),
    petFree: log.petFree.optional(),
    newYarn: log.newYarn.unwrap().optional(),
  })
  .refine((c) => Object.keys(c).length > 0, 'corrections: name at least one field that differs from the log');
export type Corrections = z.infer<typeof CorrectionsSchema>;

/** POST /api/blankets/:id/inspection */
export const InspectionBodySchema = z
  .object({
    checklist: ChecklistSchema,
    corrections: CorrectionsSchema.optional(),
    /** The recipient to check against when the blanket has none yet ("wherever it's needed most"). */
    recipientId: id('recipientId').optional(),
    outcome: InspectionOutcomeSchema,
    redirectRecipientId: id('redirectRecipientId').optional(),
    /** Needed whenever the outcome differs from the one the check suggests. */
    overrideReason: note('Override reason', 1000).optional(),
    /** Extra words for the maker when it goes back for a fix. */
    fixNote: note('Note to the maker', 1000).optional(),
    note: note('Note', 1000).optional(),
    version: z.number({ error: 'version must be a number' }).int().min(0).optional(),
  })
  .superRefine((v, ctx) => {
    if (v.outcome === 'redirect' && v.redirectRecipientId === undefined) {
      ctx.addIssue({ code: 'custom', path: ['redirectRecipientId'], message: 'redirectRecipientId: choose where to send it' });
    }
    if (v.outcome !== 'redirect' && v.redirectRecipientId !== undefined) {
      ctx.addIssue({
        code: 'custom',
        path: ['redirectRecipientId'],
        message: "redirectRecipientId is only for the outcome 'redirect'",
      });
    }
    if (!v.checklist.matchesLog && !v.corrections && !v.note) {
      ctx.addIssue({
        code: 'custom',
        path: ['corrections'],
        message: 'It does not match its log: record what differs (corrections) or say so in a note',
      });
    }
  });
export type InspectionBody = z.infer<typeof InspectionBodySchema>;

const listPage = (name: string) => z.coerce.number({ error: `${name} must be a number` }).int(`${name} must be a whole number`).min(1, `${name} starts at 1`).default(1);

/** The day's lists come whole; the waiting and the expected lists come a page at a time. */
export const IntakeQueueQuerySchema = z.object({
  siteId: z.coerce.number({ error: 'siteId must be a number' }).int().positive('siteId must be more than 0'),
  /** The drive's today when left out. */
  date: IsoDaySchema.optional(),
  waitingPage: listPage('waitingPage'),
  expectedPage: listPage('expectedPage'),
  pageSize: PageQuerySchema.shape.pageSize,
});
export type IntakeQueueQuery = z.infer<typeof IntakeQueueQuerySchema>;

/** A tag code as typed or scanned: the bare code or the tag's link, forgiven its case and spaces. */
export const BlanketCodeParamSchema = z.object({
  code: z
    .string()
    .max(200, 'code: use the letters and digits printed on the tag, e.g. KL-7Q4M')
    .transform((s, ctx) => {
      const code = normaliseCode(codeFromScan(s));
      if (code === null) {
        ctx.addIssue({ code: 'custom', message: 'code: use the letters and digits printed on the tag, e.g. KL-7Q4M' });
        return z.NEVER;
      }
      return code;
    }),
});

import { MAX_TAGS_PER_SHEET } from './intake-values';

export { MAX_TAGS_PER_SHEET };

/** Worded for the person who followed a broken or hand-edited tag-sheet link, not for a programmer. */
const TAGS_CHOOSE = 'Choose the blankets to print tags for from My blankets or a blanket’s own page';

export const TagsQuerySchema = z.object({
  ids: z
    .string({ error: TAGS_CHOOSE })
    .regex(/^\d+(,\d+)*$/, TAGS_CHOOSE)
    .transform((s) => [...new Set(s.split(',').map(Number))])
    .refine((a) => a.length <= MAX_TAGS_PER_SHEET, `A sheet holds at most ${MAX_TAGS_PER_SHEET} tags; print the rest on a second sheet`),
});
