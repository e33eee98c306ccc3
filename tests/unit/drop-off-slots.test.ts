import { describe, expect, it } from 'vitest';
import { closedOn, slotsBetween } from '@shared/scheduling/slots';
import { ClosureSchema, EMPTY_HOURS, OpeningHoursSchema, TimeZoneSchema, type SiteSchedule } from '@shared/schemas/schedule';

const hall: SiteSchedule = {
  openingHours: { ...EMPTY_HOURS, tue: [{ from: '09:00', to: '10:00' }, { from: '14:00', to: '15:15' }], sat: [{ from: '10:00', to: '11:00' }] },
  closures: [
    { from: '2027-06-08', to: '2027-06-08', note: 'Polling day' },
    { from: '2027-06-19', to: '2027-06-26', note: 'Summer fair' },
  ],
  slotMinutes: 30,
  slotCapacity: 2,
};
const local = (s: { start: string }) => s.start.slice(0, 16);

describe('drop-off slots', () => {
  it('lays whole slots from each span start and drops the part of a span too short for one', () => {
    // Tuesday 1 June 2027; 14:00–15:15 has room for two half hours, not a third.
    expect(slotsBetween(hall, 'Europe/London', '2027-06-01', '2027-06-01').map(local)).toEqual([
      '2027-06-01T09:00', '2027-06-01T09:30', '2027-06-01T14:00', '2027-06-01T14:30',
    ]);
  });

  it('offers nothing on a closed weekday, a single closed day or any day of a closed range', () => {
    expect(slotsBetween(hall, 'Europe/London', '2027-06-02', '2027-06-04')).toEqual([]);
    expect(slotsBetween(hall, 'Europe/London', '2027-06-08', '2027-06-08')).toEqual([]);
    expect(slotsBetween(hall, 'Europe/London', '2027-06-19', '2027-06-26')).toEqual([]);
    // The days either side of the range are open again.
    expect(slotsBetween(hall, 'Europe/London', '2027-06-12', '2027-06-12').map(local)).toEqual(['2027-06-12T10:00', '2027-06-12T10:30']);
    expect(slotsBetween(hall, 'Europe/London', '2027-06-29', '2027-06-29')).toHaveLength(4);
    expect(closedOn(hall, '2027-06-20')?.note).toBe('Summer fair');
    expect(closedOn(hall, '2027-06-27')).toBeNull();
  });

  it('returns slots in time order across days and never overlapping', () => {
    const slots = slotsBetween(hall, 'Europe/London', '2027-06-01', '2027-07-31');
    for (let i = 1; i < slots.length; i++) expect(slots[i].startMs).toBeGreaterThanOrEqual(slots[i - 1].endMs);
  });

  it('refuses overlapping spans, spans that end before they start, closures backwards and unknown zones', () => {
    expect(OpeningHoursSchema.safeParse({ mon: [{ from: '09:00', to: '11:00' }, { from: '10:30', to: '12:00' }] }).success).toBe(false);
    expect(OpeningHoursSchema.safeParse({ mon: [{ from: '11:00', to: '09:00' }] }).success).toBe(false);
    expect(OpeningHoursSchema.safeParse({ mon: [{ from: '9:00', to: '11:00' }] }).success).toBe(false);
    expect(OpeningHoursSchema.parse({ mon: [{ from: '09:00', to: '11:00' }, { from: '11:00', to: '12:00' }] }).sun).toEqual([]);
    expect(ClosureSchema.safeParse({ from: '2027-06-09', to: '2027-06-08' }).success).toBe(false);
    expect(ClosureSchema.safeParse({ from: '2027-02-30', to: '2027-03-01' }).success).toBe(false);
    expect(TimeZoneSchema.safeParse('Europe/London').success).toBe(true);
    expect(TimeZoneSchema.safeParse('Thimbleford/Centre').success).toBe(false);
  });
});
