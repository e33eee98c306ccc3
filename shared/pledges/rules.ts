import type { BlanketStatus } from '../schemas/blanket';
import type { PledgeStatus } from '../schemas/pledge';
import { FINISHED_STATUSES } from '../blankets/status';

/**
 * When a pledge is kept, when it is late, and which of its blankets count toward it. One place, so
 * the pledge's own status, its card, the log form and the need counts all answer the same way.
 */

/** A blanket counts as finished once it has left the hook, unless intake turned it away. */
export const countsAsFinished = (s: BlanketStatus): boolean => FINISHED_STATUSES.includes(s);

/**
 * A declined blanket no longer fills a place in its pledge: the maker may log a replacement. Every
 * other blanket, finished or not, takes its place.
 */
export const takesPlaceInPledge = (s: BlanketStatus): boolean => s !== 'declined';

/** What a pledge's blankets add up to. */
export interface PledgeTally {
  /** Blankets that take a place in the pledge (any status but declined). */
  logged: number;
  /** Of those, the ones finished (see countsAsFinished). */
  finished: number;
  /** Logged under it and turned away at intake. */
  declined: number;
}

export const emptyTally = (): PledgeTally => ({ logged: 0, finished: 0, declined: 0 });

export function tally(statuses: Iterable<BlanketStatus>): PledgeTally {
  const t = emptyTally();
  for (const s of statuses) addToTally(t, s);
  return t;
}

export function addToTally(t: PledgeTally, s: BlanketStatus): PledgeTally {
  if (takesPlaceInPledge(s)) t.logged += 1;
  else t.declined += 1;
  if (countsAsFinished(s)) t.finished += 1;
  return t;
}

/**
 * The status a live pledge should have: kept once enough of its blankets are finished, active
 * otherwise. A cancelled pledge stays cancelled.
 */
export function pledgeStatusFor(current: PledgeStatus, quantity: number, finished: number): PledgeStatus {
  if (current === 'cancelled') return current;
  return finished >= quantity ? 'fulfilled' : 'active';
}

/** Places left for new blankets under a pledge. */
export const placesLeft = (quantity: number, t: Pick<PledgeTally, 'logged'>): number => Math.max(0, quantity - t.logged);

/** Whether a pledge is past its date with blankets still to finish, on `today` (YYYY-MM-DD). */
export function isPledgeLate(
  p: { status: PledgeStatus; dueDate: string; quantity: number; blanketsFinished: number },
  today: string,
): boolean {
  return p.status === 'active' && p.dueDate < today && p.blanketsFinished < p.quantity;
}
