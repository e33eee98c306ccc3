/**
 * The border round as a whole: its corners, the two ways of fitting it, and a stitch-by-stitch
 * simulation showing where each repeat lands relative to the corners.
 *
 * Layout and numbering. The round is numbered from 1 at the first stitch of the top edge, just
 * after the top-left corner, and runs top → top-right corner → right → bottom-right corner →
 * bottom → bottom-left corner → left → top-left corner. A maker working the other way round sees
 * the mirror image; opposite edges hold equal counts, so only the corner names swap.
 */
import { fitEdge, type EdgeFit, type FitStrategy } from './fit';
import { CORNER_COUNT, CORNER_STITCHES, type FoundationCounts } from './row-ends';

export type EdgeName = 'top' | 'right' | 'bottom' | 'left';
export type CornerName = 'top-right' | 'bottom-right' | 'bottom-left' | 'top-left';
export type RoundMode = 'per-edge' | 'continuous';

export const EDGE_ORDER: readonly EdgeName[] = ['top', 'right', 'bottom', 'left'];
export const ROUND_MODES: readonly RoundMode[] = ['per-edge', 'continuous'];
/** The corner reached at the end of each edge, in working order. */
export const CORNER_AFTER: Readonly<Record<EdgeName, CornerName>> = {
  top: 'top-right',
  right: 'bottom-right',
  bottom: 'bottom-left',
  left: 'top-left',
};

export type EdgeCounts = Readonly<Record<EdgeName, number>>;

/** Every stitch of the round: the four edges plus the corner stitches. */
export function roundTotal(edges: EdgeCounts, cornerStitches: number = CORNER_STITCHES): number {
  return edges.top + edges.right + edges.bottom + edges.left + CORNER_COUNT * cornerStitches;
}

export interface RoundFit {
  /** Round total before fitting (edges + corners). */
  before: number;
  /** Round total after fitting: a whole number of repeats. */
  total: number;
  change: number;
  /** The change shared out over the edges. */
  edgeChanges: Record<EdgeName, number>;
}

/** Order in which a round's change is handed out: top and bottom first, so an even share keeps them alike. */
export const SHARE_ORDER: readonly EdgeName[] = ['top', 'bottom', 'right', 'left'];

/**
 * Share a round's change over its edges one stitch at a time in SHARE_ORDER: an equal part each,
 * and the remainder to top, bottom, right in that order. A remainder of 2 keeps top and bottom
 * alike; an odd remainder cannot keep every pair alike, and the plan says so. When skipping, an
 * edge keeps at least one stitch; returns undefined when the edges cannot spare enough.
 */
export function shareRoundChange(change: number, counts: EdgeCounts): Record<EdgeName, number> | undefined {
  const shares: Record<EdgeName, number> = { top: 0, right: 0, bottom: 0, left: 0 };
  const step = change < 0 ? -1 : 1;
  let remaining = Math.abs(change);
  while (remaining > 0) {
    let moved = false;
    for (const edge of SHARE_ORDER) {
      if (remaining === 0) break;
      if (step < 0 && counts[edge] + shares[edge] <= 1) continue;
      shares[edge] += step;
      remaining -= 1;
      moved = true;
    }
    if (!moved) return undefined;
  }
  return shares;
}

/**
 * Continuous mode: a closed round has no ends to balance, so the "+M" of the border does not
 * apply; the whole round only has to be a whole number of repeats (≡ 0 mod N). If 'fewest'
 * would skip more stitches than the edges hold, it adds instead.
 */
export function fitRound(
  counts: FoundationCounts,
  multiple: number,
  strategy: FitStrategy,
  cornerStitches: number = CORNER_STITCHES,
): RoundFit {
  const before = roundTotal(counts, cornerStitches);
  let fit: EdgeFit = fitEdge(before, multiple, 0, strategy);
  let shares = shareRoundChange(fit.change, counts);
  if (!shares) {
    fit = fitEdge(before, multiple, 0, 'add');
    shares = shareRoundChange(fit.change, counts)!;
  }
  return { before, total: fit.fitted, change: fit.change, edgeChanges: shares };
}

export interface RepeatPlacement {
  /** 1-based order in which the maker works the repeat. */
  number: number;
  /** Round stitch number where the repeat begins. */
  start: number;
  /** Round stitch number holding the repeat's centre (the 5-dc stitch of a shell). */
  centre: number;
  /** The edge or corner that holds the centre stitch. */
  on: EdgeName | CornerName;
}

export interface CornerReport {
  corner: CornerName;
  /** Round stitch number of the corner's middle stitch. */
  middleStitch: number;
  /** A repeat's centre falls exactly on the corner's middle stitch. */
  centred: boolean;
  /**
   * Distance in stitches from the corner's middle stitch to the nearest repeat centre: positive
   * = after it in working order, negative = before it; a tie is reported as after. null when
   * the round holds no repeat at all.
   */
  offsetFromCentre: number | null;
}

