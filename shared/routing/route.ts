import { haversineKm, type LatLng } from './distance';

/**
 * A short round trip from a start (the depot) through every stop and back: nearest neighbour to
 * build a tour, then 2-opt to remove crossings. Both are the textbook heuristics for the travelling
 * salesman problem (e.g. Johnson & McGeoch, "The Traveling Salesman Problem: A Case Study in Local
 * Optimization", 1997); neither promises the optimum, and a run has a handful of stops, so the
 * suggestion is a starting point the coordinator may reorder by hand.
 */

export interface RoutePlan {
  /** Indices into the stops given, in the order to drive them. */
  order: number[];
  /** Leg lengths in km: start → first stop, …, last stop → start. */
  legsKm: number[];
  totalKm: number;
}

/** Distance matrix with the start at index 0 and stop i at index i + 1. */
function matrix(start: LatLng, stops: readonly LatLng[]): number[][] {
  const pts = [start, ...stops];
  return pts.map((a) => pts.map((b) => haversineKm(a, b)));
}

/** Legs and total of a round trip through `order` (stop indices), from and back to the start. */
export function tourOf(start: LatLng, stops: readonly LatLng[], order: readonly number[]): RoutePlan {
  const d = matrix(start, stops);
  return tourFromMatrix(d, order);
}

function tourFromMatrix(d: number[][], order: readonly number[]): RoutePlan {
  const path = [0, ...order.map((i) => i + 1), 0];
  const legsKm = path.slice(1).map((p, k) => d[path[k]!]![p]!);
  return { order: [...order], legsKm, totalKm: legsKm.reduce((s, x) => s + x, 0) };
}

/** Nearest neighbour from the start: always drive to the closest stop not yet visited. Ties keep the given order. */
export function nearestNeighbour(d: number[][]): number[] {
  const n = d.length - 1;
  const left = new Set(Array.from({ length: n }, (_, i) => i + 1));
  const tour: number[] = [];
  let at = 0;
  while (left.size > 0) {
    let best = -1;
    for (const j of left) if (best === -1 || d[at]![j]! < d[at]![best]!) best = j;
    tour.push(best);
    left.delete(best);
    at = best;
  }
  return tour.map((p) => p - 1);
}

/**
 * 2-opt on a closed tour with the start fixed in front: reverse any stretch whose reversal shortens
 * the trip, until no reversal does. Improvements smaller than a millimetre are ignored so rounding
 * cannot make it loop.
 */
export function twoOpt(d: number[][], order: readonly number[]): number[] {
  const path = [0, ...order.map((i) => i + 1), 0];
  const EPS = 1e-9;
  let improved = true;
  while (improved) {
    improved = false;
    for (let i = 1; i < path.length - 2; i++) {
      for (let k = i + 1; k < path.length - 1; k++) {
        const a = path[i - 1]!, b = path[i]!, c = path[k]!, e = path[k + 1]!;
        const delta = d[a]![c]! + d[b]![e]! - d[a]![b]! - d[c]![e]!;
        if (delta < -EPS) {
          path.splice(i, k - i + 1, ...path.slice(i, k + 1).reverse());
          improved = true;
        }
      }
    }
  }
  return path.slice(1, -1).map((p) => p - 1);
}

/** The suggested order: nearest neighbour, improved by 2-opt. */
export function suggestRoute(start: LatLng, stops: readonly LatLng[]): RoutePlan {
  const d = matrix(start, stops);
  if (stops.length === 0) return { order: [], legsKm: [], totalKm: 0 };
  return tourFromMatrix(d, twoOpt(d, nearestNeighbour(d)));
}

/** The nearest-neighbour tour alone, for comparison. */
export function nearestNeighbourRoute(start: LatLng, stops: readonly LatLng[]): RoutePlan {
  const d = matrix(start, stops);
  return tourFromMatrix(d, nearestNeighbour(d));
}
