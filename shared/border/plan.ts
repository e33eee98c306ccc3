/**
 * planBorder: from a blanket's counts and a border's multiple to a foundation round the maker can
 * follow: each edge's change, where the changes go, the corners, and what the round looks like.
 */
import { fitEdge, type EdgeFit, type FitStrategy } from './fit';
import { ordinal } from './ordinal';
import { foundationCounts, CORNER_COUNT, CORNER_STITCHES, type BodyRows } from './row-ends';
import {
  fitRound,
  simulateRound,
  roundTotal,
  EDGE_ORDER,
  type CornerName,
  type CornerReport,
  type EdgeName,
  type RepeatPlacement,
  type RoundMode,
} from './round';
import { perStitch, spreadPositions } from './spacing';

export interface PlanBorderInput {
  /** Stitches across the top (= bottom) of the body. */
  across: number;
  /** Body rows: a count (one foundation stitch per row end) or a count with a row-type pattern. */
  rows: BodyRows;
  multiple: number;
  offset: number;
  strategy?: FitStrategy;
  mode?: RoundMode;
  /** Stitches before the first repeat on an edge; default ⌈offset / 2⌉ (the shell's "sc in first st"). */
  lead?: number;
  /**
   * In a continuous round the maker may begin the first repeat anywhere, so `lead` is only where
   * they would usually begin: the plan moves it when another start centres a repeat on more
   * corners. Set keepLead to begin exactly at `lead`.
   */
  keepLead?: boolean;
  /** 0-based centre stitch of the repeat; default ⌊(multiple − 1) / 2⌋ (the shell's 5-dc stitch). */
  centre?: number;
  /** The foundation round's stitch, for the wording only. */
  foundationStitch?: string;
  /**
   * Foundation stitches worked into each corner stitch; default CORNER_STITCHES (3). A border whose
   * repeat needs a wider corner to sit on it says so in the library (see BorderPattern.cornerStitches).
   */
  cornerStitches?: number;
}

export interface EdgePlan extends EdgeFit {
  /**
   * 1-based stitch numbers, counted from the corner where the edge is begun, that take an extra
   * stitch (change > 0) or are skipped (change < 0). A number repeats when one stitch takes
   * more than one extra stitch (see spreadPositions).
   */
  positions: number[];
  /** Bottom and left repeat the top's and the right's change; this names the edge copied. */
  sameAs?: EdgeName;
}

export interface BorderPlan {
  mode: RoundMode;
  strategy: FitStrategy;
  multiple: number;
  offset: number;
  lead: number;
  centre: number;
  edges: Record<EdgeName, EdgePlan>;
  corners: { perCorner: number; total: number };
  round: {
    /** Round stitches before any change (foundation edges + corners). */
    before: number;
    total: number;
    change: number;
    /** Repeats the simulation places around the round. */
    repeats: number;
    /** Stitches no repeat covers: total − repeats × multiple. */
    between: number;
    placements: RepeatPlacement[];
  };
  cornerReport: CornerReport[];
  sentences: Record<EdgeName, string>;
  /** Corner, round and counting notes, in reading order. */
  notes: string[];
}

const EDGE_LABEL: Record<EdgeName, string> = {
  top: 'Top edge',
  right: 'Right side',
  bottom: 'Bottom edge',
  left: 'Left side',
};

function list(words: string[]): string {
  if (words.length <= 1) return words.join('');
  return `${words.slice(0, -1).join(', ')} and ${words[words.length - 1]}`;
}

function plural(n: number, one: string, many: string): string {
  return `${n} ${n === 1 ? one : many}`;
}

