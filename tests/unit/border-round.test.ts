import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { fitEdge } from '@shared/border/fit';
import { fitRound, roundTotal, shareRoundChange, simulateRound, EDGE_ORDER } from '@shared/border/round';

describe('roundTotal', () => {
  it('adds the four edges and 3 stitches for each of the 4 corners', () => {
    expect(roundTotal({ top: 33, right: 25, bottom: 33, left: 25 })).toBe(128);
    expect(roundTotal({ top: 1, right: 1, bottom: 1, left: 1 }, 1)).toBe(8);
  });
});

describe('shareRoundChange', () => {
  const roomy = { top: 50, right: 50, bottom: 50, left: 50 };
  it('hands out equal parts, remainder to top, bottom, right in turn', () => {
    expect(shareRoundChange(0, roomy)).toEqual({ top: 0, right: 0, bottom: 0, left: 0 });
    expect(shareRoundChange(1, roomy)).toEqual({ top: 1, right: 0, bottom: 0, left: 0 });
    expect(shareRoundChange(2, roomy)).toEqual({ top: 1, right: 0, bottom: 1, left: 0 });
    expect(shareRoundChange(3, roomy)).toEqual({ top: 1, right: 1, bottom: 1, left: 0 });
    expect(shareRoundChange(6, roomy)).toEqual({ top: 2, right: 1, bottom: 2, left: 1 });
    expect(shareRoundChange(-5, roomy)).toEqual({ top: -2, right: -1, bottom: -1, left: -1 });
  });

  it('never skips an edge down to nothing', () => {
    expect(shareRoundChange(-4, { top: 1, right: 5, bottom: 1, left: 5 })).toEqual({ top: 0, right: -2, bottom: 0, left: -2 });
    expect(shareRoundChange(-3, { top: 1, right: 1, bottom: 2, left: 2 })).toBeUndefined();
  });
});

describe('fitRound (continuous mode)', () => {
  it('brings the whole round to a multiple of N, ignoring the +M of the border', () => {
    // 30 + 23 + 30 + 23 + 12 = 118; next multiple of 4 is 120.
    expect(fitRound({ top: 30, right: 23, bottom: 30, left: 23 }, 4, 'add')).toEqual({
      before: 118,
      total: 120,
      change: 2,
      edgeChanges: { top: 1, right: 0, bottom: 1, left: 0 },
    });
    expect(fitRound({ top: 30, right: 23, bottom: 30, left: 23 }, 4, 'fewest').total).toBe(120);
    // 30 + 26 + 30 + 23 + 12 = 121: one stitch to skip beats three to add.
    expect(fitRound({ top: 30, right: 26, bottom: 30, left: 23 }, 4, 'fewest')).toMatchObject({
      total: 120,
      change: -1,
      edgeChanges: { top: -1, right: 0, bottom: 0, left: 0 },
    });
    expect(fitRound({ top: 30, right: 26, bottom: 30, left: 23 }, 4, 'add')).toMatchObject({ total: 124, change: 3 });
  });

  it("falls back to adding when 'fewest' would empty the edges", () => {
    // 1+5+1+5+12 = 24 → 20: the one-stitch edges keep their stitch and the sides give two each.
    expect(fitRound({ top: 1, right: 5, bottom: 1, left: 5 }, 20, 'fewest')).toMatchObject({ total: 20, change: -4 });
    // 1+1+1+2+12 = 17 → 16 would need one stitch from edges of 1, 1, 1 and 2: only left can give.
    expect(fitRound({ top: 1, right: 1, bottom: 1, left: 2 }, 16, 'fewest')).toMatchObject({ total: 16, change: -1 });
    // 1+1+1+1+12 = 16; multiple 15 → 15 would need a stitch no edge can spare.
    expect(fitRound({ top: 1, right: 1, bottom: 1, left: 1 }, 15, 'fewest')).toMatchObject({ total: 30, change: 14 });
  });
});

