import type { BorderPlan } from '@shared/border/plan';
import type { BorderPattern } from '@shared/border/library';
import { CORNER_AFTER, EDGE_ORDER, type CornerName, type EdgeName } from '@shared/border/round';
import { perStitch } from '@shared/border/spacing';

/*
 * Layout of the blanket drawing, kept apart from the SVG so it can be reasoned about on its own.
 * Stitches are numbered as the plan numbers them: each edge from the corner where it is begun,
 * going round clockwise on the page (top left→right, right side top→bottom, and so on).
 */

export interface Pt {
  x: number;
  y: number;
}

export interface FoundationMark extends Pt {
  edge: EdgeName;
  stitch: number;
  /** Extra stitches worked at this stitch (add) or 1 (skip). */
  times: number;
  kind: 'add' | 'skip';
}

export interface RepeatShape extends Pt {
  number: number;
  /** Outward direction, radians in screen coordinates (y down). */
  angle: number;
  /** Half the repeat's width along the edge, in drawing units. */
  size: number;
  on: EdgeName | CornerName;
}

export interface CornerMark extends Pt {
  corner: CornerName;
  centred: boolean;
  offset: number | null;
  angle: number;
}

export interface Drawing {
  width: number;
  height: number;
  body: { x: number; y: number; w: number; h: number };
  /** The foundation round's line, just outside the body. */
  foundation: { x: number; y: number; w: number; h: number };
  marks: FoundationMark[];
  repeats: RepeatShape[];
  corners: CornerMark[];
  /** True when the proportions were squeezed so a very long, thin blanket stays readable. */
  squeezed: boolean;
  rowLines: number[];
}

/** Room outside the body for the border repeats and the corner marks. */
export const MARGIN = 52;
/** How far out along the diagonal a corner's mark sits, from the foundation line's corner. */
export const CORNER_MARK_DISTANCE = 38;
const FOUNDATION_GAP = 7;
const MAX_RATIO = 5;
const MAX_ROW_LINES = 120;
const MAX_BODY_HEIGHT = 620;
const MIN_WIDTH = 260;

const EDGE_ANGLE: Record<EdgeName, number> = { top: -Math.PI / 2, right: 0, bottom: Math.PI / 2, left: Math.PI };

/**
 * `width` is the space the drawing gets on screen, in CSS pixels: laying it out at that size keeps
 * one drawing unit about one pixel, so marks and labels stay readable on a phone as on a desktop.
 */