/** The edge's instruction without its label, e.g. "work 2 hdc in the 7th and 15th stitch (...)". */
function edgeInstruction(
  edge: EdgeName,
  plan: EdgePlan,
  multiple: number,
  offset: number,
  mode: RoundMode,
  stitch: string,
): string {
  const side = edge === 'left' || edge === 'right';
  const groups = perStitch(plan.positions);
  const tail =
    plan.change > 0
      ? `(${plural(plan.change, 'extra stitch', 'extra stitches')}, ${plan.fitted} in all)`
      : `(${plural(-plan.change, 'fewer stitch', 'fewer stitches')}, ${plan.fitted} in all)`;

  if (plan.change === 0) {
    const fits =
      multiple === 1
        ? 'need no change'
        : mode === 'continuous'
          ? 'need no change for the round'
          : `already fit a multiple of ${multiple} plus ${offset}`;
    return side
      ? `the ${plan.count} stitches worked into the row ends ${fits}; work them as they are (${plan.fitted} in all)`
      : `the ${plan.count} stitches ${fits}; work 1 ${stitch} in each (${plan.fitted} in all)`;
  }
  if (plan.change < 0) {
    const where = list(groups.map((g) => ordinal(g.stitch)));
    return side
      ? `of the ${plan.count} stitches worked into the row ends, leave out the ${where} ${tail}`
      : `skip the ${where} stitch and work 1 ${stitch} in each other stitch ${tail}`;
  }
  // Group stitches by how many extra each takes, fewest first, so the usual case reads simply.
  const byTimes = new Map<number, number[]>();
  for (const g of groups) byTimes.set(g.times, [...(byTimes.get(g.times) ?? []), g.stitch]);
  const parts = [...byTimes.entries()]
    .sort((a, b) => a[0] - b[0])
    .map(([times, stitches]) => {
      const where = list(stitches.map(ordinal));
      return side
        ? `${times === 1 ? 'an extra' : `${times} extra`} ${stitch} into the same row end as the ${where}`
        : `${times + 1} ${stitch} in the ${where} stitch`;
    });
  return side
    ? `of the ${plan.count} stitches worked into the row ends, work ${list(parts)} ${tail}`
    : `work ${list(parts)} ${tail}`;
}

function cornerSummary(report: CornerReport[]): string {
  const centred = report.filter((c) => c.centred).map((c) => c.corner);
  if (centred.length === CORNER_COUNT) return 'A repeat is centred on every corner.';
  const off = report
    .filter((c) => !c.centred)
    .map((c) => {
      if (c.offsetFromCentre === null) return `${c.corner} (no repeat in the round)`;
      const d = c.offsetFromCentre;
      return `${c.corner} (nearest repeat centre ${plural(Math.abs(d), 'stitch', 'stitches')} ${d > 0 ? 'after' : 'before'} its middle stitch)`;
    });
  const head = centred.length === 0 ? 'No corner has a repeat centred on it' : `Centred on the ${list(centred as CornerName[])} corner${centred.length > 1 ? 's' : ''}`;
  return `${head}; not centred: ${list(off)}.`;
}

function checkWhole(name: string, value: number, min: number): void {
  if (!Number.isInteger(value) || value < min) {
    throw new RangeError(`${name} must be a whole number of at least ${min} (got ${value})`);
  }
}

