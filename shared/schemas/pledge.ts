import { z } from 'zod';
import { SizeCategorySchema, type BlanketStatus, type Population } from './blanket';
import type { GuidelineSet } from './guidelines';
import { IsoDaySchema } from './recipient';
import { PageQuerySchema, SearchSchema } from './page-query';

/** Most blankets one person promises in one pledge; past this it is a typing slip, not a plan. */
import { MAX_PLEDGE_QUANTITY } from './pledge-values';

export { MAX_PLEDGE_QUANTITY };
/** How far ahead a finish date may be, in days: a drive runs for months, not years. */
export const MAX_PLEDGE_DAYS_AHEAD = 730;

export const PLEDGE_STATUSES = ['active', 'cancelled', 'fulfilled'] as const;
export const PledgeStatusSchema = z.enum(PLEDGE_STATUSES);
export type PledgeStatus = z.infer<typeof PledgeStatusSchema>;

const quantity = z
  .number({ error: 'Quantity must be a number' })
  .int('Quantity must be a whole number')
  .min(1, 'Pledge at least 1 blanket')
  .max(MAX_PLEDGE_QUANTITY, `Pledge at most ${MAX_PLEDGE_QUANTITY} blankets at a time`);

const needId = z
  .number({ error: 'needId must be a number or null' })
  .int('needId must be a whole number')
  .positive('needId must be more than 0')
  .nullable();

/** POST /api/pledges. `needId` null means "wherever it's needed most". */
export const PledgeCreateSchema = z.object({
  needId,
  quantity,
  sizeCategory: SizeCategorySchema,
  dueDate: IsoDaySchema,
}).strict();
export type PledgeCreate = z.infer<typeof PledgeCreateSchema>;

/** PATCH /api/pledges/:id: edit, reduce or push back. `version` guards against two tabs editing at once. */
export const PledgeUpdateSchema = z
  .object({
    needId: needId.optional(),
    quantity: quantity.optional(),
    sizeCategory: SizeCategorySchema.optional(),
    dueDate: IsoDaySchema.optional(),
    version: z.number().int().min(0).optional(),
  })
  .strict()
  .refine(
    (v) => v.needId !== undefined || v.quantity !== undefined || v.sizeCategory !== undefined || v.dueDate !== undefined,
    'Send at least one of needId, quantity, sizeCategory or dueDate',
  );
export type PledgeUpdate = z.infer<typeof PledgeUpdateSchema>;

const flag = z.enum(['true', 'false', '1', '0']).transform((v) => v === 'true' || v === '1');

/** GET /api/pledges. Organisers and coordinators see everyone's unless they ask for `mine`. */
export const PLEDGE_SORTS = ['dueDate', 'createdAt', 'quantity', 'status', 'maker'] as const;
export type PledgeSort = (typeof PLEDGE_SORTS)[number];

/** One page, soonest due first unless `sort`/`dir` say otherwise; `q` searches the maker's name. */
export const PledgeListQuerySchema = PageQuerySchema.extend({
  mine: flag.optional(),
  status: PledgeStatusSchema.optional(),
  needId: z.coerce.number().int().positive().optional(),
  /** Only the pledges whose blankets are promised (active or fulfilled): the ones the pledged figures add up. */
  promising: flag.optional(),
  /** Made on a day from `from` up to, not including, `to` (UTC); both or neither. */
  from: IsoDaySchema.optional(),
  to: IsoDaySchema.optional(),
  sort: z.enum(PLEDGE_SORTS, { error: `sort is one of ${PLEDGE_SORTS.join(', ')}` }).default('dueDate'),
  q: SearchSchema,
})
  .refine((v) => (v.from === undefined) === (v.to === undefined), { message: 'from and to go together', path: ['from'] })
  .refine((v) => v.from === undefined || v.to === undefined || v.from < v.to, { message: 'to must be after from', path: ['to'] });
export type PledgeListQuery = z.infer<typeof PledgeListQuerySchema>;

/** GET /api/pledges: one page, and how many blankets all the pledges that match promise between them. */
export interface PledgePage {
  items: PledgeView[];
  total: number;
  page: number;
  pageSize: number;
  blankets: number;
}

/** A pledge as the API returns it. */
export interface PledgeView {
  id: number;
  userId: number;
  makerName?: string;
  needId: number | null;
  quantity: number;
  sizeCategory: z.infer<typeof SizeCategorySchema>;
  dueDate: string;
  status: PledgeStatus;
  version: number;
  createdAt: string;
  /** Blankets logged under it that take a place in it: any status but declined (shared/pledges/rules.ts). */
  blanketsLogged: number;
  /** Blankets logged under it and declined at intake; each leaves a place for a replacement. */
  blanketsDeclined: number;
  /** Of those, the ones the maker has finished (anything past in progress, except declined). */
  blanketsFinished: number;
  /** Past its date with blankets still to finish. */
  late: boolean;
  /** Its date is after the need's deadline (possible after a push-back). */
  afterDeadline: boolean;
  need: null | {
    id: number;
    sizeCategory: z.infer<typeof SizeCategorySchema>;
    deadline: string;
    recipient: RecipientBrief;
  };
}

export interface Caution {
  id: string;
  text: string;
  source: string;
}

/** What a maker needs to know about where a blanket goes: enough to run the self-check at home. */
export interface RecipientBrief {
  id: number;
  name: string;
  kind: string;
  population: Population;
  guidelines: GuidelineSet;
  guidelineSummary: string[];
  cautions: Caution[];
}

/**
 * The figures every page and chart shows for one need, all from one aggregate query
 * (server/modules/pledges/need-counts.ts), so that no two pages can disagree.
 */
export interface NeedCounts {
  needId: number;
  recipientId: number;
  /** Blankets the recipient asked for. */
  wanted: number;
  /** Promised in active or fulfilled pledges: a fulfilled pledge's blankets are made, so no longer wanted. */
  pledged: number;
  /** Blankets under those pledges that are made and not declined (see FINISHED_STATUSES). */
  finished: number;
  /** Of those, the ones with the organisers now (WITH_ORGANISERS). */
  inHand: number;
  /** Of those, the ones given to a recipient (ASSIGNED_STATUSES). */
  assigned: number;
}

/** The drive's progress for the staff home page: per recipient, and blankets per status. */
export interface DriveProgress {
  recipients: Array<{ recipientId: number; name: string; wanted: number; pledged: number; finished: number; inHand: number; assigned: number }>;
  statuses: Array<{ status: BlanketStatus; count: number }>;
}

/** An open need as a volunteer sees it in "What's needed". */
export interface OpenNeed {
  id: number;
  sizeCategory: z.infer<typeof SizeCategorySchema>;
  quantity: number;
  deadline: string;
  preferences: string | null;
  /** Blankets promised in active or fulfilled pledges. */
  pledged: number;
  stillWanted: number;
  /** How many more are promised than wanted (0 when not over). */
  overPledged: number;
  /** The current user's own active pledges against this need. */
  myPledged: number;
  recipient: RecipientBrief;
}
