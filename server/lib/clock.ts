/**
 * The product's clock: every "now" that decides a day, a deadline, a slot or a reminder reads it.
 * It follows the system clock unless a test sets it (in-process, or through PUT /api/drive/clock/now
 * on a server started with TEST_CLOCK=1), so "today" can be tried at any moment, midnight included.
 */
let fixedAt: number | null = null;

export const nowMs = (): number => fixedAt ?? Date.now();
export const now = (): Date => new Date(nowMs());

/** Pin the clock to a moment, or give it back to the system clock with null. */
export function setClock(at: Date | number | null): void {
  fixedAt = at === null ? null : typeof at === 'number' ? at : at.getTime();
}

export const clockIsSet = (): boolean => fixedAt !== null;
