import { describe, expect, it } from 'vitest';
import { slotsBetween } from '@shared/scheduling/slots';
import { EMPTY_HOURS, type SiteSchedule } from '@shared/schemas/schedule';

/**
 * Clock changes, checked against published rules rather than against the library that computes them.
 * Source: the IANA tz database (file `europe`, "Rule EU 1981 max - Mar lastSun 1:00u 1:00 S" and
 * "Rule EU 1996 max - Oct lastSun 1:00u 0 -", which Europe/London follows; the same dates are set in
 * law by EU Directive 2000/84/EC and the UK Summer Time Order 2002): summer time starts on the last
 * Sunday of March and ends on the last Sunday of October, both at 01:00 UTC.
 * For 2027 those Sundays are 28 March and 31 October (a calendar). US rule (tz file `northamerica`,
 * "Rule US 2007 max - Mar Sun>=8 2:00 1:00 D" and "Nov Sun>=1 2:00 0 S"): 14 March and 7 November 2027,
 * at 02:00 local time.
 */
const sundays = (spans: Array<{ from: string; to: string }>): SiteSchedule => ({
  openingHours: { ...EMPTY_HOURS, sun: spans },
  closures: [],
  slotMinutes: 30,
  slotCapacity: 3,
});
const starts = (s: SiteSchedule, zone: string, day: string) => slotsBetween(s, zone, day, day).map((x) => x.start);

describe('drop-off slots across clock changes (IANA tz database rules, Europe/London and America/New_York)', () => {
  it('a Sunday 10:00–12:00 span on the day clocks go back still yields 10:00, 10:30, 11:00 and 11:30, now on GMT', () => {
    const slots = slotsBetween(sundays([{ from: '10:00', to: '12:00' }]), 'Europe/London', '2027-10-31', '2027-10-31');
    expect(slots.map((s) => s.start)).toEqual([
      '2027-10-31T10:00:00+00:00',
      '2027-10-31T10:30:00+00:00',
      '2027-10-31T11:00:00+00:00',
      '2027-10-31T11:30:00+00:00',
    ]);
    // Every slot lasts exactly 30 minutes of real time.
    expect(slots.every((s) => s.endMs - s.startMs === 30 * 60_000)).toBe(true);
    // The Sunday before is still on summer time (UTC+1).
    expect(starts(sundays([{ from: '10:00', to: '12:00' }]), 'Europe/London', '2027-10-24')[0]).toBe('2027-10-24T10:00:00+01:00');
  });

  it('the same span on the day clocks go forward yields four slots on BST', () => {
    expect(starts(sundays([{ from: '10:00', to: '12:00' }]), 'Europe/London', '2027-03-28')).toEqual([
      '2027-03-28T10:00:00+01:00',
      '2027-03-28T10:30:00+01:00',
      '2027-03-28T11:00:00+01:00',
      '2027-03-28T11:30:00+01:00',
    ]);
    expect(starts(sundays([{ from: '10:00', to: '12:00' }]), 'Europe/London', '2027-03-21')[0]).toBe('2027-03-21T10:00:00+00:00');
  });

  it('skips the hour that does not exist in spring: 01:00–02:00 GMT on 28 March 2027 in London', () => {
    // 00:30–01:00 would end at 01:00, which the clock jumps over; 01:00 and 01:30 do not exist.
    expect(starts(sundays([{ from: '00:00', to: '03:00' }]), 'Europe/London', '2027-03-28')).toEqual([
      '2027-03-28T00:00:00+00:00',
      '2027-03-28T02:00:00+01:00',
      '2027-03-28T02:30:00+01:00',
    ]);
  });

  it('offers the repeated hour once in autumn and never a slot that spans the change', () => {
    // 01:00–02:00 happens twice; the slot from 01:30 BST to 02:00 GMT would last 90 minutes.
    expect(starts(sundays([{ from: '00:00', to: '03:00' }]), 'Europe/London', '2027-10-31')).toEqual([
      '2027-10-31T00:00:00+01:00',
      '2027-10-31T00:30:00+01:00',
      '2027-10-31T01:00:00+01:00',
      '2027-10-31T02:00:00+00:00',
      '2027-10-31T02:30:00+00:00',
    ]);
  });

  it('follows the US rule in New York: 02:00 local on 14 March and 7 November 2027', () => {
    expect(starts(sundays([{ from: '01:00', to: '04:00' }]), 'America/New_York', '2027-03-14')).toEqual([
      '2027-03-14T01:00:00-05:00',
      '2027-03-14T03:00:00-04:00',
      '2027-03-14T03:30:00-04:00',
    ]);
    expect(starts(sundays([{ from: '00:00', to: '03:00' }]), 'America/New_York', '2027-11-07')).toEqual([
      '2027-11-07T00:00:00-04:00',
      '2027-11-07T00:30:00-04:00',
      '2027-11-07T01:00:00-04:00',
      '2027-11-07T02:00:00-05:00',
      '2027-11-07T02:30:00-05:00',
    ]);
  });
});
