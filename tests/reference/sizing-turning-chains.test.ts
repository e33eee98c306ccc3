import { describe, it, expect } from 'vitest';
import { TURNING_CHAINS, TURNING_CHAIN_SOURCE } from '@shared/sizing/turning-chains';

// Source: Crochet For Dummies; standard US terms — sl st 0, sc 1, hdc 2, dc 3, tr 4, dtr 5;
// the turning chain counts as a stitch except after sc.
describe('Turning chains (Crochet For Dummies; standard US terms)', () => {
  it('names its source', () => {
    expect(TURNING_CHAIN_SOURCE).toBe('Crochet For Dummies; standard US terms');
  });

  it.each([
    ['sl st', 0],
    ['sc', 1],
    ['hdc', 2],
    ['dc', 3],
    ['tr', 4],
    ['dtr', 5],
  ] as const)('Crochet For Dummies: %s turns with %i chain(s)', (stitch, chains) => {
    expect(TURNING_CHAINS[stitch].chains).toBe(chains);
  });

  it('Crochet For Dummies: the turning chain counts as a stitch except after sc', () => {
    expect(TURNING_CHAINS.sc.countsAsStitch).toBe(false);
    for (const s of ['hdc', 'dc', 'tr', 'dtr'] as const) expect(TURNING_CHAINS[s].countsAsStitch).toBe(true);
  });
});
