import { z } from 'zod';
import type { GlanceStep, RiskReason } from '../drive/glance';
import type { SizeCategory } from './blanket';
import type { ExportView, RunSummary } from './run';

/** Blankets now at each step, by step. */
export type StepCounts = Record<GlanceStep, number>;

/** One open need: what it asks for, what is pledged, and its blankets now at each step. */
export interface GlanceNeed {
  needId: number;
  recipientId: number;
  recipientName: string;
  sizeCategory: SizeCategory;
  deadline: string;
  wanted: number;
  pledged: number;
  /** Assigned, packed or delivered: the same count as the recipient pages and the assignment board. */
  assignedSoFar: number;
  now: StepCounts;
  daysLeft: number;
  atRisk: boolean;
  reasons: RiskReason[];
}

/** One week (Monday to Sunday, UTC): blankets pledged, and blankets that reached each step in it. */
export interface GlanceWeek {
  week: string;
  pledged: number;
  reached: StepCounts;
}

/** A blanket that has stood at its step the longest. */
export interface WaitingBlanket {
  id: number;
  code: string;
  since: string;
  days: number;
  recipientName: string | null;
}

/** GET /api/drive/glance: the whole drive for coordinators and organisers, counted on the server. */
export interface DriveGlance {
  today: string;
  /** Every blanket of the drive now at each step, whatever its need. */
  totals: StepCounts & { pledged: number; wanted: number; inProgress: number; declined: number };
  needs: GlanceNeed[];
  weeks: GlanceWeek[];
  waiting: Array<{ step: GlanceStep; count: number; longest: WaitingBlanket[] }>;
  upcomingRuns: { items: RunSummary[]; total: number };
  recentExports: { items: ExportView[]; total: number };
}

/** GET /api/drive/glance/weeks: the week-by-week figures of one need. */
export const GlanceWeeksQuerySchema = z.object({
  needId: z.coerce.number({ error: 'needId must be a number' }).int('needId must be a whole number').positive('needId must be positive'),
});
export type GlanceWeeksQuery = z.infer<typeof GlanceWeeksQuerySchema>;
