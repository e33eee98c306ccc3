import { describe, expect, it } from 'vitest';
import sqlite3 from 'sqlite3';
import { DateTime } from 'luxon';
import { AT_RISK_DAYS, arrivalMoves, riskOf, weekAfter, weekOf } from '@shared/drive/glance';
import { localDayOf, zoneSpans } from '../../server/modules/drive/glance-sql';

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
  it('weeks start on Monday', () => {
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

describe('the drive-local day in SQL', () => {
  // The IANA time zone database, read through luxon, is the oracle: SQLite evaluates localDayOf on
  // stored timestamps and must name the same local day for every instant.
  const zones = ['Pacific/Auckland', 'America/St_Johns', 'Asia/Kathmandu', 'Europe/London', 'America/Los_Angeles', 'UTC'];
  const from = Date.UTC(2025, 9, 1);
  const to = Date.UTC(2026, 11, 31);

  it('finds the clock changes of a zone to the minute (New Zealand: first Sunday of April, last Sunday of September)', () => {
    expect(zoneSpans('Pacific/Auckland', Date.UTC(2025, 10, 1), Date.UTC(2026, 11, 10))).toEqual([
      { untilUtc: '2026-04-04 14:00:00', offsetMinutes: 13 * 60 },
      { untilUtc: '2026-09-26 14:00:00', offsetMinutes: 12 * 60 },
      { untilUtc: null, offsetMinutes: 13 * 60 },
    ]);
    expect(zoneSpans('Asia/Kathmandu', from, to)).toEqual([{ untilUtc: null, offsetMinutes: 5 * 60 + 45 }]);
  });

  it('agrees with luxon on random instants and on every minute around local midnight and the clock changes', async () => {
    const db = new sqlite3.Database(':memory:');
    const all = (sql: string, params: unknown[]) =>
      new Promise<Array<{ day: string }>>((resolve, reject) => db.all(sql, params, (err, rows) => (err ? reject(err) : resolve(rows as Array<{ day: string }>))));
    const stored = (ms: number) => new Date(ms).toISOString().replace('T', ' ').replace('Z', ' +00:00');
    try {
      for (const zone of zones) {
        const spans = zoneSpans(zone, from, to);
        const instants: number[] = [];
        for (let i = 0; i < 300; i++) instants.push(from + Math.floor(Math.random() * (to - from)));
        // Every minute of the hours either side of local midnight on a few days, and of each clock change.
        for (const d of ['2025-12-31', '2026-04-05', '2026-06-21', '2026-09-27', '2026-11-01']) {
          const midnight = DateTime.fromISO(`${d}T00:00`, { zone }).toMillis();
          for (let m = -90; m <= 90; m++) instants.push(midnight + m * 60_000);
        }
        for (const s of spans) if (s.untilUtc) for (let m = -90; m <= 90; m++) instants.push(Date.parse(`${s.untilUtc.replace(' ', 'T')}Z`) + m * 60_000);
        const sql = `SELECT ${localDayOf('t', spans)} AS day FROM (SELECT ? AS t)`;
        for (const at of instants) {
          const [row] = await all(sql, [stored(at)]);
          expect(row!.day, `${zone} ${stored(at)}`).toBe(DateTime.fromMillis(at, { zone }).toISODate());
        }
      }
    } finally {
      db.close();
    }
  });
});
