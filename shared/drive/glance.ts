import type { BlanketStatus } from '../schemas/blanket';
import { STATUS_LABELS, STATUS_MOVES } from '../blankets/status';

/**
 * The steps "the drive at a glance" counts, after the pledge: each is one or more statuses of the
 * status machine. A blanket waiting for its drop-off (booked) is still "finished"; one back from the
 * table with a fix to make (needs_fix) is still "received". Declined blankets leave the line.
 */
export const GLANCE_STEPS = ['finished', 'received', 'checked', 'assigned', 'packed', 'delivered'] as const;
export type GlanceStep = (typeof GLANCE_STEPS)[number];

export const STEP_STATUSES: Record<GlanceStep, readonly BlanketStatus[]> = {
  finished: ['finished', 'booked'],
  received: ['received', 'needs_fix'],
  checked: ['checked'],
  assigned: ['assigned'],
  packed: ['packed'],
  delivered: ['delivered'],
};

export const STEP_LABELS: Record<GlanceStep, string> = {
  finished: STATUS_LABELS.finished,
  received: STATUS_LABELS.received,
  checked: STATUS_LABELS.checked,
  assigned: STATUS_LABELS.assigned,
  packed: STATUS_LABELS.packed,
  delivered: STATUS_LABELS.delivered,
};

/** What a step's figure counts, after "now", in the words the page and the filtered list use. */
export const STEP_MEANS: Record<GlanceStep, string> = {
  finished: 'made, not yet handed in (with or without a drop-off booked)',
  received: 'at a drop-off point, not yet through the check (including those waiting for a fix)',
  checked: 'passed the check, not yet assigned',
  assigned: 'given to a recipient, not yet packed',
  packed: 'in a box for a delivery run',
  delivered: 'handed over to the recipient',
};

/** The step a status belongs to, or null for in progress and declined. */
export function stepOf(status: BlanketStatus): GlanceStep | null {
  return GLANCE_STEPS.find((s) => STEP_STATUSES[s].includes(status)) ?? null;
}

/**
 * The history entries that mean "this blanket reached this step": the blanket was logged straight
 * into it, or moved forward into it from outside it. Moving back, or between the statuses of one
 * step (a fix mended at the table), is not reaching it again.
 */
export function arrivalMoves(step: GlanceStep): Array<{ from: BlanketStatus | null; to: BlanketStatus }> {
  const inStep = STEP_STATUSES[step];
  const moves: Array<{ from: BlanketStatus | null; to: BlanketStatus }> = inStep.map((to) => ({ from: null, to }));
  for (const m of STATUS_MOVES) {
    if (m.direction === 'forward' && inStep.includes(m.to) && !inStep.includes(m.from)) moves.push({ from: m.from, to: m.to });
  }
  return moves;
}

/** The Monday (UTC) that starts the week holding this ISO day. */
export function weekOf(isoDay: string): string {
  const d = new Date(`${isoDay}T00:00:00Z`);
  const back = (d.getUTCDay() + 6) % 7;
  return new Date(d.getTime() - back * 86_400_000).toISOString().slice(0, 10);
}

/** The day seven days after an ISO day. */
export const weekAfter = (isoDay: string): string => new Date(new Date(`${isoDay}T00:00:00Z`).getTime() + 7 * 86_400_000).toISOString().slice(0, 10);

/**
 * When a need is at risk: its deadline is AT_RISK_DAYS days away or less, and fewer blankets are
 * pledged, or assigned (counting those packed and delivered since), than it asks for.
 * The page states the same rule in words (AT_RISK_RULE).
 */
export const AT_RISK_DAYS = 21;
export const AT_RISK_RULE = `A need is at risk when its deadline is ${AT_RISK_DAYS} days away or less and fewer blankets are pledged, or assigned (counting those packed and delivered since), than it asks for.`;

export type RiskReason = 'pledged' | 'assigned';

export function riskOf(
  need: { deadline: string; wanted: number; pledged: number; assigned: number },
  today: string,
): { atRisk: boolean; daysLeft: number; reasons: RiskReason[] } {
  const daysLeft = Math.round((Date.parse(`${need.deadline}T00:00:00Z`) - Date.parse(`${today}T00:00:00Z`)) / 86_400_000);
  const reasons: RiskReason[] = [];
  if (need.pledged < need.wanted) reasons.push('pledged');
  if (need.assigned < need.wanted) reasons.push('assigned');
  const atRisk = daysLeft >= 0 && daysLeft <= AT_RISK_DAYS && reasons.length > 0;
  return { atRisk, daysLeft, reasons: atRisk ? reasons : [] };
}
