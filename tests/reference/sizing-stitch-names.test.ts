import { describe, it, expect } from 'vitest';
import { US_TO_UK, US_TO_UK_REFERENCED, US_TO_UK_FROM_MEMORY, usToUkText } from '@shared/sizing/stitch-names';

// Source: US ↔ UK stitch names (REFERENCES.md, crochet conventions): US sc = UK dc, hdc = htr, dc = tr, tr = dtr.
describe('US ↔ UK stitch names', () => {
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
