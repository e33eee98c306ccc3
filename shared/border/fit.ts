/**
 * Fitting a stitch count to a border's "multiple of N plus M".
 *
 * A border repeat of N stitches closes symmetrically on an edge only when the edge holds
 * N·k + M stitches. Makers fix a count that does not fit in the foundation round, so the
 * answer is a change in stitches, never a change to the blanket itself.
 */

export type FitStrategy = 'add' | 'fewest';

export const FIT_STRATEGIES: readonly FitStrategy[] = ['add', 'fewest'];

export interface EdgeFit {
  /** Stitches the edge holds before fitting. */
  count: number;
  /** Signed: positive = stitches to add, negative = stitches to skip. */
  change: number;
  /** count + change; always ≡ offset (mod multiple) and ≥ offset. */
  fitted: number;
  /** k in fitted = multiple·k + offset. */
  repeats: number;
}

function assertWhole(name: string, value: number, min: number): void {
  if (!Number.isInteger(value) || value < min) {
    throw new RangeError(`${name} must be a whole number of at least ${min} (got ${value})`);
  }
}

/**
 * Smallest legal count that is ≥ value. "Legal" means ≡ offset (mod multiple), ≥ offset and
 * > 0: a border edge with no stitches at all is not something a maker can work.
 */
export function fitUp(value: number, multiple: number, offset: number): number {
  const floor = Math.max(offset, 1);
  const start = Math.max(value, floor);
  const rem = (((start - offset) % multiple) + multiple) % multiple;
  return rem === 0 ? start : start + (multiple - rem);
}

/** Largest legal count that is ≤ value, or undefined when none exists (value below the floor). */
export function fitDown(value: number, multiple: number, offset: number): number | undefined {
  if (value < offset) return undefined;
  const down = value - ((value - offset) % multiple);
  return down >= 1 ? down : undefined;
}

/**
 * Fit one edge. Multiple 1 is accepted so the plain library borders (crab stitch, plain hdc)
 * go through the same path with change 0; the API itself asks for a multiple of at least 2.
 *
 * When count < offset the only legal answer is the offset itself (0 repeats), so the change can
 * then be offset − count, which may exceed the multiple; for count ≥ offset, |change| < multiple.
 */
export function fitEdge(
  count: number,
  multiple: number,
  offset: number,
  strategy: FitStrategy = 'add',
): EdgeFit {
  assertWhole('count', count, 0);
  assertWhole('multiple', multiple, 1);
  assertWhole('offset', offset, 0);

  const up = fitUp(count, multiple, offset);
  let fitted = up;
  if (strategy === 'fewest') {
    const down = fitDown(count, multiple, offset);
    // Ties go to adding: an extra stitch hides better than a gap (common practice).
    if (down !== undefined && count - down < up - count) fitted = down;
  } else if (strategy !== 'add') {
    throw new RangeError(`strategy must be 'add' or 'fewest' (got ${String(strategy)})`);
  }
  return { count, change: fitted - count, fitted, repeats: (fitted - offset) / multiple };
}

/**
 * Nearest legal count to a real-valued estimate (used when a gauge says "63.4 stitches"):
 * rounding to nearest rather than up keeps the finished size closest to the target.
 */
export function nearestFit(value: number, multiple: number, offset: number): number {
  if (!Number.isFinite(value)) throw new RangeError(`value must be a finite number (got ${value})`);
  assertWhole('multiple', multiple, 1);
  assertWhole('offset', offset, 0);
  const up = fitUp(Math.ceil(value), multiple, offset);
  const down = fitDown(Math.floor(value), multiple, offset);
  if (down === undefined) return up;
  return value - down < up - value ? down : up;
}
