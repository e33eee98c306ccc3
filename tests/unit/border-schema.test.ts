import { describe, it, expect } from 'vitest';
import { BorderFitRequestSchema, SizeFromGaugeRequestSchema, YarnEstimateRequestSchema } from '@shared/schemas/border-fit';

const ok = { across: 30, rows: 23, multiple: 4, offset: 1 };
const issues = (value: unknown) => {
  const r = BorderFitRequestSchema.safeParse(value);
  return r.success ? [] : r.error.issues.map((i) => ({ path: i.path.join('.'), message: i.message }));
};

describe('BorderFitRequestSchema', () => {
  it('fills in the defaults', () => {
    expect(BorderFitRequestSchema.parse(ok)).toEqual({ ...ok, strategy: 'add', mode: 'per-edge' });
  });

  it('accepts a row pattern and the optional lead and centre', () => {
    const req = { ...ok, rows: { count: 23, pattern: ['sc', 'dc'] }, strategy: 'fewest', mode: 'continuous', lead: 1, centre: 1 };
    expect(BorderFitRequestSchema.parse(req)).toEqual(req);
  });

  it('rejects absurd sizes over 2,000 and names the field', () => {
    expect(issues({ ...ok, across: 2001 })).toEqual([{ path: 'across', message: 'across over 2,000 stitches is too large to plan; check the count' }]);
    expect(issues({ ...ok, rows: 2001 })).toEqual([{ path: 'rows', message: 'rows over 2,000 rows is too large to plan; check the count' }]);
    expect(issues({ ...ok, rows: { count: 2001, pattern: ['sc'] } })[0]).toMatchObject({ path: 'rows.count' });
    expect(issues({ ...ok, across: 2000, rows: 2000 })).toEqual([]);
  });

  it('asks for positive whole numbers', () => {
    expect(issues({ ...ok, across: 0 })[0]).toMatchObject({ path: 'across', message: 'across must be at least 1' });
    expect(issues({ ...ok, across: 12.5 })[0]).toMatchObject({ path: 'across', message: 'across must be a whole number of stitches' });
    expect(issues({ ...ok, across: '30' })[0]).toMatchObject({ path: 'across', message: 'across must be a number of stitches' });
    expect(issues({ ...ok, rows: 'many' })[0]).toMatchObject({ path: 'rows' });
    expect(issues({ ...ok, rows: undefined })[0]).toMatchObject({ path: 'rows' });
  });

  it('bounds multiple (2–60) and offset (0–100)', () => {
    expect(issues({ ...ok, multiple: 1 })[0]).toMatchObject({ path: 'multiple' });
    expect(issues({ ...ok, multiple: 61 })[0]).toMatchObject({ path: 'multiple', message: 'multiple must be at most 60' });
    expect(issues({ ...ok, multiple: 60, offset: 100 })).toEqual([]);
    expect(issues({ ...ok, offset: -1 })[0]).toMatchObject({ path: 'offset', message: 'offset must be 0 or more' });
    expect(issues({ ...ok, offset: 101 })[0]).toMatchObject({ path: 'offset' });
  });

  it('checks the row pattern: 1–12 known row types', () => {
    expect(issues({ ...ok, rows: { count: 5, pattern: [] } })[0]).toMatchObject({ path: 'rows.pattern' });
    expect(issues({ ...ok, rows: { count: 5, pattern: Array(13).fill('sc') } })[0]).toMatchObject({
      path: 'rows.pattern',
      message: 'rows.pattern can name at most 12 row types',
    });
    expect(issues({ ...ok, rows: { count: 5, pattern: ['sc', 'bobble'] } })[0]).toMatchObject({ path: 'rows.pattern.1' });
    expect(issues({ ...ok, rows: { count: 5 } })[0]).toMatchObject({ path: 'rows.pattern' });
  });

  it('checks strategy, mode, lead and centre', () => {
    expect(issues({ ...ok, strategy: 'subtract' })[0]).toMatchObject({ path: 'strategy', message: "strategy must be 'add' or 'fewest'" });
    expect(issues({ ...ok, mode: 'spiral' })[0]).toMatchObject({ path: 'mode' });
    expect(issues({ ...ok, lead: 2 })[0]).toMatchObject({ path: 'lead', message: 'lead cannot be more than offset' });
    expect(issues({ ...ok, centre: 4 })[0]).toMatchObject({ path: 'centre', message: 'centre must be less than multiple' });
  });
});

describe('size and yarn request schemas', () => {
  const size = {
    gauge: { stitches: 14, rows: 10, over: 10, unit: 'cm' },
    target: { width: 90, length: 110, unit: 'cm' },
    borderDepth: 3,
    bodyStitch: 'dc',
  };
  it('accepts a size request and fills defaults', () => {
    expect(SizeFromGaugeRequestSchema.parse(size)).toMatchObject({ stitchMultiple: 1, stitchOffset: 0, rowMultiple: 1, rowOffset: 0 });
  });
  it('rejects a border that leaves no body, naming borderDepth', () => {
    const r = SizeFromGaugeRequestSchema.safeParse({ ...size, borderDepth: 45 });
    expect(r.success).toBe(false);
    if (!r.success) expect(r.error.issues[0]!.path).toEqual(['borderDepth']);
  });
  it('rejects a zero gauge, naming it', () => {
    const r = SizeFromGaugeRequestSchema.safeParse({ ...size, gauge: { ...size.gauge, stitches: 0 } });
    expect(r.success).toBe(false);
    if (!r.success) expect(r.error.issues[0]!.path).toEqual(['gauge', 'stitches']);
  });
  it('accepts a yarn request and rejects lace', () => {
    const yarn = { body: { width: 36, length: 36, unit: 'in' }, yarnWeight: 4 };
    expect(YarnEstimateRequestSchema.parse(yarn)).toMatchObject({ margin: 0.1 });
    const r = YarnEstimateRequestSchema.safeParse({ ...yarn, yarnWeight: 0 });
    expect(r.success).toBe(false);
    if (!r.success) expect(r.error.issues[0]!.message).toMatch(/yarnWeight must be from 1 to 7/);
  });
});