export function planBorder(input: PlanBorderInput): BorderPlan {
  const { across, rows, multiple, offset } = input;
  const strategy: FitStrategy = input.strategy ?? 'add';
  const mode: RoundMode = input.mode ?? 'per-edge';
  const stitch = input.foundationStitch ?? 'hdc';
  checkWhole('multiple', multiple, 1);
  checkWhole('offset', offset, 0);
  const cornerStitches = input.cornerStitches ?? CORNER_STITCHES;
  checkWhole('cornerStitches', cornerStitches, 1);
  const lead = input.lead ?? Math.ceil(offset / 2);
  const centre = input.centre ?? Math.floor((multiple - 1) / 2);
  checkWhole('lead', lead, 0);
  if (!Number.isInteger(centre) || centre < 0 || centre >= multiple) {
    throw new RangeError(`centre must be a whole number from 0 to ${multiple - 1} (got ${centre})`);
  }
  const counts = foundationCounts(across, rows);

  const withPositions = (fit: EdgeFit, sameAs?: EdgeName): EdgePlan => ({
    ...fit,
    positions: spreadPositions(fit.count, Math.abs(fit.change)),
    ...(sameAs ? { sameAs } : {}),
  });

  let edges: Record<EdgeName, EdgePlan>;
  let change: number;
  const before = roundTotal(counts, cornerStitches);
  if (mode === 'per-edge') {
    // Opposite edges hold the same count, so fitting the top once and copying it to the bottom
    // is the same arithmetic and guarantees the maker gets the same instruction twice.
    const top = fitEdge(counts.top, multiple, offset, strategy);
    const right = fitEdge(counts.right, multiple, offset, strategy);
    edges = {
      top: withPositions(top),
      right: withPositions(right),
      bottom: withPositions({ ...top }, 'top'),
      left: withPositions({ ...right }, 'right'),
    };
    change = 2 * top.change + 2 * right.change;
  } else if (mode === 'continuous') {
    const rf = fitRound(counts, multiple, strategy, cornerStitches);
    change = rf.change;
    const edgeFit = (edge: EdgeName): EdgeFit => {
      const c = rf.edgeChanges[edge];
      // repeats is filled from the simulation below: in a closed round an edge holds whatever
      // part of the repeats falls on it, not a whole N·k + M.
      return { count: counts[edge], change: c, fitted: counts[edge] + c, repeats: 0 };
    };
    const top = edgeFit('top');
    const right = edgeFit('right');
    const bottom = edgeFit('bottom');
    const left = edgeFit('left');
    edges = {
      top: withPositions(top),
      right: withPositions(right),
      bottom: withPositions(bottom, bottom.change === top.change ? 'top' : undefined),
      left: withPositions(left, left.change === right.change ? 'right' : undefined),
    };
  } else {
    throw new RangeError(`mode must be 'per-edge' or 'continuous' (got ${String(mode)})`);
  }

  const fitted = { top: edges.top.fitted, right: edges.right.fitted, bottom: edges.bottom.fitted, left: edges.left.fitted };
  // In one continuous round the maker may begin the first repeat wherever they like: begin it where
  // the most corners get a centred repeat (the usual start wins a tie), unless told to keep it.
  const simulate = (l: number) => simulateRound(fitted, { multiple, mode, lead: l, centre, cornerStitches });
  const centredCorners = (r: ReturnType<typeof simulate>) => r.corners.filter((c) => c.centred).length;
  let leadUsed = lead;
  let sim = simulate(lead);
  if (mode === 'continuous' && !input.keepLead) {
    for (let l = 0; l < multiple; l++) {
      if (l === lead) continue;
      const candidate = simulate(l);
      if (centredCorners(candidate) > centredCorners(sim)) {
        sim = candidate;
        leadUsed = l;
      }
    }
  }
  if (mode === 'continuous') {
    for (const edge of EDGE_ORDER) edges[edge].repeats = sim.repeats.filter((r) => r.on === edge).length;
  }

  const sentences = {} as Record<EdgeName, string>;
  for (const edge of EDGE_ORDER) {
    const plan = edges[edge];
    const body = edgeInstruction(edge, plan, multiple, offset, mode, stitch);
    sentences[edge] = plan.sameAs
      ? `${EDGE_LABEL[edge]}: as the ${EDGE_LABEL[plan.sameAs].toLowerCase()}, ${body}.`
      : `${EDGE_LABEL[edge]}: ${body}.`;
  }

  const notes: string[] = [
    'Count the stitches of each edge from the corner where you begin working it.',
    `Corners: work ${cornerStitches} ${stitch} into each corner stitch (${CORNER_COUNT * cornerStitches} corner stitches in all).`,
    mode === 'per-edge'
      ? `Each edge holds a multiple of ${multiple} plus ${offset} between its corners; the round has ${sim.total} stitches: ${plural(sim.repeats.length, 'repeat', 'repeats')}` +
        (multiple === 1 || sim.between === 0
          ? '.'
          : ` of ${multiple} and ${plural(sim.between, 'stitch', 'stitches')} between them where no whole repeat fits (work those as the plain stitch between repeats).`)
      : `The whole round holds a multiple of ${multiple} (${sim.total} stitches, ${sim.repeats.length} repeats), so the last repeat closes onto the first.`,
    cornerSummary(sim.corners),
  ];
  if (leadUsed !== lead) {
    notes.push(
      `Begin the first repeat after ${leadUsed} ${leadUsed === 1 ? 'stitch' : 'stitches'} of the top edge rather than ${lead}: that centres a repeat on more corners.`,
    );
  }
  if (mode === 'continuous' && (!edges.bottom.sameAs || !edges.left.sameAs)) {
    notes.push("The change does not split evenly, so opposite edges end with different counts: follow each edge's own line.");
  }

  return {
    mode,
    strategy,
    multiple,
    offset,
    lead: leadUsed,
    centre,
    edges,
    corners: { perCorner: cornerStitches, total: CORNER_COUNT * cornerStitches },
    round: { before, total: sim.total, change, repeats: sim.repeats.length, between: sim.between, placements: sim.repeats },
    cornerReport: sim.corners,
    sentences,
    notes,
  };
}
