/**
 * The assignment problem with capacities (a transportation problem with unit supplies): each row
 * (a blanket) goes to at most one column (a need), a column takes at most its capacity, and only
 * the listed (row, column) pairs are possible. The answer places as many rows as possible and,
 * among all answers that place that many, has the least total cost.
 *
 * Method: successive shortest augmenting paths with potentials — the Hungarian method in its
 * shortest-path form (Kuhn 1955; Jonker & Volgenant 1987), with a column of capacity q standing for
 * q identical slots so the search runs over needs, not over every slot. Every row can also go to
 * an "unplaced" column of unlimited room at a cost larger than any total of real costs, so one
 * minimum-cost answer maximises the number placed first, then minimises the cost.
 *
 * Costs must be whole numbers ≥ 0 so totals are exact and comparable with a reference solver.
 */

export interface MatchEdge {
  col: number;
  cost: number;
}

export interface MatchProblem {
  /** For each row, the columns it may go to and the cost of each. */
  rows: readonly (readonly MatchEdge[])[];
  /** How many rows each column takes at most. */
  capacities: readonly number[];
}

export interface MatchSolution {
  /** The column of each row, or -1 when it stays unplaced. */
  colOf: Int32Array;
  placed: number;
  /** Sum of the costs of the placed pairs. */
  cost: number;
}

function checkProblem(p: MatchProblem) {
  p.capacities.forEach((c, j) => {
    if (!Number.isInteger(c) || c < 0) throw new RangeError(`capacity of column ${j} must be a whole number ≥ 0, got ${c}`);
  });
  p.rows.forEach((edges, i) => {
    for (const e of edges) {
      if (!Number.isInteger(e.col) || e.col < 0 || e.col >= p.capacities.length) throw new RangeError(`row ${i}: no column ${e.col}`);
      if (!Number.isInteger(e.cost) || e.cost < 0) throw new RangeError(`row ${i}: cost must be a whole number ≥ 0, got ${e.cost}`);
    }
  });
}

export function solveMatching(problem: MatchProblem): MatchSolution {
  checkProblem(problem);
  const n = problem.rows.length;
  const m = problem.capacities.length;
  const DUMMY = m;
  const cols = m + 1;

  // Edges in flat arrays (compressed rows): far faster to walk than arrays of objects.
  const start = new Int32Array(n + 1);
  let maxCost = 0;
  for (let i = 0; i < n; i++) start[i + 1] = start[i]! + problem.rows[i]!.length;
  const edgeCol = new Int32Array(start[n]!);
  const edgeCost = new Float64Array(start[n]!);
  for (let i = 0, k = 0; i < n; i++) {
    for (const e of problem.rows[i]!) {
      edgeCol[k] = e.col;
      edgeCost[k] = e.cost;
      if (e.cost > maxCost) maxCost = e.cost;
      k++;
    }
  }
  // Leaving a row unplaced costs more than any set of real pairs could, so placing comes first.
  const UNPLACED = maxCost * Math.max(n, 1) + 1;
  if (!Number.isSafeInteger(UNPLACED * (n + 1))) throw new RangeError('costs too large to add up exactly');

  const capacity = new Float64Array(cols);
  for (let j = 0; j < m; j++) capacity[j] = problem.capacities[j]!;
  capacity[DUMMY] = Infinity;

  const u = new Float64Array(n); // row potentials
  const v = new Float64Array(cols); // column potentials
  const colOf = new Int32Array(n).fill(-1);
  // Rows held by each column, with each row's place in its column's list for O(1) removal.
  const members: number[][] = Array.from({ length: cols }, () => []);
  const slot = new Int32Array(n);

  const dist = new Float64Array(cols).fill(Infinity);
  const via = new Int32Array(cols).fill(-1);
  const done = new Uint8Array(cols);
  const touched: number[] = [];
  const finalised: number[] = [];

  const relax = (row: number, base: number) => {
    for (let k = start[row]!; k < start[row + 1]!; k++) {
      const j = edgeCol[k]!;
      if (done[j]) continue;
      const d = base + edgeCost[k]! - u[row]! - v[j]!;
      if (d < dist[j]!) {
        if (dist[j] === Infinity) touched.push(j);
        dist[j] = d;
        via[j] = row;
      }
    }
    if (!done[DUMMY]) {
      const d = base + UNPLACED - u[row]! - v[DUMMY]!;
      if (d < dist[DUMMY]!) {
        if (dist[DUMMY] === Infinity) touched.push(DUMMY);
        dist[DUMMY] = d;
        via[DUMMY] = row;
      }
    }
  };

  // Warm start (the row reduction of Jonker & Volgenant): each row's potential is its cheapest
  // cost, and a row whose cheapest column still has room takes it at once. Reduced costs stay ≥ 0
  // and placed pairs stay at 0, so the search below starts from a valid, mostly placed state.
  const waiting: number[] = [];
  for (let i = 0; i < n; i++) {
    let best = -1;
    let bestCost = UNPLACED;
    for (let k = start[i]!; k < start[i + 1]!; k++) {
      const j = edgeCol[k]!;
      const c = edgeCost[k]!;
      if (c < bestCost || (c === bestCost && best >= 0 && members[best]!.length >= capacity[best]! && members[j]!.length < capacity[j]!)) {
        bestCost = c;
        best = j;
      }
    }
    u[i] = bestCost;
    const j = best < 0 ? DUMMY : best;
    if (members[j]!.length < capacity[j]!) {
      slot[i] = members[j]!.length;
      members[j]!.push(i);
      colOf[i] = j;
    } else {
      waiting.push(i);
    }
  }

  for (const i0 of waiting) {
    relax(i0, 0);
    let end = -1;
    for (;;) {
      let best = -1;
      let bestD = Infinity;
      for (const j of touched) {
        if (!done[j] && dist[j]! < bestD) {
          bestD = dist[j]!;
          best = j;
        }
      }
      // The unplaced column is always reachable, so a best column always exists.
      if (members[best]!.length < capacity[best]!) {
        end = best;
        break;
      }
      done[best] = 1;
      finalised.push(best);
      for (const r of members[best]!) relax(r, bestD);
    }

    const D = dist[end]!;
    // Potentials: finalised columns and their rows move by how much nearer than the end they were.
    for (const j of finalised) {
      const shift = D - dist[j]!;
      v[j] = v[j]! - shift;
      for (const r of members[j]!) u[r] = u[r]! + shift;
    }
    u[i0] = u[i0]! + D;

    // Walk the path back from the end column, moving each row one column along.
    let j = end;
    for (;;) {
      const r = via[j]!;
      const from = colOf[r]!;
      if (from >= 0) {
        const list = members[from]!;
        const last = list.pop()!;
        if (last !== r) {
          list[slot[r]!] = last;
          slot[last] = slot[r]!;
        }
      }
      slot[r] = members[j]!.length;
      members[j]!.push(r);
      colOf[r] = j;
      if (r === i0) break;
      j = from;
    }

    for (const t of touched) {
      dist[t] = Infinity;
      via[t] = -1;
      done[t] = 0;
    }
    touched.length = 0;
    finalised.length = 0;
  }

  let placed = 0;
  let cost = 0;
  for (let i = 0; i < n; i++) {
    const j = colOf[i]!;
    if (j === DUMMY) {
      colOf[i] = -1;
      continue;
    }
    placed++;
    let c = Infinity;
    for (let k = start[i]!; k < start[i + 1]!; k++) if (edgeCol[k] === j && edgeCost[k]! < c) c = edgeCost[k]!;
    cost += c;
  }
  return { colOf, placed, cost };
}
