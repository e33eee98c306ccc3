import { useCallback, useMemo, useState } from 'react';
import { BORDER_LIBRARY, borderById, borderDepthCm, borderPlanOptions, type BorderPattern } from '@shared/border/library';
import { planBorder, type BorderPlan } from '@shared/border/plan';
import { rowCount, type BodyRows, type RowType } from '@shared/border/row-ends';
import type { FitStrategy } from '@shared/border/fit';
import type { RoundMode } from '@shared/border/round';
import type * as BorderFitSchemas from '@shared/schemas/border-fit';
import { MAX_EDGE_STITCHES } from '@shared/schemas/border-fit-values';
import type { PlanInput, PlanInputDraft } from '@shared/schemas/plan';
import { bodyCountsFromGauge, finishedSizeFromCounts, type BodyCounts, type BodyStitch, type Gauge, type Size } from '@shared/sizing/gauge';
import { estimateYarn, type YarnEstimate } from '@shared/sizing/yarn-estimate';
import { UK_TO_US, US_TO_UK } from '@shared/sizing/stitch-names';
import { fromCm, toCm, type LengthUnit, type YarnUnit } from '@shared/sizing/units';
import { preload, usePreloaded } from '@/lib/lazy-zod-resolver';

/**
 * The shared request schemas that check what the maker types. They load on their own, right after
 * the page paints; the border, size and yarn arithmetic (shared/border, shared/sizing) needs none
 * of them, so the first plan is drawn before they arrive.
 */
export type PlannerChecks = Pick<typeof BorderFitSchemas, 'BorderFitRequestSchema' | 'GaugeSchema' | 'SizeFromGaugeRequestSchema' | 'YarnEstimateRequestSchema'>;
const plannerChecks = preload((): Promise<PlannerChecks> => import('@shared/schemas/border-fit'));

export type Terms = 'us' | 'uk';
export type RowPresetId = 'hdc' | 'sc-dc' | 'dc' | 'sc' | 'plain' | 'custom';

export interface RowPreset {
  id: RowPresetId;
  /** In US terms; the screen converts it when the UK switch is on. */
  label: string;
  pattern: RowType[] | null;
}

export const ROW_PRESETS: readonly RowPreset[] = [
  { id: 'hdc', label: 'All hdc rows', pattern: ['hdc'] },
  { id: 'sc-dc', label: 'sc and dc rows alternating', pattern: ['sc', 'dc'] },
  { id: 'dc', label: 'All dc rows', pattern: ['dc'] },
  { id: 'sc', label: 'All sc rows', pattern: ['sc'] },
  { id: 'plain', label: 'Just a count', pattern: null },
  { id: 'custom', label: 'My own repeating rows', pattern: null },
];

/** Our own example numbers; the worked check values of the border maths are kept for the tests. */
export const DEFAULTS = {
  across: '42',
  rows: '31',
  rowPreset: 'hdc' as RowPresetId,
  customPattern: 'sc, sc, dc',
  borderId: 'five-dc-shell',
  strategy: 'add' as FitStrategy,
  mode: 'per-edge' as RoundMode,
  terms: 'us' as Terms,
  unit: 'cm' as LengthUnit,
  gaugeStitches: '15',
  gaugeRows: '11',
  targetWidth: '80',
  targetLength: '100',
  stitchMultiple: '1',
  stitchOffset: '0',
  yarnWeight: '4',
  skeinLength: '190',
  skeinUnit: 'm' as YarnUnit,
  marginPct: '10',
};

/**
 * countsTouched: until the maker types their own stitches across and rows, the plan takes the
 * counts the swatch and the finished size call for, so the drawing, the yarn estimate and the
 * printed plan all work from that one set of counts.
 */
export type PlannerState = typeof DEFAULTS & { borderDepth: string; depthTouched: boolean; countsTouched: boolean };

/** The foundation round is about as deep as one plain hdc round: the library's own figure. */
const FOUNDATION_DEPTH_CM = borderById('plain-hdc-round')!.depthPerRoundCm;

const roundTo = (n: number, step: number) => Math.round(n / step) * step;
const asText = (n: number) => String(Math.round(n * 100) / 100);

