import type { BlanketStatus } from '../schemas/blanket';
import type { Role } from '../schemas/user';

/**
 * A blanket's life as a state machine. Forward moves follow the drive's order with no skipping;
 * every backwards move needs a reason, so the history says why a blanket went back.
 * Who may move it depends on the step: the maker finishes and books it, organisers receive,
 * inspect, assign and pack it, coordinators deliver it.
 */

/** Who is asking, as far as the machine cares: their role and whether they made this blanket. */
export interface StatusActor {
  role: Role;
  isMaker: boolean;
}

/** "maker" is the person who logged the blanket, whatever their role. */
export type Mover = 'maker' | Role;

export type Direction = 'forward' | 'back';

export interface StatusMove {
  from: BlanketStatus;
  to: BlanketStatus;
  direction: Direction;
  by: readonly Mover[];
  /** The button text for this move, in the mover's words. */
  action: string;
  /**
   * The door the move comes through. Without one it is a bare status change on the blanket page;
   * 'intake': made only through the intake and inspection steps, which record the re-measure,
   * the checklist and the guideline check that justify it. 'assignment': made only on the assignment
   * board, which records the need, the recipient and who assigned it. Other steps (booking, packing,
   * delivering) claim their moves the same way once they record something of their own with them.
   */
  via?: Exclude<MoveChannel, 'plain'>;
}

/** The doors a blanket's status can be moved through; see `StatusMove.via`. */
export const MOVE_CHANNELS = ['plain', 'intake', 'assignment', 'booking', 'packing', 'delivery'] as const;
export type MoveChannel = (typeof MOVE_CHANNELS)[number];

/** The door a move belongs to. */
export const moveChannel = (move: StatusMove): MoveChannel => move.via ?? 'plain';

const STAFF: readonly Mover[] = ['organiser', 'coordinator'];
const MAKER: readonly Mover[] = ['maker'];
/** Delivering: coordinators, and an organiser on a run they drive (the runs module checks which run). */
const DELIVERY: readonly Mover[] = ['organiser', 'coordinator'];

export const STATUS_MOVES: readonly StatusMove[] = [
  { from: 'in_progress', to: 'finished', direction: 'forward', by: MAKER, action: 'Mark as finished' },
  { from: 'finished', to: 'booked', direction: 'forward', by: MAKER, action: 'Book a drop-off', via: 'booking' },
  { from: 'booked', to: 'received', direction: 'forward', by: STAFF, action: 'Mark as received', via: 'intake' },
  // Booking is a courtesy, not a gate: a maker may walk in with a finished blanket.
  { from: 'finished', to: 'received', direction: 'forward', by: STAFF, action: 'Received without a booking', via: 'intake' },
  { from: 'received', to: 'checked', direction: 'forward', by: STAFF, action: 'Passed the check', via: 'intake' },
  { from: 'received', to: 'needs_fix', direction: 'forward', by: STAFF, action: 'Needs a fix', via: 'intake' },
  { from: 'received', to: 'declined', direction: 'forward', by: STAFF, action: 'Decline', via: 'intake' },
  // After a fix: either the organisers mend it on the spot, or the maker takes it home and books it again.
  { from: 'needs_fix', to: 'received', direction: 'forward', by: STAFF, action: 'Fixed: check it again', via: 'intake' },
  { from: 'needs_fix', to: 'finished', direction: 'forward', by: MAKER, action: 'I have fixed it at home' },
  { from: 'checked', to: 'assigned', direction: 'forward', by: STAFF, action: 'Assign to a recipient', via: 'assignment' },
  { from: 'assigned', to: 'packed', direction: 'forward', by: STAFF, action: 'Mark as packed', via: 'packing' },
  { from: 'packed', to: 'delivered', direction: 'forward', by: DELIVERY, action: 'Mark as delivered', via: 'delivery' },

  { from: 'finished', to: 'in_progress', direction: 'back', by: MAKER, action: 'Back to in progress' },
  // Staff make it too, when they mark that the maker did not come to the booked visit.
  { from: 'booked', to: 'finished', direction: 'back', by: [...MAKER, ...STAFF], action: 'Cancel the drop-off', via: 'booking' },
  { from: 'received', to: 'booked', direction: 'back', by: STAFF, action: 'Not received after all' },
  { from: 'checked', to: 'received', direction: 'back', by: STAFF, action: 'Check it again' },
  { from: 'declined', to: 'received', direction: 'back', by: STAFF, action: 'Reconsider' },
  { from: 'assigned', to: 'checked', direction: 'back', by: STAFF, action: 'Unassign', via: 'assignment' },
  { from: 'packed', to: 'assigned', direction: 'back', by: STAFF, action: 'Unpack', via: 'packing' },
  { from: 'delivered', to: 'packed', direction: 'back', by: DELIVERY, action: 'Not delivered after all', via: 'delivery' },
];

/** The main line the stepper shows; needs_fix and declined are side branches off "received". */
export const MAIN_LINE: readonly BlanketStatus[] = [
  'in_progress',
  'finished',
  'booked',
  'received',
  'checked',
  'assigned',
  'packed',
  'delivered',
];

export const STATUS_LABELS: Record<BlanketStatus, string> = {
  in_progress: 'In progress',
  finished: 'Finished',
  booked: 'Drop-off booked',
  received: 'Received',
  checked: 'Checked',
  needs_fix: 'Needs a fix',
  declined: 'Declined',
  assigned: 'Assigned',
  packed: 'Packed',
  delivered: 'Delivered',
};

