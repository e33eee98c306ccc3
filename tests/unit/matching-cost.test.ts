import { describe, expect, it } from 'vitest';
import { defaultGuidelines } from '@shared/guidelines/defaults';
import { MAX_PAIR_COST, daysUntil, feasibility, pairCost, readPreferences, sizeGap, type MatchBlanket, type MatchNeed } from '@shared/matching/cost';
import { suggestAssignments } from '@shared/matching/suggest';
import { sizeCategoryRow } from '@shared/guidelines/size-categories';
import { plainBlanket } from '../fixtures/blankets';

const TODAY = new Date('2026-12-01T10:00:00Z');

const blanket = (over: Partial<MatchBlanket> = {}, fields = {}): MatchBlanket => ({
  id: 1,
  code: 'KL-TEST',
  fields: plainBlanket(fields),
  colours: 'pale blue',
  bodyStitch: 'hdc',
  pledgedNeedId: null,
  siteId: null,
  ...over,
});

const need = (over: Partial<MatchNeed> = {}): MatchNeed => ({
  id: 10,
  recipientId: 100,
  recipientName: 'Shelter',
  sizeCategory: 'crib',
  open: 2,
  deadline: '2027-01-30',
  preferences: null,
  guidelines: { ...defaultGuidelines('infant'), requireDryerSafe: false },
  ...over,
});

describe('the cost of a pair', () => {
  it('counts days to the deadline by calendar day', () => {
    expect(daysUntil('2026-12-01', TODAY)).toBe(0);
    expect(daysUntil('2026-12-15', TODAY)).toBe(14);
    expect(daysUntil('2026-11-28', TODAY)).toBe(-3);
  });

  it('measures the size gap from the category nominal either way round, zero at the nominal', () => {
    const nominal = sizeCategoryRow('crib').nominalCm;
    expect(sizeGap(nominal.width, nominal.length, 'crib')).toBe(0);
    expect(sizeGap(nominal.length, nominal.width, 'crib')).toBe(0);
    expect(sizeGap(nominal.width * 1.1, nominal.length, 'crib')).toBeCloseTo(0.1, 10);
  });

  it('is cheaper when the maker pledged it for this need, when the need is due sooner, and nearer the size', () => {
    const n = need();
    const base = pairCost(blanket(), n, TODAY).cost;
    expect(pairCost(blanket({ pledgedNeedId: n.id }), n, TODAY).cost).toBe(base - 20);
    expect(pairCost(blanket(), need({ deadline: '2026-12-05' }), TODAY).cost).toBeLessThan(base);
    const nominal = sizeCategoryRow('crib').nominalCm;
    expect(pairCost(blanket({}, { widthCm: nominal.width, lengthCm: nominal.length }), n, TODAY).cost).toBeLessThan(base);
  });

  it('stays within 0 and MAX_PAIR_COST in whole points', () => {
    for (const [w, l] of [[20, 20], [80, 100], [300, 300]]) {
      for (const deadline of ['2026-01-01', '2026-12-02', '2030-01-01']) {
        const c = pairCost(blanket({}, { widthCm: w, lengthCm: l }), need({ deadline, preferences: 'no dark colours' }), TODAY).cost;
        expect(Number.isInteger(c)).toBe(true);
        expect(c).toBeGreaterThanOrEqual(0);
        expect(c).toBeLessThanOrEqual(MAX_PAIR_COST);
      }
    }
  });

  it('reads wishes and refusals in a preference, and prices them', () => {
    expect(readPreferences('Warm, calm colours; no very dark shades.')).toEqual({ wanted: ['warm', 'calm'], unwanted: ['dark'] });
    expect(readPreferences('Bright colours, stripes and squares.')).toEqual({ wanted: ['bright', 'stripe', 'square'], unwanted: [] });
    expect(readPreferences('Any colours; washable is what matters.')).toEqual({ wanted: [], unwanted: [] });
    const n = need({ preferences: 'Soft pale colours' });
    const pale = pairCost(blanket({ colours: 'pale mint' }), n, TODAY);
    const navy = pairCost(blanket({ colours: 'navy' }), n, TODAY);
    expect(navy.cost - pale.cost).toBe(10);
    expect(pale.reasons.join(' ')).toMatch(/wish for pale/);
    const dark = pairCost(blanket({ colours: 'dark green' }), need({ preferences: 'no very dark shades' }), TODAY);
    expect(dark.reasons.join(' ')).toMatch(/asked for no dark/);
  });

  it('gives reasons only when asked', () => {
    expect(pairCost(blanket(), need(), TODAY, false).reasons).toEqual([]);
    expect(pairCost(blanket(), need(), TODAY).reasons.length).toBeGreaterThan(1);
  });
});

describe('feasibility', () => {
  it('is the guideline check: a refused fibre or a size outside the unit\'s span is impossible, with the reason', () => {
    const g = need().guidelines;
    expect(feasibility(blanket(), g).ok).toBe(true);
    const wool = feasibility(blanket({}, { fibres: ['wool'] }), g);
    expect(wool.ok).toBe(false);
    expect(wool.reasons.join(' ').toLowerCase()).toMatch(/wool/);
    expect(feasibility(blanket({}, { widthCm: 150, lengthCm: 200 }), g).ok).toBe(false);
  });
});

describe('suggestAssignments', () => {
  it('fills the slots, prefers the pledged need, lists the short needs and why blankets are left over', () => {
    const a = need({ id: 1, open: 1 });
    const b = need({ id: 2, open: 2, recipientName: 'Second' });
    const blankets = [
      blanket({ id: 1, code: 'A', pledgedNeedId: 2 }),
      blanket({ id: 2, code: 'B' }),
      blanket({ id: 3, code: 'W' }, { fibres: ['wool'] }),
    ];
    const s = suggestAssignments(blankets, [a, b], TODAY);
    expect(s.pairs.map((p) => [p.blanketCode, p.needId])).toEqual([
      ['A', 2],
      ['B', 1],
    ]);
    expect(s.pairs[0]!.reasons).toContain('Its maker pledged it for this need');
    expect(s.short).toEqual([{ needId: 2, recipientName: 'Second', sizeCategory: 'crib', missing: 1 }]);
    expect(s.unplaced).toHaveLength(1);
    expect(s.unplaced[0]!.reason).toMatch(/No open need takes it/);
    expect(s.totalCost).toBe(s.pairs.reduce((t, p) => t + p.cost, 0));
  });

  it('says a blanket was left over because every need it fits is full', () => {
    const s = suggestAssignments([blanket({ id: 1, code: 'A' }), blanket({ id: 2, code: 'B' })], [need({ open: 1 })], TODAY);
    expect(s.pairs).toHaveLength(1);
    expect(s.unplaced[0]!.reason).toMatch(/Every need it fits is filled/);
  });
});
