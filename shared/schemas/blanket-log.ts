import { z } from 'zod';
import { GLANCE_STEPS } from '../drive/glance';
import { IsoDaySchema } from './schedule';
import {
  BlanketFieldsSchema,
  BlanketStatusSchema,
  BodyStitchSchema,
  LabelNameSchema,
  type BlanketStatus,
  type BodyStitch,
  type Feature,
  type Fibre,
  type LabelName,
  type SizeCategory,
} from './blanket';
import type { GuidelineCheckResult } from './guidelines';
import type { Caution, RecipientBrief } from './pledge';
import { MAX_REASON_LENGTH } from '../blankets/status';
import { BORDER_LIBRARY } from '../border/library';
import { PageQuerySchema, SearchSchema } from './page-query';

export const MAX_NOTES_LENGTH = 2000;
export const MAX_COLOURS_LENGTH = 200;
import { MAX_PHOTOS_PER_BLANKET, MAX_PHOTO_BYTES, PHOTO_MIME_TYPES, type PhotoMime } from './blanket-log-values';

export { MAX_PHOTOS_PER_BLANKET, MAX_PHOTO_BYTES, PHOTO_MIME_TYPES, type PhotoMime };

const id = (field: string) =>
  z
    .number({ error: `${field} must be a number` })
    .int(`${field} must be a whole number`)
    .positive(`${field} must be more than 0`);

const borderId = z
  .string({ error: 'Choose a border from the library' })
  .refine((v) => BORDER_LIBRARY.some((b) => b.id === v), 'That border is not in the library')
  .nullable();

/** The parts of a blanket the maker writes in the log, beyond what the guideline check reads. */
const LogExtras = z.object({
  colours: z.string({ error: 'Describe the colours in words' }).trim().max(MAX_COLOURS_LENGTH, `Colours: at most ${MAX_COLOURS_LENGTH} characters`).default(''),
  bodyStitch: BodyStitchSchema.default('other'),
  borderId: borderId.default(null),
  planId: id('planId').nullable().default(null),
  labelName: LabelNameSchema.default('first-name'),
  notes: z.string().max(MAX_NOTES_LENGTH, `Notes: at most ${MAX_NOTES_LENGTH} characters`).default(''),
});

/** Logging a blanket starts it in progress, or finished when it is already done. */
export const INITIAL_STATUSES = ['in_progress', 'finished'] as const;

/** POST /api/blankets */
export const BlanketCreateSchema = BlanketFieldsSchema.extend({
  pledgeId: id('pledgeId'),
  status: z.enum(INITIAL_STATUSES, { error: "A new blanket is either 'in_progress' or 'finished'" }).default('in_progress'),
})
  .extend(LogExtras.shape)
  .strict();
export type BlanketCreate = z.infer<typeof BlanketCreateSchema>;
export type BlanketCreateInput = z.input<typeof BlanketCreateSchema>;

const reason = z.string().trim().max(MAX_REASON_LENGTH, `Reason: at most ${MAX_REASON_LENGTH} characters`);

/**
 * PATCH /api/blankets/:id: any of the logged fields, and/or a status move (`status`, with a
 * `reason` when it goes backwards). `version` is the one the client last saw.
 */
const fields = BlanketFieldsSchema.shape;
export const BlanketUpdateSchema = z
  .object({
    widthCm: fields.widthCm.optional(),
    lengthCm: fields.lengthCm.optional(),
    yarnWeight: fields.yarnWeight.optional(),
    fibres: fields.fibres.optional(),
    // Defaults belong to creation only: an update that leaves a field out must leave it alone.
    features: fields.features.removeDefault().optional(),
    machineWashable: fields.machineWashable.optional(),
    dryerSafe: fields.dryerSafe.removeDefault().optional(),
    smokeFree: fields.smokeFree.optional(),
    petFree: fields.petFree.optional(),
    newYarn: fields.newYarn.removeDefault().optional(),
    colours: LogExtras.shape.colours.removeDefault().optional(),
    bodyStitch: BodyStitchSchema.optional(),
    borderId: borderId.optional(),
    planId: id('planId').nullable().optional(),
    labelName: LabelNameSchema.optional(),
    notes: LogExtras.shape.notes.removeDefault().optional(),
    siteId: id('siteId').nullable().optional(),
    status: BlanketStatusSchema.optional(),
    reason: reason.optional(),
    version: z.number().int().min(0).optional(),
  })
  .strict();
export type BlanketUpdate = z.infer<typeof BlanketUpdateSchema>;

/** The fields of an update that change the log itself, as opposed to the status. */
export const LOG_FIELDS = [
  'widthCm',
  'lengthCm',
  'yarnWeight',
  'fibres',
  'features',
  'machineWashable',
  'dryerSafe',
  'smokeFree',
  'petFree',
  'newYarn',
  'colours',
  'bodyStitch',
  'borderId',
  'planId',
  'labelName',
  'notes',
] as const;

const flag = z.enum(['true', 'false', '1', '0']).transform((v) => v === 'true' || v === '1');

/** The columns the blanket list sorts by on the server; status follows a blanket's life, size its area. */
export const BLANKET_SORTS = ['createdAt', 'code', 'status', 'recipient', 'size', 'maker', 'colours'] as const;
export type BlanketSort = (typeof BLANKET_SORTS)[number];