describe('simulateRound', () => {
  it('five-dc shell, per edge, 33 × 25: every corner middle stitch takes a shell', () => {
    const sim = simulateRound({ top: 33, right: 25, bottom: 33, left: 25 }, { multiple: 4, mode: 'per-edge', lead: 1, centre: 1 });
    expect(sim.total).toBe(128);
    // 8 shells on top + 1 in the corner, 6 + 1 on each side, and so on: (8+1+6+1)·2 = 32.
    expect(sim.repeats).toHaveLength(32);
    expect(sim.repeats[0]).toEqual({ number: 1, start: 2, centre: 3, on: 'top' });
    expect(sim.repeats[8]).toEqual({ number: 9, start: 34, centre: 35, on: 'top-right' });
    expect(sim.corners).toEqual([
      { corner: 'top-right', middleStitch: 35, centred: true, offsetFromCentre: 0 },
      { corner: 'bottom-right', middleStitch: 63, centred: true, offsetFromCentre: 0 },
      { corner: 'bottom-left', middleStitch: 99, centred: true, offsetFromCentre: 0 },
      { corner: 'top-left', middleStitch: 127, centred: true, offsetFromCentre: 0 },
    ]);
  });

  it('wide scallop (6 plus 1), per edge, 3-stitch corners: no whole scallop fits a corner, so none is counted there', () => {
    const sim = simulateRound({ top: 31, right: 25, bottom: 31, left: 25 }, { multiple: 6, mode: 'per-edge', lead: 1, centre: 2 });
    // Top: scallops centred at 4, 10, ..., 28; one begun at 32 would run into the right side's own first scallop.
    const top = sim.repeats.filter((r) => r.start <= 34);
    expect(top.map((r) => r.centre)).toEqual([4, 10, 16, 22, 28]);
    expect(sim.repeats).toHaveLength(18);
    expect(sim.between).toBe(sim.total - 18 * 6);
    // Centres at 28 and 38 are both 5 away from the corner's middle stitch 33: a tie, reported as after.
    expect(sim.corners[0]).toEqual({ corner: 'top-right', middleStitch: 33, centred: false, offsetFromCentre: 5 });
  });

  it('wide scallop (6 plus 1), per edge, 5-stitch corners: a scallop sits on every corner', () => {
    const sim = simulateRound({ top: 31, right: 25, bottom: 31, left: 25 }, { multiple: 6, mode: 'per-edge', lead: 1, centre: 2, cornerStitches: 5 });
    expect(sim.total).toBe(132);
    expect(sim.repeats).toHaveLength(22);
    expect(sim.between).toBe(0);
    expect(sim.corners.every((c) => c.centred)).toBe(true);
  });

  it('continuous: repeats follow one another all the way round and close', () => {
    const sim = simulateRound({ top: 31, right: 23, bottom: 31, left: 23 }, { multiple: 4, mode: 'continuous', lead: 1, centre: 1 });
    expect(sim.total).toBe(120);
    expect(sim.repeats).toHaveLength(30);
    // The round's last shell starts in the top-left corner and is centred on its middle stitch.
    expect(sim.repeats.at(-1)).toMatchObject({ start: 118, centre: 119, on: 'top-left' });
    expect(sim.corners[3]).toEqual({ corner: 'top-left', middleStitch: 119, centred: true, offsetFromCentre: 0 });
    // Top-right middle is stitch 33; shell centres are at 3, 7, ..., 31, 35: two stitches off, a tie, reported as after.
    expect(sim.corners[0]).toEqual({ corner: 'top-right', middleStitch: 33, centred: false, offsetFromCentre: 2 });
  });

  it('wraps a repeat that starts in the last corner around to the top edge', () => {
    const sim = simulateRound({ top: 2, right: 2, bottom: 2, left: 2 }, { multiple: 5, mode: 'continuous', lead: 3, centre: 4 });
    expect(sim.total).toBe(20);
    expect(sim.repeats.map((r) => r.start)).toEqual([4, 9, 14, 19]);
    expect(sim.repeats.at(-1)).toMatchObject({ start: 19, centre: 3, on: 'top-right' });
  });

  it('reports no repeat when an edge is too short for one', () => {
    const sim = simulateRound({ top: 1, right: 1, bottom: 1, left: 1 }, { multiple: 9, mode: 'per-edge', lead: 2, centre: 8 });
    expect(sim.repeats).toEqual([]);
    expect(sim.corners.every((c) => c.offsetFromCentre === null && !c.centred)).toBe(true);
  });

  it('rejects bad options', () => {
    const edges = { top: 5, right: 5, bottom: 5, left: 5 };
    expect(() => simulateRound(edges, { multiple: 4, mode: 'per-edge', lead: 1, centre: 4 })).toThrow(/centre/);
    expect(() => simulateRound(edges, { multiple: 0, mode: 'per-edge', lead: 1, centre: 0 })).toThrow(/multiple/);
    expect(() => simulateRound({ ...edges, left: 0 }, { multiple: 4, mode: 'per-edge', lead: 1, centre: 1 })).toThrow(/left/);
    expect(() => simulateRound(edges, { multiple: 4, mode: 'spiral' as never, lead: 1, centre: 1 })).toThrow(/mode/);
  });
});

