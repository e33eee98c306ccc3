/**
 * Yarn estimates by area. Crochet fabric uses a fairly steady length of yarn per square inch
 * for a given yarn and stitch family, so area is the most honest single input a maker has before
 * the blanket exists.
 */
import { toCm, toYards, yardsToMetres, CM_PER_INCH, type LengthUnit, type YarnUnit } from './units';
import { YARN_WEIGHTS, type YarnWeightCategory } from './yarn-weights';

/** The one measured value: worsted (#4) in sc/hdc/dc at 5 mm. */
export const WORSTED_YARDS_PER_SQ_IN = 0.87;
export const WORSTED_YARDS_PER_SQ_IN_SOURCE =
  "from memory: recalled from one maker's published measurements that we cannot name, a rule of thumb (REFERENCES.md, crochet conventions)";

/**
 * Other weights are scaled from the #4 value by the ratio of the CYC crochet gauge midpoints:
 * when every dimension of a stitch scales with the yarn, yarn length per area goes as stitches
 * per inch. That scaling is our own estimate, not a published table.
 */
export const YARN_PER_AREA_SCALING_SOURCE =
  'scaled from the #4 value by CYC gauge midpoints: our own estimate, common practice (no published source)';

export interface YarnPerAreaRow {
  category: YarnWeightCategory;
  /** Yards of yarn per square inch of fabric. */
  yardsPerSqIn: number;
  /** Gauge midpoint (sc per 4 in) the scaling used. */
  gaugeMidpoint: number;
  basis: 'measured (rule of thumb)' | 'scaled estimate';
}

function midpoint(category: YarnWeightCategory): number | undefined {
  const row = YARN_WEIGHTS.find((r) => r.category === category);
  if (!row || row.crochetGauge.stitch !== 'sc') return undefined;
  const { min, max } = row.crochetGauge;
  // "5 and fewer" (jumbo): the open end is taken at 5, which errs towards more yarn.
  if (min === null) return max ?? undefined;
  if (max === null) return min;
  return (min + max) / 2;
}

const WORSTED_MIDPOINT = midpoint(4)!;

/**
 * Lace (#0) is left out: its gauge is given in dc, so it cannot be scaled the same way, and it
 * is not a blanket yarn for the drives we serve.
 */
export const YARN_PER_AREA: readonly YarnPerAreaRow[] = ([1, 2, 3, 4, 5, 6, 7] as const).map((category) => {
  const gaugeMidpoint = midpoint(category)!;
  return {
    category,
    yardsPerSqIn: category === 4 ? WORSTED_YARDS_PER_SQ_IN : (WORSTED_YARDS_PER_SQ_IN * gaugeMidpoint) / WORSTED_MIDPOINT,
    gaugeMidpoint,
    basis: category === 4 ? 'measured (rule of thumb)' : 'scaled estimate',
  };
});

export function yardsPerSqIn(category: number): number {
  const row = YARN_PER_AREA.find((r) => r.category === category);
  if (!row) throw new RangeError(`no yarn-per-area estimate for yarn weight ${category} (categories 1–7 only)`);
  return row.yardsPerSqIn;
}

/** Spare yarn on top of the estimate unless told otherwise: dye lots rarely match later. */
export const DEFAULT_MARGIN = 0.1;

export interface YarnEstimateInput {
  /** Body size, border excluded. */
  body: { width: number; length: number; unit: LengthUnit };
  yarnWeight: number;
  /** Border on one side: total depth (in body.unit) and yarn per area relative to plain hdc. */
  border?: { depth: number; yarnFactor?: number };
  /** 0.1 = 10 % extra. */
  margin?: number;
  skein?: { length: number; unit: YarnUnit };
  /** A maker's own measurement replaces the table. */
  yardsPerSqIn?: number;
}

export interface YarnEstimate {
  yardsPerSqIn: number;
  bodyYards: number;
  borderYards: number;
  /** body + border, before the margin. */
  subtotalYards: number;
  margin: number;
  /** Rounded up to whole yards / metres after the margin. */
  totalYards: number;
  totalMetres: number;
  skeins?: number;
  note: string;
}

const sqIn = (cm2: number): number => cm2 / (CM_PER_INCH * CM_PER_INCH);

export function estimateYarn(input: YarnEstimateInput): YarnEstimate {
  const { body } = input;
  const margin = input.margin ?? DEFAULT_MARGIN;
  if (!(body.width > 0) || !(body.length > 0)) throw new RangeError('body width and length must be above 0');
  if (!(margin >= 0) || margin > 1) throw new RangeError(`margin must be from 0 to 1 (got ${margin})`);
  const rate = input.yardsPerSqIn ?? yardsPerSqIn(input.yarnWeight);
  if (!(rate > 0)) throw new RangeError(`yardsPerSqIn must be above 0 (got ${rate})`);

  const w = toCm(body.width, body.unit);
  const l = toCm(body.length, body.unit);
  const bodyYards = sqIn(w * l) * rate;

  let borderYards = 0;
  if (input.border) {
    const d = toCm(input.border.depth, body.unit);
    const factor = input.border.yarnFactor ?? 1;
    if (!(d >= 0) || !(factor > 0)) throw new RangeError('border depth must be 0 or more and yarnFactor above 0');
    // The border is a frame around the body: its outer edge is longer than the body's perimeter,
    // which the corner squares (4·d²) account for.
    const frameCm2 = (w + 2 * d) * (l + 2 * d) - w * l;
    borderYards = sqIn(frameCm2) * rate * factor;
  }

  const subtotalYards = bodyYards + borderYards;
  const withMargin = subtotalYards * (1 + margin);
  let skeins: number | undefined;
  if (input.skein) {
    const skeinYards = toYards(input.skein.length, input.skein.unit);
    if (!(skeinYards > 0)) throw new RangeError('skein length must be above 0');
    skeins = Math.ceil(withMargin / skeinYards - 1e-9);
  }
  return {
    yardsPerSqIn: rate,
    bodyYards,
    borderYards,
    subtotalYards,
    margin,
    totalYards: Math.ceil(withMargin - 1e-9),
    totalMetres: Math.ceil(yardsToMetres(withMargin) - 1e-9),
    ...(skeins === undefined ? {} : { skeins }),
    note:
      input.yardsPerSqIn === undefined
        ? `Rule of thumb: ${WORSTED_YARDS_PER_SQ_IN_SOURCE}; other weights ${YARN_PER_AREA_SCALING_SOURCE}. Includes ${Math.round(margin * 100)} % spare.`
        : `From your own measurement of ${rate} yd per square inch. Includes ${Math.round(margin * 100)} % spare.`,
  };
}
