import { z } from 'zod';
import { BORDER_LIBRARY } from '../border/library';
import { FIT_STRATEGIES, type FitStrategy } from '../border/fit';
import { ROUND_MODES, type CornerName, type EdgeName, type RoundMode } from '../border/round';
import type { RowType } from '../border/row-ends';
import { BorderFitRequestSchema, GaugeSchema } from './border-fit';

/** A maker keeps a handful of plans, not thousands; past this a loop or a script is saving them. */
export const MAX_PLANS_PER_MAKER = 200;

const BORDER_IDS = BORDER_LIBRARY.map((b) => b.id) as [string, ...string[]];
const LengthUnitSchema = z.enum(['cm', 'in'], { error: "unit must be 'cm' or 'in'" });

const positive = (field: string, max: number) =>
  z
    .number({ error: `${field} must be a number` })
    .positive(`${field} must be more than 0`)
    .max(max, `${field} must be at most ${max}`);

/**
 * Everything the planner screen needs to rebuild a plan. Counts reuse the border-fit rules, so a
 * saved plan can never hold a blanket the calculator would refuse. The border is named by its
 * library id: its multiple, lead and centre come from the library, not from the client.
 */
export const PlanInputSchema = z.object({
  across: BorderFitRequestSchema.shape.across,
  rows: BorderFitRequestSchema.shape.rows,
  borderId: z.enum(BORDER_IDS, { error: `borderId must be one of ${BORDER_IDS.join(', ')}` }),
  strategy: z.enum(FIT_STRATEGIES as ['add', 'fewest'], { error: "strategy must be 'add' or 'fewest'" }).default('add'),
  mode: z.enum(ROUND_MODES as ['per-edge', 'continuous'], { error: "mode must be 'per-edge' or 'continuous'" }).default('per-edge'),
  terms: z.enum(['us', 'uk'], { error: "terms must be 'us' or 'uk'" }).default('us'),
  gauge: GaugeSchema.optional(),
  target: z.object({ width: positive('target.width', 400), length: positive('target.length', 400), unit: LengthUnitSchema }).optional(),
  /** Border depth on one side, in the gauge's unit (foundation round included). */
  borderDepth: z.number({ error: 'borderDepth must be a number' }).min(0, 'borderDepth must be 0 or more').max(50, 'borderDepth must be at most 50').optional(),
  bodyStitch: z.enum(['sc', 'hdc', 'dc', 'tr', 'dtr'], { error: 'bodyStitch must be one of sc, hdc, dc, tr, dtr' }).optional(),
  yarn: z
    .object({
      weight: z.number({ error: 'yarn.weight must be a number' }).int('yarn.weight must be a whole number').min(1, 'yarn.weight must be from 1 to 7').max(7, 'yarn.weight must be from 1 to 7'),
      margin: z.number({ error: 'yarn.margin must be a number' }).min(0, 'yarn.margin must be 0 or more').max(1, 'yarn.margin must be at most 1').default(0.1),
      skein: z.object({ length: positive('yarn.skein.length', 10000), unit: z.enum(['m', 'yd'], { error: "yarn.skein.unit must be 'm' or 'yd'" }) }).optional(),
    })
    .optional(),
});
export type PlanInput = z.infer<typeof PlanInputSchema>;
/** What a client sends: defaults optional, rows spelled out (the shared rows schema reads unknown). */
export type PlanInputDraft = Omit<z.input<typeof PlanInputSchema>, 'rows'> & { rows: number | { count: number; pattern: RowType[] } };

export const PlanCreateSchema = z.object({
  name: z
    .string({ error: 'name must be text' })
    .trim()
    .min(1, 'name: give the plan a name you will recognise')
    .max(120, 'name: at most 120 characters'),
  input: PlanInputSchema,
});
export type PlanCreate = z.infer<typeof PlanCreateSchema>;

export interface PlanEdgeSummary {
  count: number;
  change: number;
  fitted: number;
}

/** Worked out by the server when a plan is saved, so lists and blanket pages need no arithmetic. */
export interface PlanSummary {
  borderId: string;
  borderName: string;
  multiple: number;
  offset: number;
  strategy: FitStrategy;
  mode: RoundMode;
  across: number;
  rows: number;
  rowPattern: RowType[] | null;
  edges: Record<EdgeName, PlanEdgeSummary>;
  roundTotal: number;
  repeats: number;
  cornersCentred: CornerName[];
  /** Finished size with the border, when the plan has a gauge. */
  finished: { width: number; length: number; unit: 'cm' | 'in' } | null;
  yarn: { metres: number; yards: number; skeins: number | null } | null;
  /** One line for lists, e.g. "Five-dc shell · 42 × 31 rows · top and bottom +3, sides +2". */
  text: string;
}

export interface PlanListItem {
  id: number;
  name: string;
  borderId: string;
  summary: PlanSummary;
  /** Blankets that name this plan; deleting the plan unlinks them. */
  blankets: number;
  createdAt: string;
  updatedAt: string;
}

export interface PlanDetail extends PlanListItem {
  input: PlanInput;
}
