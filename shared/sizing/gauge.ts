/**
 * Gauge arithmetic: from a swatch and a target finished size to the counts a maker starts with,
 * and back. The border is part of the finished size, so the body is the target less two border
 * depths in each direction.
 */
import { nearestFit } from '../border/fit';
import { startingChain, type StartingChain } from './turning-chains';
import { fromCm, toCm, type LengthUnit } from './units';

export type BodyStitch = 'sc' | 'hdc' | 'dc' | 'tr' | 'dtr';
export const BODY_STITCHES_FOR_CHAIN: readonly BodyStitch[] = ['sc', 'hdc', 'dc', 'tr', 'dtr'];

/** A swatch measurement: e.g. 14 stitches and 10 rows over 10 cm, or 16 and 12 over 4 in. */
export interface Gauge {
  stitches: number;
  rows: number;
  over: number;
  unit: LengthUnit;
}

export interface Size {
  width: number;
  length: number;
  unit: LengthUnit;
}

function positive(name: string, value: number): void {
  if (!Number.isFinite(value) || value <= 0) throw new RangeError(`${name} must be a number above 0 (got ${value})`);
}

/**
 * Per-centimetre rates. "Per 4 in" is converted at 10.16 cm, not treated as 10 cm: the two are
 * printed side by side on labels but differ by 1.6 %, which is a few centimetres on a throw.
 */
export function gaugePerCm(gauge: Gauge): { stitchesPerCm: number; rowsPerCm: number } {
  positive('gauge.stitches', gauge.stitches);
  positive('gauge.rows', gauge.rows);
  positive('gauge.over', gauge.over);
  const overCm = toCm(gauge.over, gauge.unit);
  return { stitchesPerCm: gauge.stitches / overCm, rowsPerCm: gauge.rows / overCm };
}

export interface BodyCountsInput {
  gauge: Gauge;
  /** Finished size, border included. */
  target: Size;
  /** Depth of the whole border (foundation round included) on one side, in target.unit. */
  borderDepth: number;
  /** The body's stitch, for its turning chain. */
  bodyStitch: BodyStitch;
  /** The body pattern's own "multiple of N plus M" for stitches across (default 1 plus 0). */
  stitchMultiple?: number;
  stitchOffset?: number;
  /** Rows per pattern repeat (e.g. 2 for alternating sc/dc rows) plus offset. */
  rowMultiple?: number;
  rowOffset?: number;
}

export interface BodyCounts {
  /** Stitches in each body row, fitted to the stitch pattern's multiple. */
  stitches: number;
  rows: number;
  startingChain: StartingChain;
  /** Unrounded counts the gauge gives, to show how far rounding moved them. */
  exact: { stitches: number; rows: number };
  /** Sizes the rounded counts actually give, in target.unit. */
  body: Size;
  finished: Size;
}

export function bodyCountsFromGauge(input: BodyCountsInput): BodyCounts {
  const { gauge, target, borderDepth, bodyStitch } = input;
  const stitchMultiple = input.stitchMultiple ?? 1;
  const stitchOffset = input.stitchOffset ?? 0;
  const rowMultiple = input.rowMultiple ?? 1;
  const rowOffset = input.rowOffset ?? 0;
  positive('target.width', target.width);
  positive('target.length', target.length);
  if (!Number.isFinite(borderDepth) || borderDepth < 0) {
    throw new RangeError(`borderDepth must be 0 or more (got ${borderDepth})`);
  }
  const bodyWidthCm = toCm(target.width - 2 * borderDepth, target.unit);
  const bodyLengthCm = toCm(target.length - 2 * borderDepth, target.unit);
  if (bodyWidthCm <= 0 || bodyLengthCm <= 0) {
    throw new RangeError('borderDepth leaves no body: two border depths are as wide as the target');
  }
  const { stitchesPerCm, rowsPerCm } = gaugePerCm(gauge);
  const exactStitches = bodyWidthCm * stitchesPerCm;
  const exactRows = bodyLengthCm * rowsPerCm;
  const stitches = nearestFit(exactStitches, stitchMultiple, stitchOffset);
  const rows = nearestFit(exactRows, rowMultiple, rowOffset);
  const body = countsToBodySize(stitches, rows, gauge, target.unit);
  return {
    stitches,
    rows,
    startingChain: startingChain(stitches, bodyStitch),
    exact: { stitches: exactStitches, rows: exactRows },
    body,
    finished: {
      width: body.width + 2 * borderDepth,
      length: body.length + 2 * borderDepth,
      unit: target.unit,
    },
  };
}

function countsToBodySize(stitches: number, rows: number, gauge: Gauge, unit: LengthUnit): Size {
  const { stitchesPerCm, rowsPerCm } = gaugePerCm(gauge);
  return { width: fromCm(stitches / stitchesPerCm, unit), length: fromCm(rows / rowsPerCm, unit), unit };
}

export interface FinishedSizeInput {
  gauge: Gauge;
  stitches: number;
  rows: number;
  /** Border depth on one side, in `unit`. */
  borderDepth: number;
  unit: LengthUnit;
}

/** The reverse: counts and gauge to the body and finished sizes. */
export function finishedSizeFromCounts(input: FinishedSizeInput): { body: Size; finished: Size } {
  positive('stitches', input.stitches);
  positive('rows', input.rows);
  if (!Number.isFinite(input.borderDepth) || input.borderDepth < 0) {
    throw new RangeError(`borderDepth must be 0 or more (got ${input.borderDepth})`);
  }
  const body = countsToBodySize(input.stitches, input.rows, input.gauge, input.unit);
  return {
    body,
    finished: {
      width: body.width + 2 * input.borderDepth,
      length: body.length + 2 * input.borderDepth,
      unit: input.unit,
    },
  };
}
