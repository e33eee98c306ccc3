/**
 * Benchmarks, measured side by side in one run and printed as ratios against a baseline, never as
 * pass/fail on time. Each pair runs interleaved in rounds so that machine noise hits both alike.
 *
 *   npm run bench      (node --expose-gc, so the heap figure is taken between full collections)
 */
import { planBorder } from '@shared/border/plan';
import { check } from '@shared/guidelines/check';
import { defaultGuidelines } from '@shared/guidelines/defaults';
import { POPULATIONS } from '@shared/schemas/blanket';
import type { BlanketFields } from '@shared/schemas/blanket';

function time(fn: () => unknown, iterations: number): number {
  const start = process.hrtime.bigint();
  for (let i = 0; i < iterations; i++) fn();
  return Number(process.hrtime.bigint() - start) / iterations;
}

function compare(name: string, baselineName: string, baseline: () => unknown, candidate: () => unknown, iterations = 2000, rounds = 7) {
  // Warm up both so the JIT has seen them.
  time(baseline, iterations / 4);
  time(candidate, iterations / 4);
  const ratios: number[] = [];
  let b = 0;
  let c = 0;
  for (let r = 0; r < rounds; r++) {
    const tb = time(baseline, iterations);
    const tc = time(candidate, iterations);
    ratios.push(tc / tb);
    b += tb;
    c += tc;
  }
  ratios.sort((x, y) => x - y);
  const median = ratios[Math.floor(ratios.length / 2)];
  console.log(
    `${name.padEnd(44)} ${(c / rounds / 1000).toFixed(2).padStart(9)} µs   vs ${baselineName.padEnd(30)} ${(b / rounds / 1000).toFixed(2).padStart(9)} µs   ratio ${median.toFixed(2)}×`,
  );
}

/** Heap kept by what fn returns, measured between full collections; null when gc is not exposed. */
function heapDelta(fn: () => unknown[]): number | null {
  // Without a forced collection the figure is mostly garbage left by earlier rounds, so it swings.
  if (!globalThis.gc) return null;
  globalThis.gc();
  const before = process.memoryUsage().heapUsed;
  const keep = fn();
  globalThis.gc();
  const after = process.memoryUsage().heapUsed;
  if (keep.length < 0) console.log(keep);
  return after - before;
}

const request = { across: 142, rows: { count: 117, pattern: ['sc', 'dc'] as ('sc' | 'dc')[] }, multiple: 6, offset: 1, strategy: 'fewest' as const };
const json = JSON.stringify(request);

console.log('Kindloop benchmarks (median ratio of 7 interleaved rounds)\n');
// Baseline: the JSON round trip every API call pays anyway; the plan should stay within a small multiple of it.
compare('planBorder per-edge (142 × 117 rows)', 'JSON parse + stringify of it', () => JSON.stringify(JSON.parse(json)), () => planBorder(request));
compare('planBorder continuous (142 × 117 rows)', 'planBorder per-edge', () => planBorder(request), () => planBorder({ ...request, mode: 'continuous' }));
compare('planBorder, 2,000 × 2,000 (the largest allowed)', 'planBorder 142 × 117', () => planBorder(request), () => planBorder({ ...request, across: 2000, rows: 2000 }), 200);

const blanket: BlanketFields = {
  widthCm: 76, lengthCm: 92, yarnWeight: 4, fibres: ['acrylic'], features: ['fringe'],
  machineWashable: true, dryerSafe: true, smokeFree: true, petFree: true, newYarn: true,
};
const few = POPULATIONS.map((p, i) => ({ recipientId: i + 1, name: p, guidelines: defaultGuidelines(p) }));
const many = Array.from({ length: 60 }, (_, i) => ({ recipientId: i + 1, name: `r${i}`, guidelines: defaultGuidelines(POPULATIONS[i % POPULATIONS.length]) }));
compare('check against 1 set + 60 others (alsoFits)', 'check against 1 set + 6 others', () => check(blanket, few[2].guidelines, few), () => check(blanket, many[2].guidelines, many));

const mem1 = heapDelta(() => Array.from({ length: 1000 }, () => planBorder(request)));
const mem2 = heapDelta(() => Array.from({ length: 1000 }, () => planBorder({ ...request, across: 1400, rows: 1170 })));
if (mem1 === null || mem2 === null) {
  console.log('\nheap figure skipped: run with node --expose-gc (npm run bench does) so it is measured between full collections');
} else {
  console.log(`\nheap kept by 1,000 plans: ${(mem1 / 1024).toFixed(0)} KiB at 142 × 117; ${(mem2 / 1024).toFixed(0)} KiB at 1,400 × 1,170 (ratio ${(mem2 / mem1).toFixed(2)}×)`);
}
