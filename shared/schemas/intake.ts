import { z } from 'zod';
import { BlanketFieldsSchema, MAX_SIDE_CM, type BlanketStatus, type Population } from './blanket';
import type { GuidelineCheckResult, GuidelineSet } from './guidelines';
import { IsoDaySchema } from './recipient';
import { PageQuerySchema } from './page-query';
import { normaliseCode } from '../blankets/code';

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

/** Statuses a blanket may be received from: a drop-off without a booking is normal, and a mended one comes back. */
export const RECEIVABLE_STATUSES = ['finished', 'booked', 'needs_fix'] as const satisfies readonly BlanketStatus[];

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

/** What an organiser looks at on the table, in the order they usually look. */
export const CHECKLIST_ITEMS = [
  {
    key: 'endsWovenIn',
    label: 'Ends woven in',
    fix: 'Weave in the loose yarn ends securely, so none can be pulled out.',
  },
  {
    key: 'noFingertipHoles',
    label: 'No holes a fingertip passes through',
    fix: 'Close the holes a fingertip can pass through (often a dropped or missed stitch).',
  },
  {
    key: 'nothingLoose',
    label: 'Nothing loose or coming apart',
    fix: 'Secure the loose or unravelling parts so nothing can come away.',
  },
  { key: 'clean', label: 'Clean', fix: 'Wash it as the yarn label says and let it dry fully.' },
  {
    key: 'noSmokeOrPetOdour',
    label: 'No smoke or pet odour',
    fix: 'Wash it and air it well away from smoke and pets.',
  },
  { key: 'matchesLog', label: 'Matches its log', fix: null },
] as const;
export type ChecklistKey = (typeof CHECKLIST_ITEMS)[number]['key'];

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

export const OUTCOME_LABELS: Record<InspectionOutcome, string> = {
  checked: 'Checked, ready to go',
  needs_fix: 'Back to the maker for a fix',
  declined: 'Declined',
  redirect: 'Send to another recipient',
};

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

export interface Suggestion {
  outcome: InspectionOutcome;
  /** Set when the suggestion is to redirect: the first recipient that takes it as it is. */
  redirectRecipientId: number | null;
  /** Plain reasons for the suggestion, checklist first, then the guideline check. */
  because: string[];
  /** What the maker could put right at home, whatever the outcome; the fix e-mail lists these. */
  fixes: string[];
}

/**
 * The outcome the table suggests from the checklist and the guideline check. Odour is the one
 * checklist failure a wash rarely cures, so where the unit wants smoke-free or pet-free homes it
 * means decline; the other checklist failures the maker can put right. Otherwise the check's own
 * verdict decides: ready → checked, mend → needs_fix, reroute → redirect when another recipient
 * takes it as it is (a fix first when it only fits elsewhere after one), decline → declined.
 */
export function suggestOutcome(
  checklist: Checklist,
  result: GuidelineCheckResult,
  guidelines: Pick<GuidelineSet, 'requireSmokeFree' | 'requirePetFree'>,
): Suggestion {
  const failed = CHECKLIST_ITEMS.filter((item) => !checklist[item.key]);
  const because: string[] = failed.map((item) => `Not so: ${item.label.toLowerCase()}.`);
  because.push(...result.reasons.map((r) => r.message));

  const odourFails = !checklist.noSmokeOrPetOdour;
  const checklistFixes = failed.flatMap((item): string[] => (item.fix === null ? [] : [item.fix]));
  const ruleFixes = result.reasons.map((r) => r.fix).filter((f): f is string => f !== undefined);
  const fixes = [...checklistFixes, ...ruleFixes];

  if (odourFails && (guidelines.requireSmokeFree || guidelines.requirePetFree)) {
    return { outcome: 'declined', redirectRecipientId: null, because, fixes };
  }

  if (checklistFixes.length > 0 && result.verdict !== 'decline') {
    return { outcome: 'needs_fix', redirectRecipientId: null, because, fixes };
  }
  switch (result.verdict) {
    case 'ready':
      return { outcome: 'checked', redirectRecipientId: null, because, fixes };
    case 'mend':
      return { outcome: 'needs_fix', redirectRecipientId: null, because, fixes };
    case 'reroute': {
      const first = result.alsoFits[0];
      if (first) return { outcome: 'redirect', redirectRecipientId: first.recipientId, because, fixes };
      const afterMend = result.alsoFitsAfterMend[0];
      return {
        outcome: 'needs_fix',
        redirectRecipientId: null,
        because: afterMend ? [...because, `After the fix it would suit ${afterMend.name}.`] : because,
        fixes,
      };
    }
    case 'decline':
      return { outcome: 'declined', redirectRecipientId: null, because, fixes };
  }
}