export function defaultDepth(border: BorderPattern, unit: LengthUnit): string {
  const cm = borderDepthCm(border) + FOUNDATION_DEPTH_CM;
  return asText(unit === 'cm' ? roundTo(cm, 0.5) : roundTo(fromCm(cm, unit), 0.25));
}

/** While the maker has not typed counts of their own, take the ones the swatch and size call for. */
export function followSwatch(s: PlannerState, checks: PlannerChecks | null = null): PlannerState {
  if (s.countsTouched) return s;
  const { sizing } = computePlanner(s, checks);
  if (!sizing) return s;
  const across = String(sizing.stitches);
  const rows = String(sizing.rows);
  return across === s.across && rows === s.rows ? s : { ...s, across, rows };
}

export function initialPlannerState(): PlannerState {
  return followSwatch({ ...DEFAULTS, borderDepth: defaultDepth(borderById(DEFAULTS.borderId)!, DEFAULTS.unit), depthTouched: false, countsTouched: false });
}

/** Which counts the plan uses, in words for the screen and the printed plan. */
export function countsInUse(s: PlannerState, r: PlannerResult): { source: 'swatch' | 'own' | 'none'; matchesSwatch: boolean } {
  if (r.across === undefined || r.rows === undefined) return { source: 'none', matchesSwatch: false };
  const matchesSwatch = !!r.sizing && r.sizing.stitches === r.across && r.sizing.rows === rowCount(r.rows);
  return { source: !s.countsTouched && matchesSwatch ? 'swatch' : 'own', matchesSwatch };
}

/** A number typed by a person: blank stays blank (undefined) so the message can say "enter". */
function num(text: string): number | undefined {
  const t = text.trim().replace(',', '.');
  if (t === '') return undefined;
  const n = Number(t);
  return Number.isFinite(n) ? n : Number.NaN;
}

export type FieldErrors = Partial<Record<string, string>>;

/** The shared schemas speak in API field names; the screen names its own labels. */
function relabel(message: string, field: string, label: string): string {
  return message.startsWith(field) ? label + message.slice(field.length) : message;
}

export function parsePatternText(text: string, terms: Terms): { pattern?: RowType[]; error?: string } {
  const tokens = text
    .toLowerCase()
    .split(/[\s,;/+]+/)
    .filter(Boolean);
  if (tokens.length === 0) return { error: 'Row pattern: name at least one row, e.g. "sc, dc"' };
  const pattern: RowType[] = [];
  for (const token of tokens) {
    // In UK terms "dc" is a US sc: read what the maker typed in the terms they chose.
    const us = terms === 'uk' ? UK_TO_US[token] : (token as RowType);
    if (!us || !(us in US_TO_UK)) {
      const names = terms === 'uk' ? 'dc, htr, tr, dtr, trtr' : 'sc, hdc, dc, tr, dtr';
      return { error: `Row pattern: "${token}" is not a row type we know (use ${names})` };
    }
    pattern.push(us);
  }
  return { pattern };
}

export interface PlannerResult {
  errors: FieldErrors;
  border: BorderPattern;
  across?: number;
  rows?: BodyRows;
  pattern: RowType[] | null;
  plan: BorderPlan | null;
  planError?: string;
  gauge: Gauge | null;
  /** Target size → counts. */
  sizing: BodyCounts | null;
  /** The plan's counts → sizes at the gauge. */
  sizes: { body: Size; finished: Size } | null;
  depth?: number;
  bodyStitch: BodyStitch;
  yarn: YarnEstimate | null;
}

/** A count the arithmetic can take as it is, for the moment before the checks have loaded. */
const plainCount = (n: number) => Number.isInteger(n) && n >= 1 && n <= MAX_EDGE_STITCHES;

/** Runs the arithmetic, or says nothing if its input is not yet something it can work with. */
function attempt<T>(work: () => T): T | null {
  try {
    return work();
  } catch {
    return null;
  }
}

/**
 * The planner's figures for what the maker has typed. With `checks` (the shared schemas) every
 * input is checked and each mistake named in the screen's words. Without them, in the moment
 * before they have loaded, the arithmetic works from the numbers as typed and only a blank field
 * is named: every figure the checks let through is the same either way.
 */
