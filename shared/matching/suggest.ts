import type { Suggestion } from '../schemas/assignment';
import { sizeCategoryRow } from '../guidelines/size-categories';
import { feasibility, pairCost, type MatchBlanket, type MatchNeed, type PairCost } from './cost';
import { solveMatching, type MatchEdge } from './solve';

/**
 * The suggestion for a set of waiting blankets and open needs: every pair the guidelines allow is
 * weighed (cost.ts), the solver places as many blankets as the open slots allow at the least total
 * cost (solve.ts), and the answer says why each pair was chosen, which needs stay short and why
 * each left-over blanket was left over. Nothing is written: the organiser reviews and accepts.
 */
export function suggestAssignments(blankets: readonly MatchBlanket[], needs: readonly MatchNeed[], today: Date): Suggestion {
  const open = needs.filter((n) => n.open > 0);
  // One guideline check per (blanket, recipient): a recipient's needs share its guidelines.
  const fitsByRecipient = new Map<number, MatchNeed['guidelines']>();
  const nameOf = new Map<number, string>();
  for (const n of open) {
    fitsByRecipient.set(n.recipientId, n.guidelines);
    nameOf.set(n.recipientId, n.recipientName);
  }

  const costs: Array<Map<number, PairCost>> = [];
  const rows: MatchEdge[][] = [];
  const refusals: string[][] = [];
  for (const b of blankets) {
    const okFor = new Map<number, boolean>();
    // For a blanket nobody takes, the recipient it misses by the fewest rules is the useful example.
    let why: string[] = [];
    for (const [rid, g] of fitsByRecipient) {
      const f = feasibility(b, g);
      okFor.set(rid, f.ok);
      if (!f.ok && (why.length === 0 || f.reasons.length < why.length - 1)) why = [nameOf.get(rid)!, ...f.reasons];
    }
    const mine = new Map<number, PairCost>();
    const edges: MatchEdge[] = [];
    open.forEach((n, col) => {
      if (!okFor.get(n.recipientId)) return;
      const c = pairCost(b, n, today, false);
      mine.set(col, c);
      edges.push({ col, cost: c.cost });
    });
    costs.push(mine);
    rows.push(edges);
    refusals.push(why);
  }

  const solution = solveMatching({ rows, capacities: open.map((n) => n.open) });
  const filled = new Array<number>(open.length).fill(0);
  const out: Suggestion = { pairs: [], unplaced: [], short: [], totalCost: solution.cost };
  blankets.forEach((b, i) => {
    const col = solution.colOf[i]!;
    if (col >= 0) {
      const n = open[col]!;
      const c = pairCost(b, n, today);
      filled[col]! += 1;
      out.pairs.push({
        blanketId: b.id,
        blanketCode: b.code,
        needId: n.id,
        recipientId: n.recipientId,
        recipientName: n.recipientName,
        sizeCategory: n.sizeCategory,
        cost: c.cost,
        reasons: c.reasons,
      });
      return;
    }
    const fitting = [...costs[i]!.keys()].map((k) => open[k]!);
    const reason =
      fitting.length === 0
        ? `No open need takes it as it is${refusals[i]!.length > 1 ? `. Nearest, ${refusals[i]![0]}: ${refusals[i]!.slice(1).join(' ')}` : ''}`
        : `Every need it fits is filled by other blankets: ${fitting
            .slice(0, 3)
            .map((n) => `${n.recipientName} (${sizeCategoryRow(n.sizeCategory).label})`)
            .join('; ')}`;
    out.unplaced.push({ blanketId: b.id, blanketCode: b.code, reason });
  });
  open.forEach((n, col) => {
    const missing = n.open - filled[col]!;
    if (missing > 0) out.short.push({ needId: n.id, recipientName: n.recipientName, sizeCategory: n.sizeCategory, missing });
  });
  return out;
}
