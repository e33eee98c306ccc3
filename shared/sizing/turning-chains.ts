/**
 * Turning chains, standard US terms. Kept as data of its own, apart from the row-end allowance
 * of the foundation round: the two are often confused but answer different questions (how tall a
 * row is when you turn, versus how many stitches a row end will take).
 */

import { ordinalSuffix } from '../border/ordinal';

export const TURNING_CHAIN_SOURCE = 'Crochet For Dummies; standard US terms';

export type ChainedStitch = 'sl st' | 'sc' | 'hdc' | 'dc' | 'tr' | 'dtr';

export interface TurningChain {
  stitch: ChainedStitch;
  chains: number;
  /**
   * Whether the turning chain stands in for the first stitch of the row. The source says it does
   * "except after sc"; a slip stitch row turns with no chain, so there is nothing to count.
   */
  countsAsStitch: boolean;
}

export const TURNING_CHAINS: Readonly<Record<ChainedStitch, TurningChain>> = {
  'sl st': { stitch: 'sl st', chains: 0, countsAsStitch: false },
  sc: { stitch: 'sc', chains: 1, countsAsStitch: false },
  hdc: { stitch: 'hdc', chains: 2, countsAsStitch: true },
  dc: { stitch: 'dc', chains: 3, countsAsStitch: true },
  tr: { stitch: 'tr', chains: 4, countsAsStitch: true },
  dtr: { stitch: 'dtr', chains: 5, countsAsStitch: true },
};

export interface StartingChain {
  /** Chains to make for the body's first row. */
  chains: number;
  /** The first stitch goes into this chain counting from the hook (e.g. 2 = "2nd ch from hook"). */
  firstStitchIntoChain: number;
  turningChain: number;
  countsAsStitch: boolean;
  note: string;
}

/**
 * Foundation chain for a first row of `stitches` stitches. Where the turning chain counts as a
 * stitch, the skipped chains are the row's first stitch, so one fewer chain is needed than
 * "stitches + turning chain"; after sc they do not count, and every stitch needs its own chain.
 */
export function startingChain(stitches: number, stitch: Exclude<ChainedStitch, 'sl st'>): StartingChain {
  if (!Number.isInteger(stitches) || stitches < 1) {
    throw new RangeError(`stitches must be a whole number of at least 1 (got ${stitches})`);
  }
  const tc = TURNING_CHAINS[stitch];
  const chains = tc.countsAsStitch ? stitches - 1 + tc.chains : stitches + tc.chains;
  const into = tc.chains + 1;
  const note = tc.countsAsStitch
    ? `Chain ${chains}; work the first ${stitch} into the ${into}${ordinalSuffix(into)} chain from the hook. ` +
      `The ${tc.chains} skipped chains count as the first stitch, so the row has ${stitches} stitches.`
    : `Chain ${chains}; work the first ${stitch} into the ${into}${ordinalSuffix(into)} chain from the hook. ` +
      `The skipped chain does not count as a stitch, so the row has ${stitches} stitches.`;
  return { chains, firstStitchIntoChain: into, turningChain: tc.chains, countsAsStitch: tc.countsAsStitch, note };
}
