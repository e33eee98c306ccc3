import { borderById, borderDepthCm, borderPlanOptions } from '@shared/border/library';
import { planBorder } from '@shared/border/plan';
import { rowCount } from '@shared/border/row-ends';
import { EDGE_ORDER } from '@shared/border/round';
import { finishedSizeFromCounts } from '@shared/sizing/gauge';
import { fromCm } from '@shared/sizing/units';
import { estimateYarn } from '@shared/sizing/yarn-estimate';
import type { PlanInput, PlanSummary } from '@shared/schemas/plan';

const signed = (n: number) => (n > 0 ? `+${n}` : n < 0 ? `−${-n}` : 'no change');
const round1 = (n: number) => Math.round(n * 10) / 10;

/**
 * The figures a list or a blanket page shows for a saved plan, worked out from the input with the
 * same shared engines the planner screen uses; the client's own summary is never trusted.
 */
export function summarisePlan(input: PlanInput): PlanSummary {
  const border = borderById(input.borderId);
  // The schema only lets library ids through; a missing one means the library lost an entry.
  if (!border) throw new Error(`border ${input.borderId} is not in the library`);
  const plan = planBorder({
    across: input.across,
    rows: input.rows,
    ...borderPlanOptions(border, input.mode),
    strategy: input.strategy,
    mode: input.mode,
  });
  const edges = Object.fromEntries(
    EDGE_ORDER.map((e) => [e, { count: plan.edges[e].count, change: plan.edges[e].change, fitted: plan.edges[e].fitted }]),
  ) as PlanSummary['edges'];

  let finished: PlanSummary['finished'] = null;
  let yarn: PlanSummary['yarn'] = null;
  if (input.gauge) {
    const unit = input.gauge.unit;
    const depth = input.borderDepth ?? fromCm(borderDepthCm(border), unit);
    const size = finishedSizeFromCounts({ gauge: input.gauge, stitches: input.across, rows: rowCount(input.rows), borderDepth: depth, unit });
    finished = { width: round1(size.finished.width), length: round1(size.finished.length), unit };
    if (input.yarn) {
      const est = estimateYarn({
        body: size.body,
        yarnWeight: input.yarn.weight,
        border: { depth, yarnFactor: border.yarnFactor },
        margin: input.yarn.margin,
        skein: input.yarn.skein,
      });
      yarn = { metres: est.totalMetres, yards: est.totalYards, skeins: est.skeins ?? null };
    }
  }

  const t = edges.top.change;
  const s = edges.right.change;
  const sameOpposite = edges.bottom.change === t && edges.left.change === s;
  const changes =
    border.multiple === 1
      ? 'no fitting needed'
      : sameOpposite
        ? `top and bottom ${signed(t)}, sides ${signed(s)}`
        : EDGE_ORDER.map((e) => `${e} ${signed(edges[e].change)}`).join(', ');
  return {
    borderId: border.id,
    borderName: border.name,
    multiple: border.multiple,
    offset: border.offset,
    strategy: plan.strategy,
    mode: plan.mode,
    across: input.across,
    rows: rowCount(input.rows),
    rowPattern: typeof input.rows === 'number' ? null : [...input.rows.pattern],
    edges,
    roundTotal: plan.round.total,
    repeats: plan.round.repeats,
    cornersCentred: plan.cornerReport.filter((c) => c.centred).map((c) => c.corner),
    finished,
    yarn,
    text: `${border.name} · ${input.across} × ${rowCount(input.rows)} rows · ${changes}`,
  };
}
