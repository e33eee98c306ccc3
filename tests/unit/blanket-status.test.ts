import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { BLANKET_STATUSES, type BlanketStatus } from '@shared/schemas/blanket';
import { ROLES } from '@shared/schemas/user';
import {
  MAIN_LINE,
  STATUS_MOVES,
  checkTransition,
  findMove,
  isMakerEditable,
  movesFrom,
  timeline,
  type StatusActor,
} from '@shared/blankets/status';

const maker: StatusActor = { role: 'volunteer', isMaker: true };
const otherVolunteer: StatusActor = { role: 'volunteer', isMaker: false };
const organiser: StatusActor = { role: 'organiser', isMaker: false };
const coordinator: StatusActor = { role: 'coordinator', isMaker: false };

const status = fc.constantFrom(...BLANKET_STATUSES);
const actor = fc.record({ role: fc.constantFrom(...ROLES), isMaker: fc.boolean() });

describe('blanket status moves', () => {
  it('walks the whole main line forward with the right person at each step', () => {
    const movers: Record<string, StatusActor> = {
      finished: maker,
      booked: maker,
      received: organiser,
      checked: organiser,
      assigned: organiser,
      packed: organiser,
      delivered: coordinator,
    };
    for (let i = 1; i < MAIN_LINE.length; i++) {
      const from = MAIN_LINE[i - 1]!;
      const to = MAIN_LINE[i]!;
      const r = checkTransition(from, to, movers[to]!);
      expect(r.ok, `${from} → ${to}`).toBe(true);
    }
  });

  it('refuses to skip a step, naming where it can go instead', () => {
    const r = checkTransition('in_progress', 'booked', maker);
    expect(r).toMatchObject({ ok: false, refusal: 'skip' });
    if (!r.ok) expect(r.message).toMatch(/finished/);
    expect(checkTransition('booked', 'checked', organiser)).toMatchObject({ ok: false, refusal: 'skip' });
    expect(checkTransition('checked', 'delivered', coordinator)).toMatchObject({ ok: false, refusal: 'skip' });
    expect(checkTransition('in_progress', 'delivered', coordinator)).toMatchObject({ ok: false, refusal: 'skip' });
  });

  it('refuses a move to the same status', () => {
    expect(checkTransition('finished', 'finished', maker)).toMatchObject({ ok: false, refusal: 'same' });
  });

  it('needs a reason to go back, and spaces are not a reason', () => {
    expect(checkTransition('finished', 'in_progress', maker)).toMatchObject({ ok: false, refusal: 'reason' });
    expect(checkTransition('finished', 'in_progress', maker, '   ')).toMatchObject({ ok: false, refusal: 'reason' });
    expect(checkTransition('finished', 'in_progress', maker, '  Found a dropped stitch ')).toMatchObject({
      ok: true,
      reason: 'Found a dropped stitch',
    });
    expect(checkTransition('delivered', 'packed', coordinator)).toMatchObject({ ok: false, refusal: 'reason' });
  });

  it('gives forward moves no reason requirement, but keeps one when given', () => {
    expect(checkTransition('in_progress', 'finished', maker)).toMatchObject({ ok: true, reason: null });
    expect(checkTransition('received', 'needs_fix', organiser, 'Fringe')).toMatchObject({ ok: true, reason: 'Fringe' });
  });

  it('lets only the maker finish and book, and only staff receive, inspect, assign and pack', () => {
    expect(checkTransition('in_progress', 'finished', otherVolunteer)).toMatchObject({ ok: false, refusal: 'role' });
    expect(checkTransition('in_progress', 'finished', organiser)).toMatchObject({ ok: false, refusal: 'role' });
    expect(checkTransition('finished', 'booked', coordinator)).toMatchObject({ ok: false, refusal: 'role' });
    // A volunteer cannot receive their own blanket at intake.
    expect(checkTransition('booked', 'received', maker)).toMatchObject({ ok: false, refusal: 'role' });
    expect(checkTransition('received', 'checked', maker)).toMatchObject({ ok: false, refusal: 'role' });
    for (const [from, to] of [
      ['booked', 'received'],
      ['received', 'checked'],
      ['received', 'needs_fix'],
      ['received', 'declined'],
      ['checked', 'assigned'],
      ['assigned', 'packed'],
    ] as Array<[BlanketStatus, BlanketStatus]>) {
      expect(checkTransition(from, to, organiser).ok, `${from} → ${to}`).toBe(true);
    }
  });

  it('lets staff deliver (the runs module narrows organisers to the runs they drive), never a maker', () => {
    expect(checkTransition('packed', 'delivered', organiser).ok).toBe(true);
    expect(checkTransition('packed', 'delivered', { role: 'volunteer', isMaker: true })).toMatchObject({ ok: false, refusal: 'role' });
    expect(checkTransition('packed', 'delivered', coordinator).ok).toBe(true);
  });

  it('an organiser who made the blanket may still finish it as its maker', () => {
    expect(checkTransition('in_progress', 'finished', { role: 'organiser', isMaker: true }).ok).toBe(true);
  });

  it('brings a blanket that needs a fix back to received, or to finished when the maker took it home', () => {
    expect(checkTransition('needs_fix', 'received', organiser).ok).toBe(true);
    expect(checkTransition('needs_fix', 'finished', maker).ok).toBe(true);
    expect(checkTransition('needs_fix', 'checked', organiser)).toMatchObject({ ok: false, refusal: 'skip' });
  });

  it('accepts a walk-in drop-off: finished straight to received by staff', () => {
    expect(checkTransition('finished', 'received', organiser).ok).toBe(true);
    expect(checkTransition('finished', 'received', maker)).toMatchObject({ ok: false, refusal: 'role' });
  });

  it('has every backwards move undo a forward one', () => {
    for (const m of STATUS_MOVES.filter((x) => x.direction === 'back')) {
      expect(findMove(m.to, m.from)?.direction, `${m.from} → ${m.to}`).toBe('forward');
    }
  });

  it('has no forward move that jumps along the main line', () => {
    for (const m of STATUS_MOVES.filter((x) => x.direction === 'forward')) {
      const a = MAIN_LINE.indexOf(m.from);
      const b = MAIN_LINE.indexOf(m.to);
      if (a >= 0 && b >= 0 && !(m.from === 'finished' && m.to === 'received')) expect(b - a, `${m.from} → ${m.to}`).toBe(1);
    }
  });

  it('reaches delivered from in_progress, and every status from in_progress', () => {
    const seen = new Set<BlanketStatus>(['in_progress']);
    const queue: BlanketStatus[] = ['in_progress'];
    while (queue.length) {
      const s = queue.shift()!;
      for (const m of STATUS_MOVES.filter((x) => x.from === s && x.direction === 'forward')) {
        if (!seen.has(m.to)) {
          seen.add(m.to);
          queue.push(m.to);
        }
      }
    }
    expect([...seen].sort()).toEqual([...BLANKET_STATUSES].sort());
  });

  it('allows a move exactly when it is listed and the actor is one of its movers (property)', () => {
    fc.assert(
      fc.property(status, status, actor, fc.option(fc.string({ minLength: 1, maxLength: 20 })), (from, to, who, reason) => {
        const r = checkTransition(from, to, who, reason);
        const move = findMove(from, to);
        if (r.ok) {
          expect(move).toBeDefined();
          expect(move!.by.some((b) => (b === 'maker' ? who.isMaker : b === who.role))).toBe(true);
          if (move!.direction === 'back') expect(reason?.trim()).toBeTruthy();
        } else if (from !== to && !move) {
          expect(r.refusal).toBe('skip');
        }
      }),
    );
  });

  it('offers in movesFrom only moves that checkTransition accepts with a reason (property)', () => {
    fc.assert(
      fc.property(status, actor, (from, who) => {
        for (const m of movesFrom(from, who)) expect(checkTransition(from, m.to, who, 'because').ok).toBe(true);
        const forward = movesFrom(from, who).map((m) => m.direction);
        expect(forward).toEqual([...forward].sort((a, b) => (a === b ? 0 : a === 'forward' ? -1 : 1)));
      }),
    );
  });

  it('keeps the log editable by its maker only while the blanket is still with them', () => {
    expect(isMakerEditable('in_progress')).toBe(true);
    expect(isMakerEditable('booked')).toBe(true);
    expect(isMakerEditable('needs_fix')).toBe(true);
    expect(isMakerEditable('received')).toBe(false);
    expect(isMakerEditable('delivered')).toBe(false);
  });
});

