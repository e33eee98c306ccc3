import { describe, it, expect } from 'vitest';
import { US_TO_UK, US_TO_UK_REFERENCED, US_TO_UK_FROM_MEMORY, US_UK_SOURCE, usToUkText } from '@shared/sizing/stitch-names';

// Source: from memory (REFERENCES.md, crochet conventions; no handbook checked): US sc = UK dc, hdc = htr, dc = tr, tr = dtr.
describe('US ↔ UK stitch names (from memory)', () => {
  it('says where the names come from', () => {
    expect(US_UK_SOURCE).toMatch(/from memory/);
  });

  it.each([
    ['sc', 'dc'],
    ['hdc', 'htr'],
    ['dc', 'tr'],
    ['tr', 'dtr'],
  ] as const)('US ↔ UK stitch names: US %s = UK %s', (us, uk) => {
    expect(US_TO_UK_REFERENCED[us]).toBe(uk);
    expect(usToUkText(us)).toBe(uk);
  });

  it('US ↔ UK stitch names: only the four referenced pairs are in the referenced table', () => {
    expect(Object.keys(US_TO_UK_REFERENCED).sort()).toEqual(['dc', 'hdc', 'sc', 'tr']);
  });

  it('US dtr = UK trtr (from memory)', () => {
    expect(US_TO_UK_FROM_MEMORY.dtr).toBe('trtr');
    expect(US_TO_UK.dtr).toBe('trtr');
  });
});