const listPage = (name: string) => z.coerce.number({ error: `${name} must be a number` }).int(`${name} must be a whole number`).min(1, `${name} starts at 1`).default(1);

/** The day's lists come whole; the waiting and the expected lists come a page at a time. */
export const IntakeQueueQuerySchema = z.object({
  siteId: z.coerce.number({ error: 'siteId must be a number' }).int().positive('siteId must be more than 0'),
  date: IsoDaySchema,
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

/** Pulls the code out of what a scanner or a paste gives us: the bare code or the tag's link. */
export function codeFromScan(input: string): string {
  const s = input.trim();
  const fromLink = /[?&]code=([A-Za-z0-9-]+)/.exec(s);
  return fromLink?.[1] ?? s;
}

export const MAX_TAGS_PER_SHEET = 60;

/** Worded for the person who followed a broken or hand-edited tag-sheet link, not for a programmer. */
const TAGS_CHOOSE = 'Choose the blankets to print tags for from My blankets or a blanket’s own page';

export const TagsQuerySchema = z.object({
  ids: z
    .string({ error: TAGS_CHOOSE })
    .regex(/^\d+(,\d+)*$/, TAGS_CHOOSE)
    .transform((s) => [...new Set(s.split(',').map(Number))])
    .refine((a) => a.length <= MAX_TAGS_PER_SHEET, `A sheet holds at most ${MAX_TAGS_PER_SHEET} tags; print the rest on a second sheet`),
});

export interface BlanketTag {
  id: number;
  code: string;
  /** The maker's first name, or "Anonymous" when they chose that for labels. */
  makerLabel: string;
  widthCm: number;
  lengthCm: number;
  sizeCategory: string | null;
  recipientName: string | null;
  /** Who it is meant for, so a tag going to babies can carry the safe-sleep reminder. */
  recipientPopulation: Population | null;
  /** What the QR code holds: a link to this blanket's intake page. */
  link: string;
  /** The QR code as an SVG document. */
  qrSvg: string;
}

export interface BlanketHistoryEntry {
  id: number;
  kind: string;
  fromStatus: string | null;
  toStatus: string | null;
  reason: string | null;
  data: unknown;
  createdAt: string;
  actor: { id: number; name: string } | null;
}

/** A blanket as the intake table sees it: the log, who made it, where it is meant to go, its history. */
export interface IntakeBlanketView {
  id: number;
  code: string;
  status: BlanketStatus;
  version: number;
  /** The size on record: measured at intake where it was, else as logged. */
  widthCm: number;
  lengthCm: number;
  /** Whether widthCm/lengthCm are the intake measurement. */
  measured: boolean;
  /** The size as its maker logged it, kept beside the measurement. */
  logged: { widthCm: number; lengthCm: number };
  yarnWeight: number;
  fibres: string[];
  features: string[];
  colours: string;
  bodyStitch: string;
  machineWashable: boolean;
  dryerSafe: boolean;
  smokeFree: boolean;
  petFree: boolean;
  newYarn: boolean;
  notes: string;
  sizeCategory: string | null;
  receivedAt: string | null;
  maker: { id: number; name: string; label: string };
  recipient: { id: number; name: string; population: string } | null;
  site: { id: number; name: string } | null;
  history: BlanketHistoryEntry[];
}

export interface IntakeQueueItem {
  id: number;
  code: string;
  status: BlanketStatus;
  makerLabel: string;
  recipientName: string | null;
  widthCm: number;
  lengthCm: number;
  sizeCategory: string | null;
  /** When it arrived, or for inspected ones when it was inspected. */
  at: string | null;
}

export interface IntakeQueue {
  site: { id: number; name: string };
  date: string;
  /** Received at this site on this day. */
  arrived: IntakeQueueItem[];
  /** At this site, received and not yet inspected (by the end of this day): one page, oldest first. */
  waiting: IntakeQueueItem[];
  waitingTotal: number;
  waitingPage: number;
  /** Inspected on this day, with the outcome as its status. */
  inspected: IntakeQueueItem[];
  /** Booked to come to this site (the day comes with drop-off scheduling). */
  expected: IntakeQueueItem[];
  expectedTotal: number;
  expectedPage: number;
  /** Rows per page of the waiting and the expected lists. */
  pageSize: number;
}
