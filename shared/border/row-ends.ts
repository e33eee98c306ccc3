/**
 * How many foundation-round stitches each row end takes, and the foundation counts that follow.
 * A tall row end spans the height of several short stitches, so it takes more of them; too few
 * and the side puckers, too many and it ruffles.
 */

export const ROW_TYPES = ['sc', 'hdc', 'dc', 'tr', 'dtr'] as const;
export type RowType = (typeof ROW_TYPES)[number];

export interface RowEndAllowance {
  row: RowType;
  /** Foundation stitches worked into one row end of this type. */
  stitches: number;
  source: string;
}

export const ROW_END_COMMON_PRACTICE = 'common practice (no published source)';
/*
 * For hdc and dc the common values equal the turning chain less one (hdc 2−1, dc 3−1). tr and dtr
 * continue that rule (4−1, 5−1). No table we could cite gives them, so they are marked as ours.
 */
export const ROW_END_EXTRAPOLATED =
  'from memory: turning chain less one, extending the hdc and dc values (no published source)';

export const ROW_END_ALLOWANCES: Readonly<Record<RowType, RowEndAllowance>> = {
  sc: { row: 'sc', stitches: 1, source: ROW_END_COMMON_PRACTICE },
  hdc: { row: 'hdc', stitches: 1, source: ROW_END_COMMON_PRACTICE },
  dc: { row: 'dc', stitches: 2, source: ROW_END_COMMON_PRACTICE },
  tr: { row: 'tr', stitches: 3, source: ROW_END_EXTRAPOLATED },
  dtr: { row: 'dtr', stitches: 4, source: ROW_END_EXTRAPOLATED },
};

/** 3 stitches into each corner stitch of the foundation round: common practice (no published source). */
export const CORNER_STITCHES = 3;
export const CORNER_COUNT = 4;

/**
 * Rows of the body. A plain number means one foundation stitch per row end (the sc/hdc case);
 * a pattern repeats from the first row ("sc","dc" = sc, dc, sc, dc, ...).
 */
export type BodyRows = number | { count: number; pattern: readonly RowType[] };

export function rowCount(rows: BodyRows): number {
  return typeof rows === 'number' ? rows : rows.count;
}

/** Foundation stitches along one side: the sum of the row-end allowances. */
export function sideStitches(rows: BodyRows): number {
  if (typeof rows === 'number') {
    if (!Number.isInteger(rows) || rows < 1) throw new RangeError(`rows must be a whole number of at least 1 (got ${rows})`);
    return rows;
  }
  const { count, pattern } = rows;
  if (!Number.isInteger(count) || count < 1) {
    throw new RangeError(`rows.count must be a whole number of at least 1 (got ${count})`);
  }
  if (pattern.length === 0) throw new RangeError('rows.pattern must name at least one row type');
  let total = 0;
  for (let i = 0; i < count; i++) {
    const type = pattern[i % pattern.length]!;
    const allowance = ROW_END_ALLOWANCES[type];
    if (!allowance) throw new RangeError(`rows.pattern has an unknown row type: ${String(type)}`);
    total += allowance.stitches;
  }
  return total;
}

export interface FoundationCounts {
  top: number;
  right: number;
  bottom: number;
  left: number;
}

/** Top and bottom take one stitch per stitch across; both sides take the row-end allowances. */
export function foundationCounts(across: number, rows: BodyRows): FoundationCounts {
  if (!Number.isInteger(across) || across < 1) {
    throw new RangeError(`across must be a whole number of at least 1 (got ${across})`);
  }
  const side = sideStitches(rows);
  return { top: across, right: side, bottom: across, left: side };
}