export interface SimulationOptions {
  multiple: number;
  mode: RoundMode;
  /**
   * Stitches worked before the first repeat of an edge (the "sc in first st" of a shell border);
   * in continuous mode only before the first repeat of the round.
   */
  lead: number;
  /** 0-based position inside the repeat of its centre stitch. */
  centre: number;
  cornerStitches?: number;
}

export interface RoundSimulation {
  total: number;
  /** Stitches of the round that no repeat covers (corner stitches and edge ends between repeats). */
  between: number;
  repeats: RepeatPlacement[];
  corners: CornerReport[];
}

interface Segment {
  name: EdgeName | CornerName;
  first: number;
  last: number;
}

function segments(edges: EdgeCounts, cornerStitches: number): Segment[] {
  const out: Segment[] = [];
  let next = 1;
  for (const edge of EDGE_ORDER) {
    out.push({ name: edge, first: next, last: next + edges[edge] - 1 });
    next += edges[edge];
    out.push({ name: CORNER_AFTER[edge], first: next, last: next + cornerStitches - 1 });
    next += cornerStitches;
  }
  return out;
}

/**
 * Walk the round. Per-edge: the pattern starts afresh on each edge (lead stitches, then repeats
 * every N stitches) and keeps going into the following corner for as long as a whole repeat still
 * fits before the next edge's first repeat; that is how the 3 corner stitches of a shell border
 * (with the next edge's first sc) become one more shell. Corner stitches that no whole repeat
 * covers stay between the repeats. Continuous: the repeats simply follow one another all the way
 * round from the lead.
 */
export function simulateRound(edges: EdgeCounts, options: SimulationOptions): RoundSimulation {
  const { multiple: n, mode, lead, centre } = options;
  const cornerStitches = options.cornerStitches ?? CORNER_STITCHES;
  if (!Number.isInteger(n) || n < 1) throw new RangeError(`multiple must be a whole number of at least 1 (got ${n})`);
  if (!Number.isInteger(lead) || lead < 0) throw new RangeError(`lead must be a whole number of at least 0 (got ${lead})`);
  if (!Number.isInteger(centre) || centre < 0 || centre >= n) {
    throw new RangeError(`centre must be a whole number from 0 to ${n - 1} (got ${centre})`);
  }
  if (!Number.isInteger(cornerStitches) || cornerStitches < 1) {
    throw new RangeError(`cornerStitches must be a whole number of at least 1 (got ${cornerStitches})`);
  }
  for (const edge of EDGE_ORDER) {
    if (!Number.isInteger(edges[edge]) || edges[edge] < 1) {
      throw new RangeError(`${edge} must hold at least 1 stitch (got ${edges[edge]})`);
    }
  }
  const segs = segments(edges, cornerStitches);
  const total = roundTotal(edges, cornerStitches);
  const wrap = (stitch: number): number => ((((stitch - 1) % total) + total) % total) + 1;
  const holder = (stitch: number): EdgeName | CornerName => segs.find((s) => stitch >= s.first && stitch <= s.last)!.name;

  const starts: number[] = [];
  if (mode === 'per-edge') {
    for (const edge of EDGE_ORDER) {
      const seg = segs.find((s) => s.name === edge)!;
      // A repeat may run on into the corner only while it ends before the next edge's own first
      // repeat, which begins `lead` stitches into that edge: otherwise the two would share stitches
      // and the round would hold more repeats than it has room for.
      const room = edges[edge] + cornerStitches + lead;
      for (let offset = lead; offset + n <= room; offset += n) starts.push(seg.first + offset);
    }
  } else if (mode === 'continuous') {
    const count = Math.floor(total / n);
    for (let j = 0; j < count; j++) starts.push(wrap(1 + lead + j * n));
  } else {
    throw new RangeError(`mode must be 'per-edge' or 'continuous' (got ${String(mode)})`);
  }

  const repeats: RepeatPlacement[] = starts.map((start, i) => {
    const c = wrap(start + centre);
    return { number: i + 1, start: wrap(start), centre: c, on: holder(c) };
  });

  const corners: CornerReport[] = EDGE_ORDER.map((edge) => {
    const seg = segs.find((s) => s.name === CORNER_AFTER[edge])!;
    const middle = seg.first + Math.floor((cornerStitches - 1) / 2);
    let best: number | null = null;
    for (const r of repeats) {
      let d = (((r.centre - middle) % total) + total) % total;
      if (d > total / 2) d -= total;
      if (best === null || Math.abs(d) < Math.abs(best) || (Math.abs(d) === Math.abs(best) && d > best)) best = d;
    }
    return { corner: seg.name as CornerName, middleStitch: middle, centred: best === 0, offsetFromCentre: best };
  });

  return { total, between: total - repeats.length * n, repeats, corners };
}
