import { describe, expect, it } from 'vitest';
import computeMunkres from 'munkres-js';
import { solveMatching } from '@shared/matching/solve';
import { asSquareMatrix, randomInstance } from '../fixtures/matching-instances';

/**
 * Reference: the npm package munkres-js 1.2.2 (the Munkres/Hungarian algorithm on a square cost
 * matrix), a solver written independently of ours. On random instances with equal totals and
 * impossible pairs, our capacitated solver must reach exactly the same optimum: the same number
 * placed and the same total cost. munkres-js sees every slot of a need as its own column and an
 * impossible pair as a cost larger than any total of real costs.
 */
const REFERENCE = 'munkres-js 1.2.2 (npm)';

function compare(seed: number, blankets: number, needs: number, density: number) {
  const problem = randomInstance(seed, blankets, needs, density);
  const ours = solveMatching(problem);
  const { matrix, impossible } = asSquareMatrix(problem);
  const pairs = computeMunkres(matrix);
  const refTotal = pairs.reduce((s, [i, k]) => s + matrix[i]![k]!, 0);
  const refUnplaced = pairs.filter(([i, k]) => matrix[i]![k] === impossible).length;
  // Ours, priced the reference's way: each blanket left unplaced takes an impossible slot.
  const oursTotal = ours.cost + impossible * (blankets - ours.placed);
  return { ours, oursTotal, refTotal, refUnplaced };
}

describe(`the suggestion's solver against ${REFERENCE}`, () => {
  it('reaches the same optimum on 60 random small instances (up to 30 blankets, sparse to dense)', () => {
    for (let seed = 1; seed <= 60; seed++) {
      const blankets = 1 + (seed % 30);
      const needs = 1 + (seed % 7);
      const density = [0.15, 0.4, 0.8, 1][seed % 4]!;
      const r = compare(seed, blankets, needs, density);
      expect(r.oursTotal, `seed ${seed}: ${blankets} blankets, ${needs} needs, density ${density}`).toBe(r.refTotal);
      expect(blankets - r.ours.placed).toBe(r.refUnplaced);
    }
  });

  it('reaches the same optimum on 200 × 200 instances with impossible pairs', { timeout: 120_000 }, () => {
    for (const [seed, needs, density] of [
      [101, 10, 0.3],
      [102, 40, 0.1],
      [103, 200, 0.05],
    ] as const) {
      const r = compare(seed, 200, needs, density);
      expect(r.oursTotal, `seed ${seed}`).toBe(r.refTotal);
      expect(200 - r.ours.placed).toBe(r.refUnplaced);
    }
  });

  it('leaves some blankets unplaced on a sparse instance, so both sides of the lexicographic goal are exercised', () => {
    const r = compare(7, 40, 8, 0.05);
    expect(r.refUnplaced).toBeGreaterThan(0);
    expect(r.oursTotal).toBe(r.refTotal);
  });
});
