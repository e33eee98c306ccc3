import type { SizeCategory } from '../schemas/blanket';
import { toCm } from '../sizing/units';

const inchesToCm = (inches: number): number => toCm(inches, 'in');

export const COMMON_PRACTICE = 'common practice (no published source)';

export interface SizeCategoryRow {
  category: SizeCategory;
  /** Plain name for messages: "it is the size of a lap blanket". */
  label: string;
  /** Nominal size, short side × long side, in inches (the unit drives publish in). */
  nominalIn: { width: number; length: number };
  /** Accepted span of the short side (width) and the long side (length), in inches. */
  rangeIn: { minWidth: number; maxWidth: number; minLength: number; maxLength: number };
  /** The same, in centimetres at exactly 2.54 cm to the inch. */
  nominalCm: { width: number; length: number };
  rangeCm: { minWidth: number; maxWidth: number; minLength: number; maxLength: number };
  source: string;
  /** Where the row's numbers come from, in a sentence. */
  basis: string;
}

interface RowInches {
  category: SizeCategory;
  label: string;
  nominal: [number, number];
  width: [number, number];
  length: [number, number];
  basis: string;
}

/*
 * No standards body publishes blanket sizes. The nominal sizes are where the sizes that charity
 * drives publish cluster. Where a drive's range was given (preemie 15–20, baby 24–36, child
 * 50–60 long, teen 65–72 long) it is kept, except that the gap between preemie (to 20 in) and
 * baby (from 24 in) is split at 22 in so a 21 in square still has a home. Elsewhere the span is our
 * own few inches either side of the nominal. Odd shapes (a long thin scarf) fit no row at all.
 */
const ROWS_IN: RowInches[] = [
  {
    category: 'preemie',
    label: 'preemie blanket',
    nominal: [18, 18],
    width: [15, 22],
    length: [15, 22],
    basis: 'preemie/newborn blankets published at 15–20 in square; 20–22 in is our own margin',
  },
  {
    category: 'baby',
    label: 'baby blanket',
    nominal: [30, 30],
    width: [22, 36],
    length: [22, 36],
    basis: 'baby blankets published at 24–36 in; 22–24 in is our own margin',
  },
  {
    category: 'crib',
    label: 'crib blanket',
    nominal: [30, 36],
    width: [27, 34],
    length: [33, 42],
    basis: 'crib blankets published at about 30 × 36 in; span is our own margin',
  },
  {
    category: 'child',
    label: "child's blanket",
    nominal: [40, 55],
    width: [36, 44],
    length: [50, 60],
    basis: 'child blankets published at 40 × 50–60 in; width span is our own margin',
  },
  {
    category: 'teen',
    label: 'teen blanket',
    nominal: [45, 68],
    width: [42, 50],
    length: [65, 72],
    basis: 'teen blankets published at 45 × 65–72 in; width span is our own margin',
  },
  {
    category: 'lap',
    label: 'lap blanket',
    nominal: [36, 48],
    width: [32, 40],
    length: [42, 52],
    basis: 'lap blankets published at about 36 × 48 in; span is our own margin',
  },
  {
    category: 'throw',
    label: 'throw',
    nominal: [50, 60],
    width: [46, 54],
    length: [55, 66],
    basis: 'throws published at about 50 × 60 in; span is our own margin',
  },
  {
    category: 'twin',
    label: 'twin-size blanket',
    nominal: [66, 90],
    width: [60, 72],
    length: [84, 96],
    basis: 'twin-size blankets published at about 66 × 90 in; span is our own margin',
  },
];

export const SIZE_CATEGORY_TABLE: readonly SizeCategoryRow[] = ROWS_IN.map((r) => ({
  category: r.category,
  label: r.label,
  nominalIn: { width: r.nominal[0], length: r.nominal[1] },
  rangeIn: { minWidth: r.width[0], maxWidth: r.width[1], minLength: r.length[0], maxLength: r.length[1] },
  nominalCm: { width: inchesToCm(r.nominal[0]), length: inchesToCm(r.nominal[1]) },
  rangeCm: {
    minWidth: inchesToCm(r.width[0]),
    maxWidth: inchesToCm(r.width[1]),
    minLength: inchesToCm(r.length[0]),
    maxLength: inchesToCm(r.length[1]),
  },
  source: COMMON_PRACTICE,
  basis: r.basis,
}));

export function sizeCategoryRow(category: SizeCategory): SizeCategoryRow {
  const row = SIZE_CATEGORY_TABLE.find((r) => r.category === category);
  if (!row) throw new Error(`Unknown size category: ${category}`);
  return row;
}

/**
 * The category a blanket of this size fits best, or null when it fits none. Orientation does
 * not matter: the shorter side is read as the width. Among the rows whose span holds it, the one
 * whose nominal size is nearest (relative to that size) wins; ties go to the earlier row.
 */
export function sizeCategoryFor(widthCm: number, lengthCm: number): SizeCategory | null {
  if (!Number.isFinite(widthCm) || !Number.isFinite(lengthCm) || widthCm <= 0 || lengthCm <= 0) {
    return null;
  }
  const short = Math.min(widthCm, lengthCm);
  const long = Math.max(widthCm, lengthCm);
  let best: SizeCategory | null = null;
  let bestDistance = Infinity;
  for (const row of SIZE_CATEGORY_TABLE) {
    const r = row.rangeCm;
    if (short < r.minWidth || short > r.maxWidth || long < r.minLength || long > r.maxLength) continue;
    const dw = (short - row.nominalCm.width) / row.nominalCm.width;
    const dl = (long - row.nominalCm.length) / row.nominalCm.length;
    const distance = Math.hypot(dw, dl);
    if (distance < bestDistance) {
      best = row.category;
      bestDistance = distance;
    }
  }
  return best;
}
