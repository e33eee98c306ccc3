/**
 * Kindloop's border library: a few borders that suit charity blankets, described in our own
 * words. Multiples are the craft's "multiple of N plus M"; the other numbers are planning aids.
 */
import { usToUkText } from '../sizing/stitch-names';
import { CORNER_STITCHES } from './row-ends';
import type { RoundMode } from './round';
import { BORDER_NAMES, type BorderId } from './library-names';

const named = (id: BorderId) => ({ id, name: BORDER_NAMES[id] });

export type Difficulty = 1 | 2 | 3;

export interface BorderPattern {
  /** Stable kebab-case key, safe in URLs and saved plans. */
  id: string;
  name: string;
  multiple: number;
  offset: number;
  /** Stitches worked before the first repeat of an edge (see simulateRound). */
  lead: number;
  /** 0-based stitch of the repeat that holds its centre (where a shell's dc go). */
  centre: number;
  /**
   * Foundation stitches worked into each corner stitch, when fitted edge by edge, where the pattern
   * needs other than the usual 3 (CORNER_STITCHES): chosen so the corner stitches and the next edge's
   * first stitch make one whole repeat, which puts a repeat on the corner. Worked by hand; no
   * published source.
   */
  cornerStitches?: number;
  rounds: number;
  /** Depth each round adds, in cm, at the reference gauge. */
  depthPerRoundCm: number;
  /** Yarn per stitch relative to a plain hdc round (1 = same as hdc). */
  yarnFactor: number;
  difficulty: Difficulty;
  /** Gaps a finger could catch in: drives often refuse such work for infants (common practice). */
  openWork: boolean;
  look: string;
  /** Written instructions in standard US terms, worked over the fitted foundation round. */
  instructions: string;
}

/**
 * Depths and yarn factors are our own planning estimates for medium (#4) yarn on a 5 mm hook,
 * from memory, not measured; they size the border, they are not a published value.
 */
export const LIBRARY_ESTIMATES_SOURCE = 'our own estimates at medium (#4) yarn on a 5 mm hook; from memory, not measured';

/** Yarn and hook that suit these borders: common practice (no published source). */
export const BORDER_YARN_ADVICE = {
  yarnWeight: 4,
  hookMm: 5.0,
  ruffleFix: { yarnWeight: 3, note: 'If the border ruffles, go down to light (#3) yarn.' },
  source: 'common practice (no published source)',
} as const;