describe('round properties', () => {
  const counts = fc.record({ top: fc.integer({ min: 1, max: 2000 }), right: fc.integer({ min: 1, max: 6000 }) });
  const n = fc.integer({ min: 2, max: 60 });
  const strategy = fc.constantFrom('add' as const, 'fewest' as const);

  it('continuous: total ≡ 0 (mod N), = edges + corners, and no edge is emptied', () => {
    fc.assert(
      fc.property(counts, n, strategy, ({ top, right }, multiple, s) => {
        const c = { top, right, bottom: top, left: right };
        const rf = fitRound(c, multiple, s);
        expect(rf.total % multiple).toBe(0);
        const fitted = Object.fromEntries(EDGE_ORDER.map((e) => [e, c[e] + rf.edgeChanges[e]])) as typeof c;
        expect(roundTotal(fitted)).toBe(rf.total);
        for (const e of EDGE_ORDER) expect(fitted[e]).toBeGreaterThanOrEqual(1);
        expect(Math.abs(rf.change)).toBeLessThan(multiple);
        // Shares differ by at most one stitch from edge to edge, unless a short edge had none to spare.
        fc.pre(EDGE_ORDER.every((e) => c[e] > multiple));
        const shares = EDGE_ORDER.map((e) => Math.abs(rf.edgeChanges[e]));
        expect(Math.max(...shares) - Math.min(...shares)).toBeLessThanOrEqual(1);
      }),
    );
  });

  it('per edge: round total = sum of fitted edges + 12, and each corner report matches a repeat centre', () => {
    fc.assert(
      fc.property(counts, n, fc.integer({ min: 0, max: 100 }), strategy, ({ top, right }, multiple, offset, s) => {
        const t = fitEdge(top, multiple, offset, s).fitted;
        const r = fitEdge(right, multiple, offset, s).fitted;
        const lead = Math.ceil(offset / 2);
        const centre = Math.floor((multiple - 1) / 2);
        const sim = simulateRound({ top: t, right: r, bottom: t, left: r }, { multiple, mode: 'per-edge', lead, centre });
        expect(sim.total).toBe(2 * t + 2 * r + 12);
        for (const c of sim.corners) {
          expect(c.centred).toBe(c.offsetFromCentre === 0);
          if (c.offsetFromCentre !== null) {
            const target = ((c.middleStitch - 1 + c.offsetFromCentre + sim.total) % sim.total) + 1;
            expect(sim.repeats.some((rep) => rep.centre === target)).toBe(true);
          }
        }
      }),
    );
  });

  it('continuous: repeats sit every N stitches all the way round and each corner is at most N/2 off', () => {
    fc.assert(
      fc.property(counts, n, strategy, fc.integer({ min: 0, max: 100 }), ({ top, right }, multiple, s, leadRaw) => {
        const c = { top, right, bottom: top, left: right };
        const rf = fitRound(c, multiple, s);
        const fitted = { top: top + rf.edgeChanges.top, right: right + rf.edgeChanges.right, bottom: top + rf.edgeChanges.bottom, left: right + rf.edgeChanges.left };
        const sim = simulateRound(fitted, { multiple, mode: 'continuous', lead: leadRaw, centre: multiple - 1 });
        expect(sim.repeats).toHaveLength(rf.total / multiple);
        const starts = sim.repeats.map((x) => x.start).sort((a, b) => a - b);
        for (let i = 1; i < starts.length; i++) expect(starts[i]! - starts[i - 1]!).toBe(multiple);
        for (const corner of sim.corners) expect(Math.abs(corner.offsetFromCentre!)).toBeLessThanOrEqual(multiple / 2);
      }),
    );
  });

  it('shell-like borders (multiple N plus 1, 3 corner stitches, N = 4) centre a repeat on every corner in per-edge mode', () => {
    fc.assert(
      fc.property(counts, strategy, ({ top, right }, s) => {
        const t = fitEdge(top, 4, 1, s).fitted;
        const r = fitEdge(right, 4, 1, s).fitted;
        const sim = simulateRound({ top: t, right: r, bottom: t, left: r }, { multiple: 4, mode: 'per-edge', lead: 1, centre: 1 });
        expect(sim.corners.every((c) => c.centred)).toBe(true);
        expect(sim.total % 4).toBe(0);
      }),
    );
  });
});