export function computePlanner(s: PlannerState, checks: PlannerChecks | null): PlannerResult {
  const errors: FieldErrors = {};
  const border = borderById(s.borderId) ?? BORDER_LIBRARY[0]!;

  const acrossRaw = num(s.across);
  let across: number | undefined;
  if (acrossRaw === undefined) errors.across = 'Stitches across: enter the stitches in one row of the body';
  else if (!checks) across = plainCount(acrossRaw) ? acrossRaw : undefined;
  else {
    const r = checks.BorderFitRequestSchema.shape.across.safeParse(acrossRaw);
    if (r.success) across = r.data;
    else errors.across = relabel(r.error.issues[0]!.message, 'across', 'Stitches across');
  }

  const preset = ROW_PRESETS.find((p) => p.id === s.rowPreset) ?? ROW_PRESETS[0]!;
  let pattern: RowType[] | null = preset.pattern;
  if (preset.id === 'custom') {
    const parsed = parsePatternText(s.customPattern, s.terms);
    if (parsed.error) errors.customPattern = parsed.error;
    pattern = parsed.pattern ?? null;
  }
  const rowsRaw = num(s.rows);
  let rows: BodyRows | undefined;
  if (rowsRaw === undefined) errors.rows = 'Rows: enter how many rows the body has';
  else if (!checks) rows = plainCount(rowsRaw) && !(preset.id === 'custom' && !pattern) ? (pattern ? { count: rowsRaw, pattern } : rowsRaw) : undefined;
  else if (!(preset.id === 'custom' && !pattern)) {
    const value = pattern ? { count: rowsRaw, pattern } : rowsRaw;
    const r = checks.BorderFitRequestSchema.shape.rows.safeParse(value);
    if (r.success) rows = r.data;
    else {
      const issue = r.error.issues[0]!;
      if (issue.path[0] === 'pattern') errors.customPattern = relabel(issue.message, 'rows.pattern', 'Row pattern');
      else errors.rows = relabel(relabel(issue.message, 'rows.count', 'Rows'), 'rows', 'Rows');
    }
  }
  const bodyStitch: BodyStitch = pattern?.[0] ?? 'hdc';

  let plan: BorderPlan | null = null;
  let planError: string | undefined;
  if (across !== undefined && rows !== undefined) {
    try {
      plan = planBorder({
        across,
        rows,
        ...borderPlanOptions(border, s.mode),
        strategy: s.strategy,
        mode: s.mode,
      });
    } catch (err) {
      planError = err instanceof Error ? err.message : String(err);
    }
  }

  const over = s.unit === 'cm' ? 10 : 4;
  const gaugeInput = { stitches: num(s.gaugeStitches), rows: num(s.gaugeRows), over, unit: s.unit };
  let gauge: Gauge | null = null;
  const g = checks?.GaugeSchema.safeParse(gaugeInput);
  if (!g) {
    const { stitches, rows } = gaugeInput;
    if (stitches !== undefined && stitches > 0 && rows !== undefined && rows > 0) gauge = { ...gaugeInput, stitches, rows };
  } else if (g.success) gauge = g.data;
  else
    for (const issue of g.error.issues) {
      const key = issue.path[0] === 'stitches' ? 'gaugeStitches' : 'gaugeRows';
      errors[key] ??= `Swatch ${issue.path[0] === 'stitches' ? 'stitches' : 'rows'}: ${
        issue.code === 'invalid_type' ? 'enter a number' : issue.message.replace(/^gauge\.\w+ /, '')
      }`;
    }

  const depthRaw = num(s.borderDepth);
  let depth: number | undefined;
  if (depthRaw === undefined || Number.isNaN(depthRaw)) errors.borderDepth = 'Border depth: enter a number (0 for none)';
  else if (depthRaw < 0 || depthRaw > 50) errors.borderDepth = 'Border depth must be from 0 to 50';
  else depth = depthRaw;

  let sizing: BodyCounts | null = null;
  if (gauge && depth !== undefined) {
    const sizeInput = {
      gauge,
      target: { width: num(s.targetWidth), length: num(s.targetLength), unit: s.unit },
      borderDepth: depth,
      bodyStitch,
      stitchMultiple: num(s.stitchMultiple),
      stitchOffset: num(s.stitchOffset),
      rowMultiple: pattern?.length ?? 1,
      rowOffset: 0,
    };
    const req = checks?.SizeFromGaugeRequestSchema.safeParse(sizeInput);
    if (!req) {
      const { width, length } = sizeInput.target;
      if (width !== undefined && length !== undefined) sizing = attempt(() => bodyCountsFromGauge({ ...sizeInput, target: { ...sizeInput.target, width, length } }));
    } else if (req.success) {
      try {
        sizing = bodyCountsFromGauge(req.data);
      } catch (err) {
        errors.targetWidth = err instanceof Error ? err.message : String(err);
      }
    } else {
      for (const issue of req.error.issues) {
        const path = issue.path.join('.');
        const key =
          path === 'target.width' ? 'targetWidth'
          : path === 'target.length' ? 'targetLength'
          : path === 'stitchMultiple' ? 'stitchMultiple'
          : path === 'stitchOffset' ? 'stitchOffset'
          : path === 'borderDepth' ? 'borderDepth'
          : 'targetWidth';
        const label =
          key === 'targetWidth' ? 'Finished width' : key === 'targetLength' ? 'Finished length' : key === 'borderDepth' ? 'Border depth' : key === 'stitchMultiple' ? 'Pattern multiple' : 'Pattern "plus"';
        errors[key] ??= `${label}: ${issue.code === 'invalid_type' ? 'enter a number' : issue.message.replace(/^[\w.]+ (must|leaves)/, '$1')}`;
      }
    }
  }

  let sizes: PlannerResult['sizes'] = null;
  if (gauge && depth !== undefined && across !== undefined && rows !== undefined) {
    sizes = finishedSizeFromCounts({ gauge, stitches: across, rows: rowCount(rows), borderDepth: depth, unit: s.unit });
  }

  let yarn: YarnEstimate | null = null;
  if (sizes && depth !== undefined) {
    const yarnInput = {
      body: { width: sizes.body.width, length: sizes.body.length, unit: s.unit },
      yarnWeight: num(s.yarnWeight),
      border: { depth, yarnFactor: border.yarnFactor },
      margin: (num(s.marginPct) ?? Number.NaN) / 100,
      skein: { length: num(s.skeinLength), unit: s.skeinUnit },
    };
    const y = checks?.YarnEstimateRequestSchema.safeParse(yarnInput);
    if (!y) {
      const { yarnWeight, skein } = yarnInput;
      if (yarnWeight !== undefined && skein.length !== undefined && skein.length > 0) yarn = attempt(() => estimateYarn({ ...yarnInput, yarnWeight, skein: { ...skein, length: skein.length! } }));
    } else if (y.success) yarn = estimateYarn(y.data);
    else
      for (const issue of y.error.issues) {
        const path = issue.path.join('.');
        if (path.startsWith('skein')) errors.skeinLength ??= `Skein length: ${issue.code === 'invalid_type' ? 'enter a number' : issue.message.replace(/^skein\.length /, '')}`;
        else if (path === 'margin') errors.marginPct ??= 'Spare yarn: enter a percentage from 0 to 100';
        else if (path === 'yarnWeight') errors.yarnWeight ??= issue.message;
      }
  }

  return { errors, border, across, rows, pattern, plan, planError, gauge, sizing, sizes, depth, bodyStitch, yarn };
}

