import { describe, expect, it } from 'vitest';
import { AT_RISK_DAYS, arrivalMoves, riskOf, weekAfter, weekOf } from '@shared/drive/glance';

describe('needs at risk', () => {
  const need = { deadline: '2027-01-22', wanted: 10, pledged: 10, assigned: 10 };
  it('is at risk only within the window and only when short of pledges or assignments', () => {
    expect(AT_RISK_DAYS).toBe(21);
    expect(riskOf({ ...need, pledged: 9 }, '2027-01-01')).toEqual({ atRisk: true, daysLeft: 21, reasons: ['pledged'] });
    expect(riskOf({ ...need, pledged: 9 }, '2026-12-31')).toEqual({ atRisk: false, daysLeft: 22, reasons: [] });
    expect(riskOf({ ...need, assigned: 3 }, '2027-01-22')).toEqual({ atRisk: true, daysLeft: 0, reasons: ['assigned'] });
    expect(riskOf({ ...need, pledged: 0, assigned: 0 }, '2027-01-10').reasons).toEqual(['pledged', 'assigned']);
    expect(riskOf(need, '2027-01-20').atRisk).toBe(false);
    // Past its deadline a need is closed, not at risk.
    expect(riskOf({ ...need, pledged: 0 }, '2027-01-23').atRisk).toBe(false);
  });
});

describe('weeks and arrivals', () => {
  it('weeks start on Monday (UTC)', () => {
    expect(weekOf('2026-12-03')).toBe('2026-11-30');
    expect(weekOf('2026-11-30')).toBe('2026-11-30');
    expect(weekOf('2026-12-06')).toBe('2026-11-30');
    expect(weekAfter('2026-12-28')).toBe('2027-01-04');
  });
  it('reaching a step is a forward move into it from outside it, or being logged straight into it', () => {
    const received = arrivalMoves('received');
    expect(received).toContainEqual({ from: 'booked', to: 'received' });
    expect(received).toContainEqual({ from: 'finished', to: 'received' });
    // A fix mended at the table, or a step back from checked, is not a new arrival.
    expect(received).not.toContainEqual({ from: 'needs_fix', to: 'received' });
    expect(received).not.toContainEqual({ from: 'checked', to: 'received' });
    expect(arrivalMoves('delivered')).toEqual([{ from: null, to: 'delivered' }, { from: 'packed', to: 'delivered' }]);
  });
});
