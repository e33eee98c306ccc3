/**
 * The suggestion's solver, timed side by side with baselines in one run and printed as ratios (never
 * pass/fail on time).
 *
 *   npm run bench:matching            (add --full to also run munkres-js at 800 × 800)
 *
 * 1. Against munkres-js 1.2.2 (npm), a Munkres/Hungarian solver on the square slot-by-slot matrix,
 *    on the same random instances with equal totals: both totals must be equal, and the ratio says
 *    how much faster searching over needs (not slots) is.
 * 2. At the drive's scale (5,000 blankets against 200 needs with 5,000 slots) munkres-js would need a
 *    25-million-cell matrix and O(n³) steps, so the baseline there is a greedy pass (cheapest pair
 *    first): the ratio prints the time paid for the optimum and how much cost and how many
 *    placements greedy gives away.
 */
import computeMunkres from 'munkres-js';
import { solveMatching, type MatchProblem } from '@shared/matching/solve';
import { asSquareMatrix, randomInstance } from '../tests/fixtures/matching-instances';

function timed<T>(fn: () => T): { ms: number; value: T } {
  const start = process.hrtime.bigint();
  const value = fn();
  return { ms: Number(process.hrtime.bigint() - start) / 1e6, value };
}

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.floor(s.length / 2)]!;
}

/** Cheapest possible pair first, while its need has room: what an organiser might do by hand. */
function greedy(p: MatchProblem): { placed: number; cost: number } {
  const pairs: Array<[number, number, number]> = [];
  p.rows.forEach((edges, i) => edges.forEach((e) => pairs.push([e.cost, i, e.col])));
  pairs.sort((a, b) => a[0] - b[0]);
  const room = [...p.capacities];
  const done = new Uint8Array(p.rows.length);
  let placed = 0;
  let cost = 0;
  for (const [c, i, j] of pairs) {
    if (done[i] || room[j]! === 0) continue;
    done[i] = 1;
    room[j]! -= 1;
    placed++;
    cost += c;
  }
  return { placed, cost };
}

const full = process.argv.includes('--full');
console.log('Suggestion solver benchmarks\n');
console.log('1. Against munkres-js 1.2.2 on the same instances (equal totals; impossible pairs priced above any real total)');
console.log('   blankets × needs   density     ours ms   munkres-js ms    ratio   total (ours = reference)');
const sizes: Array<[number, number]> = [[50, 5], [100, 10], [200, 20], [400, 40], ...(full ? ([[800, 80]] as Array<[number, number]>) : [])];
for (const [n, m] of sizes) {
  const density = 0.3;
  const p = randomInstance(n * 7 + m, n, m, density);
  const { matrix, impossible } = asSquareMatrix(p);
  const ours = median([0, 1, 2, 3, 4].map(() => timed(() => solveMatching(p)).ms));
  const sol = solveMatching(p);
  const ref = timed(() => computeMunkres(matrix));
  const refTotal = ref.value.reduce((s, [i, k]) => s + matrix[i]![k]!, 0);
  const oursTotal = sol.cost + impossible * (n - sol.placed);
  console.log(
    `   ${`${n} × ${m}`.padEnd(17)} ${density.toFixed(2).padStart(7)} ${ours.toFixed(2).padStart(11)} ${ref.ms.toFixed(1).padStart(15)} ${`${(ref.ms / ours).toFixed(0)}×`.padStart(8)}   ${oursTotal} ${oursTotal === refTotal ? '=' : '≠'} ${refTotal}`,
  );
}

console.log('\n2. The drive\'s scale: 5,000 blankets, 200 needs, 5,000 slots, against a greedy pass');
console.log('   density    ours ms   greedy ms   time ratio   placed ours / greedy   cost ours / greedy');
for (const density of [0.05, 0.25, 0.6]) {
  const p = randomInstance(5000 + Math.round(density * 100), 5000, 200, density);
  const ours = timed(() => solveMatching(p));
  const base = timed(() => greedy(p));
  console.log(
    `   ${density.toFixed(2).padStart(7)} ${ours.ms.toFixed(0).padStart(10)} ${base.ms.toFixed(0).padStart(11)} ${`${(ours.ms / base.ms).toFixed(2)}×`.padStart(12)}   ${`${ours.value.placed} / ${base.value.placed}`.padStart(20)}   ${`${ours.value.cost} / ${base.value.cost}`.padStart(18)}`,
  );
}