/** What a saved plan holds: only the parts that are valid, so saving never fails on a side panel. */
export function toPlanInput(s: PlannerState, r: PlannerResult): PlanInputDraft | null {
  if (r.across === undefined || r.rows === undefined) return null;
  const rows = typeof r.rows === 'number' ? r.rows : { count: r.rows.count, pattern: [...r.rows.pattern] };
  const input: PlanInputDraft = { across: r.across, rows, borderId: r.border.id, strategy: s.strategy, mode: s.mode, terms: s.terms, bodyStitch: r.bodyStitch };
  if (r.gauge) input.gauge = r.gauge;
  if (r.depth !== undefined) input.borderDepth = r.depth;
  const w = num(s.targetWidth);
  const l = num(s.targetLength);
  if (r.sizing && w && l) input.target = { width: w, length: l, unit: s.unit };
  if (r.yarn) {
    input.yarn = { weight: Number(s.yarnWeight), margin: r.yarn.margin, skein: { length: Number(num(s.skeinLength)), unit: s.skeinUnit } };
  }
  return input;
}

function fromPlanInput(input: PlanInput): PlannerState {
  const base = initialPlannerState();
  const next: PlannerState = {
    ...base,
    across: String(input.across),
    // A saved plan's counts are the maker's own: keep them even where the swatch would say otherwise.
    countsTouched: true,
    borderId: input.borderId,
    strategy: input.strategy,
    mode: input.mode,
    terms: input.terms,
  };
  if (typeof input.rows === 'number') {
    next.rows = String(input.rows);
    next.rowPreset = 'plain';
  } else {
    next.rows = String(input.rows.count);
    const key = input.rows.pattern.join(',');
    const preset = ROW_PRESETS.find((p) => p.pattern && p.pattern.join(',') === key);
    next.rowPreset = preset?.id ?? 'custom';
    const names = input.terms === 'uk' ? input.rows.pattern.map((t) => US_TO_UK[t]) : input.rows.pattern;
    if (!preset) next.customPattern = names.join(', ');
  }
  if (input.gauge) {
    next.unit = input.gauge.unit;
    next.gaugeStitches = asText(input.gauge.stitches * ((input.gauge.unit === 'cm' ? 10 : 4) / input.gauge.over));
    next.gaugeRows = asText(input.gauge.rows * ((input.gauge.unit === 'cm' ? 10 : 4) / input.gauge.over));
  }
  if (input.target) {
    const conv = (v: number) => asText(input.target!.unit === next.unit ? v : fromCm(toCm(v, input.target!.unit), next.unit));
    next.targetWidth = conv(input.target.width);
    next.targetLength = conv(input.target.length);
  }
  next.borderDepth = input.borderDepth !== undefined ? asText(input.borderDepth) : defaultDepth(borderById(input.borderId)!, next.unit);
  next.depthTouched = input.borderDepth !== undefined;
  if (input.yarn) {
    next.yarnWeight = String(input.yarn.weight);
    next.marginPct = asText(input.yarn.margin * 100);
    if (input.yarn.skein) {
      next.skeinLength = asText(input.yarn.skein.length);
      next.skeinUnit = input.yarn.skein.unit;
    }
  }
  return next;
}

