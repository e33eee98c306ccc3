import fs from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { describeEvent, type HistoryEvent } from '../../src/components/ui/blanket-history';
import { STATUS_TONES } from '../../src/components/ui/status-badge';
import { formatDay, formatMoment } from '../../src/components/ui/format-day';
import { BLANKET_STATUSES } from '@shared/schemas/blanket';

const event = (patch: Partial<HistoryEvent>): HistoryEvent => ({
  id: 1, kind: 'status', fromStatus: null, toStatus: null, reason: null, data: null, createdAt: '2027-01-06T14:05:00Z', actor: null, ...patch,
});

/** Every event kind the server writes, read from its sources so a new kind cannot slip through unworded. */
function serverEventKinds(): string[] {
  const kinds = new Set<string>();
  const walk = (dir: string) => {
    for (const f of fs.readdirSync(dir, { withFileTypes: true })) {
      const p = path.join(dir, f.name);
      if (f.isDirectory()) walk(p);
      else if (p.endsWith('.ts')) {
        const text = fs.readFileSync(p, 'utf8');
        if (!/BlanketEvent|moveBlanket/.test(text)) continue;
        for (const m of text.matchAll(/kind: '([a-z]+(?:-[a-z]+)*)'/g)) kinds.add(m[1]!);
      }
    }
  };
  walk('server/modules');
  return [...kinds];
}

describe('one history, one badge, one date format', () => {
  it('words every kind of history step; never shows a raw kind such as "photos-added"', () => {
    expect(describeEvent(event({ kind: 'photos-added', data: { photoIds: [3, 4] } }))).toBe('2 photos added');
    const kinds = serverEventKinds();
    expect(kinds).toContain('photos-added');
    for (const kind of kinds) {
      const words = describeEvent(event({ kind }));
      expect(words, kind).not.toBe(kind);
      expect(words, kind).not.toMatch(/^[a-z]+-[a-z-]+$/);
    }
  });

  it('names a status move with both statuses', () => {
    expect(describeEvent(event({ kind: 'intake', fromStatus: 'booked', toStatus: 'received' }))).toBe('Drop-off booked → Received');
  });

  it('gives every status one tone: received waits (sky), a fix is asked for (marigold), declined (brick)', () => {
    for (const s of BLANKET_STATUSES) expect(STATUS_TONES[s], s).toBeDefined();
    expect(STATUS_TONES.received).toBe('sky');
    expect(STATUS_TONES.needs_fix).toBe('marigold');
    expect(STATUS_TONES.declined).toBe('brick');
  });

  it('writes days as "6 Jan 2027" and moments as "6 Jan 2027, hh:mm"', () => {
    expect(formatDay('2027-01-06')).toBe('6 Jan 2027');
    expect(formatMoment('2027-01-06T14:05:00Z')).toMatch(/^6 Jan 2027, \d\d:\d\d$/);
  });

  it('no page formats dates its own way: every date goes through format-day', () => {
    const offenders: string[] = [];
    const walk = (dir: string) => {
      for (const f of fs.readdirSync(dir, { withFileTypes: true })) {
        const p = path.join(dir, f.name);
        if (f.isDirectory()) walk(p);
        else if (/\.tsx?$/.test(p) && !p.endsWith('format-day.ts')) {
          const text = fs.readFileSync(p, 'utf8');
          if (/toLocaleDateString\(|toLocaleString\(undefined|month: 'long'/.test(text)) offenders.push(p);
        }
      }
    };
    walk('src');
    expect(offenders).toEqual([]);
  });
});

describe("charts keep recipients' names whole", () => {
  it('wraps a long name on whole words instead of cutting it', async () => {
    const { wrapName } = await import('../../src/features/progress/components/progress-data');
    expect(wrapName("Bramblewick Children's Ward, Thimbleford General")).toEqual(['Bramblewick', "Children's Ward,", 'Thimbleford General']);
    expect(wrapName('Tansy Court Care Home')).toEqual(['Tansy Court Care', 'Home']);
    expect(wrapName('Kestrel Rise Hospice')).toEqual(['Kestrel Rise Hospice']);
    const long = wrapName('A very long name of a place that goes on and on for ever and ever');
    expect(long).toHaveLength(3);
    expect(long[2]).toMatch(/…$/);
  });
});