/** GET /api/blankets: one page, newest first unless `sort`/`dir` say otherwise; `q` searches code, colours, recipient and maker. */
const stepEnum = z.enum(GLANCE_STEPS, { error: `A step is one of ${GLANCE_STEPS.join(', ')}` });

/**
 * GET /api/blankets: one page, newest first unless `sort`/`dir` say otherwise; `q` searches code,
 * colours, recipient and maker. The drive at a glance links here with the filters behind each of its
 * figures: `step` (now at that step), `needId` (counted for that need: its live assignment's need, or
 * else its pledge's), and `reached` with `from`/`to` (reached that step on a day from `from` up to,
 * not including, `to`, in UTC).
 */
export const BlanketListQuerySchema = PageQuerySchema.extend({
  mine: flag.optional(),
  status: BlanketStatusSchema.optional(),
  pledgeId: z.coerce.number().int().positive().optional(),
  step: stepEnum.optional(),
  needId: z.coerce.number({ error: 'needId must be a number' }).int('needId must be a whole number').positive('needId must be positive').optional(),
  reached: stepEnum.optional(),
  from: IsoDaySchema.optional(),
  to: IsoDaySchema.optional(),
  sort: z.enum(BLANKET_SORTS, { error: `sort is one of ${BLANKET_SORTS.join(', ')}` }).default('createdAt'),
  q: SearchSchema,
})
  .refine((v) => (v.reached === undefined) === (v.from === undefined && v.to === undefined) && (v.from === undefined) === (v.to === undefined), {
    message: 'reached, from and to go together',
    path: ['reached'],
  })
  .refine((v) => v.from === undefined || v.to === undefined || v.from < v.to, { message: 'to must be after from', path: ['to'] });
export type BlanketListQuery = z.infer<typeof BlanketListQuerySchema>;

export const PhotoParamsSchema = z.object({
  id: z.coerce.number().int().positive('Not a valid id'),
  photoId: z.coerce.number().int().positive('Not a valid photo id'),
});
export const PhotoQuerySchema = z.object({ size: z.enum(['full', 'thumb']).default('full') });

export interface PhotoView {
  id: number;
  mime: string;
  bytes: number;
  width: number | null;
  height: number | null;
  createdAt: string;
  url: string;
  thumbUrl: string;
}

export interface BlanketEventView {
  id: number;
  kind: string;
  fromStatus: BlanketStatus | null;
  toStatus: BlanketStatus | null;
  reason: string | null;
  data: unknown;
  createdAt: string;
  actor: { id: number; name: string } | null;
}

/** A row of "my blankets" (and the organisers' list). */
export interface BlanketSummary {
  id: number;
  code: string;
  status: BlanketStatus;
  userId: number;
  makerName: string;
  pledgeId: number | null;
  recipientId: number | null;
  recipientName: string | null;
  sizeCategory: SizeCategory | null;
  widthCm: number;
  lengthCm: number;
  yarnWeight: number;
  colours: string;
  photoCount: number;
  coverPhoto: PhotoView | null;
  version: number;
  createdAt: string;
  updatedAt: string;
}

/** The next moves this person may make, for the buttons on the blanket page. */
export interface MoveView {
  to: BlanketStatus;
  direction: 'forward' | 'back';
  action: string;
}

/**
 * What the organisers found when they sent a blanket back for a fix or declined it, shown to its
 * maker while that is where it stands, so the page says what to put right.
 */
export interface InspectionFindings {
  outcome: 'needs_fix' | 'declined';
  at: string;
  /** The recipient it was checked against. */
  recipientName: string | null;
  /** What the table found: checklist items that were not so, then the guidelines it missed. */
  findings: string[];
  /** What the maker could do about it, one line each (the fix mail lists the same). */
  fixes: string[];
  /** The organiser's own words to the maker, if any. */
  note: string | null;
}

export interface BlanketDetail extends BlanketSummary {
  /** The size measured at the drop-off table, where it was; the self-check uses it over the logged one. */
  measured: { widthCm: number; lengthCm: number } | null;
  /** Set while the blanket needs a fix or was declined: what the organisers found and asked for. */
  inspection: InspectionFindings | null;
  fibres: Fibre[];
  features: Feature[];
  bodyStitch: BodyStitch;
  borderId: string | null;
  planId: number | null;
  siteId: number | null;
  machineWashable: boolean;
  dryerSafe: boolean;
  smokeFree: boolean;
  petFree: boolean;
  newYarn: boolean;
  labelName: LabelName;
  notes: string;
  receivedAt: string | null;
  photos: PhotoView[];
  events: BlanketEventView[];
  recipient: RecipientBrief | null;
  /** The recipient's guideline check on the fields on record (the measured size where there is one); null when it has no recipient yet. */
  selfCheck: GuidelineCheckResult | null;
  /** Recipients whose guidelines it meets as it is, for a blanket pledged "wherever needed most". */
  fitsRecipients: Array<{ recipientId: number; name: string }>;
  cautions: Caution[];
  moves: MoveView[];
  /** True when this person's next step is receiving or inspecting it, which happens on the intake page. */
  atIntake: boolean;
  editable: boolean;
}