export function usePlanner() {
  const checks = usePreloaded(plannerChecks) ?? null;
  const [state, setState] = useState<PlannerState>(initialPlannerState);
  const result = useMemo(() => computePlanner(state, checks), [state, checks]);

  const update = useCallback((patch: Partial<PlannerState>) => {
    setState((s) => {
      const next = { ...s, ...patch };
      if ('borderDepth' in patch) next.depthTouched = true;
      if (('across' in patch || 'rows' in patch) && !('countsTouched' in patch)) next.countsTouched = true;
      // Until the maker types their own depth, it follows the chosen border.
      if (('borderId' in patch || 'unit' in patch) && !next.depthTouched) {
        next.borderDepth = defaultDepth(borderById(next.borderId) ?? BORDER_LIBRARY[0]!, next.unit);
      }
      if ('unit' in patch && patch.unit !== s.unit) {
        const conv = (text: string, step: number) => {
          const v = num(text);
          return v === undefined || Number.isNaN(v) ? text : asText(roundTo(fromCm(toCm(v, s.unit), next.unit), step));
        };
        const step = next.unit === 'cm' ? 1 : 0.5;
        next.targetWidth = conv(s.targetWidth, step);
        next.targetLength = conv(s.targetLength, step);
        if (next.depthTouched) next.borderDepth = conv(s.borderDepth, next.unit === 'cm' ? 0.5 : 0.25);
      }
      return followSwatch(next, plannerChecks.loaded?.value ?? null);
    });
  }, []);

  const load = useCallback((input: PlanInput) => setState(fromPlanInput(input)), []);
  const reset = useCallback(() => setState(initialPlannerState()), []);

  return { state, result, update, load, reset };
}