export function layoutDrawing(plan: BorderPlan, border: BorderPattern, bodyWidth: number, bodyHeight: number, rows: number, width = 640): Drawing {
  let ratio = bodyWidth / bodyHeight;
  const squeezed = ratio > MAX_RATIO || ratio < 1 / MAX_RATIO;
  ratio = Math.min(MAX_RATIO, Math.max(1 / MAX_RATIO, ratio));
  const inner = Math.max(MIN_WIDTH, width) - 2 * MARGIN;
  let w = inner;
  let h = inner / ratio;
  if (h > MAX_BODY_HEIGHT) {
    h = MAX_BODY_HEIGHT;
    w = h * ratio;
  }
  const body = { x: MARGIN, y: MARGIN, w, h };
  const g = FOUNDATION_GAP;
  const f = { x: body.x - g, y: body.y - g, w: w + 2 * g, h: h + 2 * g };

  // Start and end of each edge on the foundation line, in working order.
  const ends: Record<EdgeName, [Pt, Pt]> = {
    top: [{ x: f.x, y: f.y }, { x: f.x + f.w, y: f.y }],
    right: [{ x: f.x + f.w, y: f.y }, { x: f.x + f.w, y: f.y + f.h }],
    bottom: [{ x: f.x + f.w, y: f.y + f.h }, { x: f.x, y: f.y + f.h }],
    left: [{ x: f.x, y: f.y + f.h }, { x: f.x, y: f.y }],
  };
  const along = (edge: EdgeName, fraction: number): Pt => {
    const [a, b] = ends[edge];
    return { x: a.x + (b.x - a.x) * fraction, y: a.y + (b.y - a.y) * fraction };
  };
  const length = (edge: EdgeName) => (edge === 'top' || edge === 'bottom' ? f.w : f.h);

  const marks: FoundationMark[] = [];
  for (const edge of EDGE_ORDER) {
    const e = plan.edges[edge];
    if (e.change === 0) continue;
    for (const { stitch, times } of perStitch(e.positions)) {
      const p = along(edge, (stitch - 0.5) / e.count);
      marks.push({ ...p, edge, stitch, times, kind: e.change > 0 ? 'add' : 'skip' });
    }
  }

  // Where every stitch of the fitted round sits, so each repeat can be drawn at its centre stitch.
  const segs: Array<{ name: EdgeName | CornerName; first: number; count: number; edge?: EdgeName; corner?: CornerName; after?: EdgeName }> = [];
  let next = 1;
  for (const edge of EDGE_ORDER) {
    segs.push({ name: edge, first: next, count: plan.edges[edge].fitted, edge });
    next += plan.edges[edge].fitted;
    segs.push({ name: CORNER_AFTER[edge], first: next, count: plan.corners.perCorner, corner: CORNER_AFTER[edge], after: edge });
    next += plan.corners.perCorner;
  }
  const spacing = (edge: EdgeName) => length(edge) / plan.edges[edge].fitted;
  const nextEdge = (edge: EdgeName) => EDGE_ORDER[(EDGE_ORDER.indexOf(edge) + 1) % EDGE_ORDER.length]!;
  const place = (stitch: number): { p: Pt; angle: number; gap: number } => {
    const seg = segs.find((s) => stitch >= s.first && stitch < s.first + s.count)!;
    const i = stitch - seg.first;
    if (seg.edge) return { p: along(seg.edge, (i + 0.5) / seg.count), angle: EDGE_ANGLE[seg.edge], gap: spacing(seg.edge) };
    const before = seg.after!;
    const after = nextEdge(before);
    // Corner stitches fan round the corner: the middle one points straight out along the diagonal.
    const a0 = EDGE_ANGLE[before];
    const angle = a0 + ((i + 0.5) / seg.count) * (Math.PI / 2);
    return { p: ends[before][1], angle, gap: (spacing(before) + spacing(after)) / 2 };
  };

  const repeats: RepeatShape[] = [];
  if (border.multiple > 1) {
    for (const r of plan.round.placements) {
      const { p, angle, gap } = place(r.centre);
      // A little under half the repeat's width, so the stitch between two repeats shows as a gap.
      const size = Math.max(4, Math.min(28, border.multiple * gap * 0.45));
      repeats.push({ ...p, number: r.number, angle, size, on: r.on });
    }
  }

  const corners: CornerMark[] = plan.cornerReport.map((c) => {
    const edge = EDGE_ORDER.find((e) => CORNER_AFTER[e] === c.corner)!;
    const p = ends[edge][1];
    return { ...p, corner: c.corner, centred: c.centred, offset: c.offsetFromCentre, angle: EDGE_ANGLE[edge] + Math.PI / 4 };
  });

  const step = Math.max(1, Math.ceil(rows / MAX_ROW_LINES));
  const rowLines: number[] = [];
  for (let r = step; r < rows; r += step) rowLines.push(body.y + (r / rows) * h);

  return { width: w + 2 * MARGIN, height: h + 2 * MARGIN, body, foundation: f, marks, repeats, corners, squeezed, rowLines };
}

/** Typical row height in stitch widths, for drawing only when no gauge is given (from memory). */
export const TYPICAL_ROW_HEIGHT: Record<string, number> = { sc: 0.9, hdc: 1.3, dc: 1.8, tr: 2.4, dtr: 3 };

/** A half-disc standing on `p`, bulging outwards: the outline of a shell or scallop. */
export function fanPath(s: RepeatShape, depth = 1): string {
  const tx = Math.cos(s.angle + Math.PI / 2);
  const ty = Math.sin(s.angle + Math.PI / 2);
  const r = s.size;
  const a = { x: s.x - r * tx, y: s.y - r * ty };
  const b = { x: s.x + r * tx, y: s.y + r * ty };
  const ry = r * depth;
  const rot = (s.angle * 180) / Math.PI + 90;
  return `M${f2(a.x)} ${f2(a.y)} A${f2(r)} ${f2(ry)} ${f2(rot)} 0 1 ${f2(b.x)} ${f2(b.y)} Z`;
}

/** Lines from the base of a fan out to its rim, one per stitch of the shell. */
export function fanSpokes(s: RepeatShape, count: number, depth = 1): Array<[Pt, Pt]> {
  const out: Array<[Pt, Pt]> = [];
  for (let i = 0; i < count; i++) {
    const t = count === 1 ? 0 : i / (count - 1) - 0.5;
    const a = s.angle + t * Math.PI * 0.8;
    // Point on the (possibly flattened) half-ellipse in the fan's own frame.
    const u = Math.cos(a - s.angle);
    const v = Math.sin(a - s.angle);
    const k = 0.85 / Math.sqrt((u * u) / (depth * depth) + v * v);
    const along = u * k * s.size;
    const side = v * k * s.size;
    const ox = Math.cos(s.angle);
    const oy = Math.sin(s.angle);
    out.push([
      { x: s.x, y: s.y },
      { x: s.x + along * ox - side * oy, y: s.y + along * oy + side * ox },
    ]);
  }
  return out;
}

export function outward(p: Pt, angle: number, distance: number): Pt {
  return { x: p.x + Math.cos(angle) * distance, y: p.y + Math.sin(angle) * distance };
}

export const f2 = (n: number) => String(Math.round(n * 100) / 100);
