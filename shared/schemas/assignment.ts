import { z } from 'zod';
import { SizeCategorySchema, type BlanketStatus, type Population, type SizeCategory } from './blanket';
import { PageQuerySchema } from './page-query';
import type { Caution } from '../guidelines/cautions';

/**
 * Assigning checked blankets to recipients' needs: by hand on the board, or by accepting the
 * suggestion for the whole drive. Request schemas for every assignment route and the views they
 * answer with.
 */

export const ASSIGNMENT_SOURCES = ['board', 'suggestion'] as const;
export type AssignmentSource = (typeof ASSIGNMENT_SOURCES)[number];

const id = (what: string) =>
  z.coerce
    .number({ error: `${what} must be a number` })
    .int(`${what} must be a whole number`)
    .positive(`${what} must be a positive id`);

/** A reason kept in the blanket's history; a paragraph is enough. */
export const MAX_ASSIGNMENT_REASON = 500;
const reason = z
  .string({ error: 'reason: say why' })
  .trim()
  .min(1, 'reason: say why')
  .max(MAX_ASSIGNMENT_REASON, `reason: at most ${MAX_ASSIGNMENT_REASON} characters`);

/** POST /api/assignments */
export const AssignBodySchema = z.object({
  blanketId: id('blanketId'),
  needId: id('needId'),
});
export type AssignBody = z.infer<typeof AssignBodySchema>;

/** Most pairs one batch may carry: a whole drive's suggestion on a busy day, with room to spare. */
export const MAX_BATCH_PAIRS = 2000;

/** POST /api/assignments/batch: several pairs applied in one transaction, each with its own outcome. */
export const AssignBatchBodySchema = z
  .object({
    pairs: z
      .array(AssignBodySchema)
      .min(1, 'pairs: choose at least one blanket to assign')
      .max(MAX_BATCH_PAIRS, `pairs: at most ${MAX_BATCH_PAIRS} at once`),
    source: z.enum(ASSIGNMENT_SOURCES).default('board'),
  })
  .superRefine((b, ctx) => {
    const seen = new Set<number>();
    b.pairs.forEach((p, i) => {
      if (seen.has(p.blanketId)) {
        ctx.addIssue({ code: 'custom', path: ['pairs', i, 'blanketId'], message: `Blanket ${p.blanketId} appears twice; a blanket goes to one need` });
      }
      seen.add(p.blanketId);
    });
  });
export type AssignBatchBody = z.infer<typeof AssignBatchBodySchema>;

/** PATCH /api/assignments/:id: send the blanket to another need (and so perhaps another recipient). */
export const ReassignBodySchema = z.object({
  needId: id('needId'),
  reason: reason.optional(),
});
export type ReassignBody = z.infer<typeof ReassignBodySchema>;

/** DELETE /api/assignments/:id: the blanket goes back to the checked blankets, with the reason in its history. */
export const UnassignBodySchema = z.object({ reason });
export type UnassignBody = z.infer<typeof UnassignBodySchema>;

/** GET /api/assignments: live assignments, one page at a time. */
export const AssignmentListQuerySchema = PageQuerySchema.extend({
  needId: id('needId').optional(),
  recipientId: id('recipientId').optional(),
});
export type AssignmentListQuery = z.infer<typeof AssignmentListQuerySchema>;

/** GET /api/assignments/board/needs and /board/waiting: the board's two columns and their filters. */
export const BoardQuerySchema = PageQuerySchema.extend({
  siteId: id('siteId').optional(),
  recipientId: id('recipientId').optional(),
  sizeCategory: SizeCategorySchema.optional(),
});
export type BoardQuery = z.infer<typeof BoardQuerySchema>;

/** POST /api/matching/suggest: the whole drive, or one site's stock, or one recipient's needs. */
export const SuggestBodySchema = z.object({
  siteId: id('siteId').optional(),
  recipientId: id('recipientId').optional(),
});
export type SuggestBody = z.infer<typeof SuggestBodySchema>;

export interface AssignmentView {
  id: number;
  blanketId: number;
  blanketCode: string;
  blanketStatus: BlanketStatus;
  needId: number;
  sizeCategory: SizeCategory;
  recipient: { id: number; name: string };
  assignedAt: string;
  assignedBy: { id: number; name: string } | null;
  source: AssignmentSource;
  version: number;
}

export type Urgency = 'overdue' | 'soon' | 'later';

/** A need as the board shows it: how many it wants, how many are assigned, how many are still open. */
export interface BoardNeed {
  needId: number;
  recipientId: number;
  recipientName: string;
  population: Population;
  sizeCategory: SizeCategory;
  wanted: number;
  assigned: number;
  open: number;
  deadline: string;
  daysLeft: number;
  urgency: Urgency;
  preferences: string | null;
  /** The usual cautions for infants and frail people; the unit's own policy comes first. */
  cautions: Caution[];
}

/** Whether a blanket can go to a need, and if not, which rules or limits stand in the way. */
export interface NeedFit {
  needId: number;
  ok: boolean;
  reasons: string[];
}

/** A checked blanket that waits for a recipient. */
export interface WaitingBlanket {
  id: number;
  code: string;
  version: number;
  widthCm: number;
  lengthCm: number;
  measured: boolean;
  sizeCategory: SizeCategory | null;
  yarnWeight: number;
  colours: string;
  bodyStitch: string;
  site: { id: number; name: string } | null;
  /** The need the maker pledged it for; null when it was pledged "wherever needed most". */
  pledgedFor: { needId: number; recipientName: string; sizeCategory: SizeCategory } | null;
  thumbnailUrl: string | null;
  fits: NeedFit[];
}

export interface BoardNeeds {
  needs: BoardNeed[];
}

export interface BatchOutcome {
  blanketId: number;
  needId: number;
  ok: boolean;
  /** 201 when assigned; otherwise the status a single assign would have answered. */
  status: number;
  message: string;
  assignment: AssignmentView | null;
}

export interface BatchResult {
  applied: number;
  conflicts: number;
  outcomes: BatchOutcome[];
}

export interface SuggestedPair {
  blanketId: number;
  blanketCode: string;
  needId: number;
  recipientId: number;
  recipientName: string;
  sizeCategory: SizeCategory;
  cost: number;
  reasons: string[];
}

export interface Unplaced {
  blanketId: number;
  blanketCode: string;
  reason: string;
}

export interface ShortNeed {
  needId: number;
  recipientName: string;
  sizeCategory: SizeCategory;
  missing: number;
}

export interface Suggestion {
  pairs: SuggestedPair[];
  unplaced: Unplaced[];
  short: ShortNeed[];
  totalCost: number;
}
