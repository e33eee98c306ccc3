/**
 * Where to put extra (or skipped) stitches along an edge so they don't clump.
 *
 * Rule: the k chosen stitches split the other n − k stitches of the edge into k + 1 runs
 * (before the first, between each pair, after the last). Runs differ in length by at most one,
 * so the changes read as "every so many stitches". The end runs are never empty while
 * k ≤ n − 2, which keeps changes off stitch 1 and stitch n, the ones next to the corners.
 */

/** Split `total` items into `parts` runs whose lengths differ by at most one. */
function balancedRuns(total: number, parts: number): number[] {
  const runs: number[] = [];
  for (let j = 0; j < parts; j++) {
    runs.push(Math.floor(((j + 1) * total) / parts) - Math.floor((j * total) / parts));
  }
  return runs;
}

/**
 * 1-based stitch numbers for k changes among n stitches.
 *
 * - k ≤ n − 2: k distinct, strictly increasing positions within 2..n−1, runs balanced as above.
 * - n − 2 < k ≤ n: still distinct (one change per stitch), but the corner-side stitches must be
 *   used too: stitch n first, then stitch 1.
 * - k > n: more than one change per stitch. Each stitch gets ⌊k/n⌋ or ⌈k/n⌉ changes and the
 *   list repeats a stitch number once per change (non-decreasing); `perStitch` groups them.
 *   Only increases can do this; a stitch cannot be skipped twice.
 */
export function spreadPositions(n: number, k: number): number[] {
  if (!Number.isInteger(n) || n < 0) throw new RangeError(`n must be a whole number of at least 0 (got ${n})`);
  if (!Number.isInteger(k) || k < 0) throw new RangeError(`k must be a whole number of at least 0 (got ${k})`);
  if (k === 0) return [];
  if (n === 0) throw new RangeError('cannot place changes on an edge with no stitches');

  if (k > n) {
    const base = Math.floor(k / n);
    const extra = balancedSpread(n, k - base * n);
    const out: number[] = [];
    for (let s = 1; s <= n; s++) {
      const times = base + (extra.has(s) ? 1 : 0);
      for (let t = 0; t < times; t++) out.push(s);
    }
    return out;
  }
  return [...balancedSpread(n, k)].sort((a, b) => a - b);
}

function balancedSpread(n: number, k: number): Set<number> {
  const positions = new Set<number>();
  if (k === 0) return positions;
  if (k > n - 2) {
    for (let s = 2; s <= n - 1; s++) positions.add(s);
    if (positions.size < k) positions.add(n);
    if (positions.size < k) positions.add(1);
    return positions;
  }
  const free = n - k;
  let runs: number[];
  if (free >= k + 1) {
    runs = balancedRuns(free, k + 1);
  } else {
    // Not enough plain stitches to separate every change: keep one at each end (the corner
    // side) and share the rest among the inner runs, some of which are then empty.
    runs = [1, ...balancedRuns(free - 2, k - 1), 1];
  }
  let stitch = 0;
  for (let j = 0; j < k; j++) {
    stitch += runs[j]! + 1;
    positions.add(stitch);
  }
  return positions;
}

/** Group a position list into "stitch s gets t changes", in order. */
export function perStitch(positions: readonly number[]): { stitch: number; times: number }[] {
  const out: { stitch: number; times: number }[] = [];
  for (const p of positions) {
    const last = out[out.length - 1];
    if (last && last.stitch === p) last.times += 1;
    else out.push({ stitch: p, times: 1 });
  }
  return out;
}