export const BORDER_LIBRARY: readonly BorderPattern[] = [
  {
    ...named('five-dc-shell'),
    multiple: 4,
    offset: 1,
    lead: 1,
    centre: 1,
    rounds: 1,
    depthPerRoundCm: 2,
    yarnFactor: 1.5,
    difficulty: 1,
    openWork: false,
    look: 'Rounded fans of five doubles on every fourth stitch, anchored between fans by a single crochet.',
    instructions:
      'Join yarn with a sl st in the first st of the top edge. Ch 1, sc in same st, *skip next st, 5 dc in next st, ' +
      'skip next st, sc in next st; rep from * around, working the last sc as a sl st into the first sc. Fasten off.',
  },
  {
    ...named('picot-tipped-shell'),
    multiple: 4,
    offset: 1,
    lead: 1,
    centre: 1,
    rounds: 1,
    depthPerRoundCm: 2.2,
    yarnFactor: 1.7,
    difficulty: 2,
    openWork: false,
    look: 'Fans split by a tiny chain loop at the top, so each one ends in a small point.',
    instructions:
      'Join yarn with a sl st in the first st of the top edge. Ch 1, sc in same st, *skip next st, ' +
      '(2 dc, ch 3, sl st in 3rd ch from hook, 2 dc) in next st, skip next st, sc in next st; rep from * around, ' +
      'working the last sc as a sl st into the first sc. Fasten off.',
  },
  {
    ...named('crab-stitch-edge'),
    multiple: 1,
    offset: 0,
    lead: 0,
    centre: 0,
    rounds: 1,
    depthPerRoundCm: 0.6,
    yarnFactor: 0.9,
    difficulty: 2,
    openWork: false,
    look: 'A firm twisted cord along the very edge, for blankets that should not have a frill.',
    instructions:
      'Join yarn with a sl st in any st. Ch 1; working backwards along the round (left to right if you hold the hook ' +
      'in your right hand), work reverse sc in each st around. Sl st in first st to join. Fasten off.',
  },
  {
    ...named('plain-hdc-round'),
    multiple: 1,
    offset: 0,
    lead: 0,
    centre: 0,
    rounds: 2,
    depthPerRoundCm: 1,
    yarnFactor: 1,
    difficulty: 1,
    openWork: false,
    look: 'Flat bands of half doubles that square off the blanket and frame a busy body.',
    instructions:
      'Each round: join yarn with a sl st in the first st of the top edge. Ch 2 (does not count as a st), hdc in each ' +
      'st around, working 3 hdc in the middle st of each corner. Sl st in first hdc to join.',
  },
  {
    ...named('wide-scallop'),
    multiple: 6,
    offset: 1,
    lead: 1,
    centre: 2,
    // 5 corner stitches + the next edge's first sc = one 6-stitch scallop, centred on the corner.
    cornerStitches: 5,
    rounds: 1,
    depthPerRoundCm: 2.5,
    yarnFactor: 1.6,
    difficulty: 1,
    openWork: false,
    look: 'Deep half-moons of seven doubles, spaced wide, for a soft wavy outline.',
    instructions:
      'Join yarn with a sl st in the first st of the top edge. Ch 1, sc in same st, *skip next 2 sts, 7 dc in next st, ' +
      'skip next 2 sts, sc in next st; rep from * around, working the last sc as a sl st into the first sc. Fasten off.',
  },
  {
    ...named('picot-ribbon'),
    multiple: 3,
    offset: 1,
    lead: 1,
    centre: 1,
    rounds: 1,
    depthPerRoundCm: 0.9,
    yarnFactor: 1.2,
    difficulty: 2,
    openWork: false,
    look: 'A narrow band of single crochet dotted with small chain bumps every third stitch.',
    instructions:
      'Join yarn with a sl st in the first st of the top edge. Ch 1, sc in same st, *sc in next 2 sts, ch 3, ' +
      'sl st in 3rd ch from hook, sc in next st; rep from * around. Sl st in first sc to join. Fasten off.',
  },
  {
    ...named('open-v-lattice'),
    multiple: 2,
    offset: 0,
    lead: 0,
    centre: 0,
    rounds: 1,
    depthPerRoundCm: 1.2,
    yarnFactor: 1.2,
    difficulty: 1,
    openWork: true,
    look: 'Little V shapes side by side with a gap under each, light and airy.',
    instructions:
      'Join yarn with a sl st in the first st of the top edge. Ch 4 (counts as dc and ch 1), dc in same st, ' +
      '*skip next st, (dc, ch 1, dc) in next st; rep from * around, ending skip last st, sl st in 3rd ch of ' +
      'beginning ch-4. Fasten off.',
  },
  {
    ...named('bobble-dots'),
    multiple: 4,
    offset: 0,
    lead: 0,
    centre: 1,
    rounds: 1,
    depthPerRoundCm: 1.1,
    yarnFactor: 1.4,
    difficulty: 3,
    openWork: false,
    look: 'Raised round bumps every fourth stitch on a single crochet band.',
    instructions:
      'Bobble: (yarn over, insert hook in st, pull up a loop, yarn over, pull through 2 loops) 4 times in the same st, ' +
      'yarn over, pull through all 5 loops. Join yarn with a sl st in the first st of the top edge. Ch 1; starting ' +
      'in the same st, *sc in next st, 4-dc bobble in next st, sc in next 2 sts; rep from * around. Sl st in first sc to join. Fasten off.',
  },
];

/**
 * What the border engine needs to know of a library border. A border's own corner count serves
 * fitting edge by edge, where each corner must hold a whole repeat; one continuous round keeps the
 * usual 3 corner stitches and moves its first repeat to centre the corners instead.
 */
export function borderPlanOptions(
  pattern: BorderPattern,
  mode: RoundMode = 'per-edge',
): {
  multiple: number;
  offset: number;
  lead: number;
  centre: number;
  cornerStitches: number;
} {
  return {
    multiple: pattern.multiple,
    offset: pattern.offset,
    lead: pattern.lead,
    centre: pattern.centre,
    cornerStitches: mode === 'per-edge' ? (pattern.cornerStitches ?? CORNER_STITCHES) : CORNER_STITCHES,
  };
}

export function borderById(id: string): BorderPattern | undefined {
  return BORDER_LIBRARY.find((b) => b.id === id);
}

/** The same instructions in UK terms, converted token by token. */
export function instructionsUk(pattern: BorderPattern): string {
  return usToUkText(pattern.instructions);
}

/** Border depth on one side, in cm, at the reference gauge. */
export function borderDepthCm(pattern: BorderPattern): number {
  return pattern.rounds * pattern.depthPerRoundCm;
}