describe('status timeline', () => {
  it('marks the steps before as done, the status as current and the rest as upcoming', () => {
    const t = timeline('booked');
    expect(t.map((s) => s.status)).toEqual(MAIN_LINE);
    expect(t.map((s) => s.state)).toEqual(['done', 'done', 'current', 'upcoming', 'upcoming', 'upcoming', 'upcoming', 'upcoming']);
  });

  it('shows a blanket that needs a fix on a branch in place of checked, with the rest still to come', () => {
    const t = timeline('needs_fix');
    expect(t.map((s) => s.status)).toEqual(['in_progress', 'finished', 'booked', 'received', 'needs_fix', 'checked', 'assigned', 'packed', 'delivered']);
    expect(t.find((s) => s.status === 'needs_fix')).toMatchObject({ state: 'current', branch: true });
  });

  it('ends a declined blanket at declined', () => {
    const t = timeline('declined');
    expect(t.at(-1)).toMatchObject({ status: 'declined', state: 'current', branch: true });
    expect(t.some((s) => s.state === 'upcoming')).toBe(false);
  });

  it('shows a delivered blanket as complete', () => {
    expect(timeline('delivered').every((s) => s.state === 'done')).toBe(true);
  });

  it('has exactly one current step until delivery (property)', () => {
    fc.assert(
      fc.property(status, (s) => {
        const current = timeline(s).filter((x) => x.state === 'current');
        expect(current.length).toBe(s === 'delivered' ? 0 : 1);
        if (s !== 'delivered') expect(current[0]!.status).toBe(s);
      }),
    );
  });
});