/** While a blanket is with its maker, the maker may still correct what they logged. */
export const MAKER_EDITABLE: readonly BlanketStatus[] = ['in_progress', 'finished', 'booked', 'needs_fix'];

export const isMakerEditable = (s: BlanketStatus): boolean => MAKER_EDITABLE.includes(s);

/** Longest reason we keep for a move; a paragraph is enough. */
export const MAX_REASON_LENGTH = 500;

export function findMove(from: BlanketStatus, to: BlanketStatus): StatusMove | undefined {
  return STATUS_MOVES.find((m) => m.from === from && m.to === to);
}

export function mayMove(move: StatusMove, actor: StatusActor): boolean {
  return move.by.some((m) => (m === 'maker' ? actor.isMaker : m === actor.role));
}

/** Whether a move belongs to intake (receive, inspect) rather than to a plain status change. */
export const isIntakeMove = (move: StatusMove): boolean => move.via === 'intake';

/** The moves this person can make from here, forward ones first. */
export function movesFrom(from: BlanketStatus, actor: StatusActor): StatusMove[] {
  const mine = STATUS_MOVES.filter((m) => m.from === from && mayMove(m, actor));
  return [...mine.filter((m) => m.direction === 'forward'), ...mine.filter((m) => m.direction === 'back')];
}

export type TransitionRefusal = 'same' | 'skip' | 'role' | 'reason';

export type TransitionCheck =
  | { ok: true; move: StatusMove; reason: string | null }
  | { ok: false; refusal: TransitionRefusal; message: string };

const label = (s: BlanketStatus) => STATUS_LABELS[s].toLowerCase();

/**
 * Whether this person may move a blanket from one status to another, and if not, why in plain
 * words. A backwards move with no reason (or only spaces) is refused.
 */
export function checkTransition(
  from: BlanketStatus,
  to: BlanketStatus,
  actor: StatusActor,
  reason?: string | null,
): TransitionCheck {
  if (from === to) return { ok: false, refusal: 'same', message: `It is already ${label(to)}` };
  const move = findMove(from, to);
  if (!move) {
    const next = STATUS_MOVES.filter((m) => m.from === from).map((m) => label(m.to));
    return {
      ok: false,
      refusal: 'skip',
      message: `A blanket that is ${label(from)} cannot go straight to ${label(to)}; from here it can go to ${next.join(', ') || 'nowhere'}`,
    };
  }
  if (!mayMove(move, actor)) {
    const who = move.by.map((m) => (m === 'maker' ? 'its maker' : `${m}s`)).join(' or ');
    return { ok: false, refusal: 'role', message: `Only ${who} can move a blanket from ${label(from)} to ${label(to)}` };
  }
  const trimmed = reason?.trim() ?? '';
  if (move.direction === 'back' && trimmed === '') {
    return {
      ok: false,
      refusal: 'reason',
      message: `Moving it back from ${label(from)} to ${label(to)} needs a reason`,
    };
  }
  return { ok: true, move, reason: trimmed === '' ? null : trimmed };
}

export type StepState = 'done' | 'current' | 'upcoming';

export interface TimelineStep {
  status: BlanketStatus;
  label: string;
  state: StepState;
  /** needs_fix and declined sit off the main line; the stepper draws them in a warning colour. */
  branch: boolean;
}

/**
 * The steps of the stepper for a blanket at `status`. A blanket that needs a fix or was declined
 * shows that step in place of "checked"; a declined blanket has no steps after it.
 */
export function timeline(status: BlanketStatus): TimelineStep[] {
  const step = (s: BlanketStatus, state: StepState, branch = false): TimelineStep => ({
    status: s,
    label: STATUS_LABELS[s],
    state,
    branch,
  });
  if (status === 'needs_fix' || status === 'declined') {
    const upToReceived = MAIN_LINE.slice(0, MAIN_LINE.indexOf('received') + 1).map((s) => step(s, 'done'));
    const rest = status === 'declined' ? [] : MAIN_LINE.slice(MAIN_LINE.indexOf('checked')).map((s) => step(s, 'upcoming'));
    return [...upToReceived, step(status, 'current', true), ...rest];
  }
  const at = MAIN_LINE.indexOf(status);
  return MAIN_LINE.map((s, i) => step(s, i < at ? 'done' : i === at ? (status === 'delivered' ? 'done' : 'current') : 'upcoming'));
}

/** With the organisers and not yet given to a recipient: received, checked, or held for a fix. */
export const WITH_ORGANISERS: readonly BlanketStatus[] = ['received', 'checked', 'needs_fix'];

/** Given to a recipient: assigned, packed or delivered. */
export const ASSIGNED_STATUSES: readonly BlanketStatus[] = ['assigned', 'packed', 'delivered'];

/** In the organisers' hands or beyond: every blanket that has reached them and was not declined. */
export const IN_HAND: readonly BlanketStatus[] = [...WITH_ORGANISERS, ...ASSIGNED_STATUSES];

/** Made and not turned away: anything past in progress except declined, which a pledge must replace. */
export const FINISHED_STATUSES: readonly BlanketStatus[] = ['finished', 'booked', ...IN_HAND];
