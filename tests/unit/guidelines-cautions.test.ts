import { describe, expect, it } from 'vitest';
import { POPULATIONS } from '@shared/schemas/blanket';
import { cautionsFor } from '@shared/guidelines/cautions';

const ids = (p: (typeof POPULATIONS)[number]) => cautionsFor(p).map((c) => c.id);

describe('cautionsFor', () => {
  it.each(POPULATIONS.map((p) => [p]))('%s: the facility-policy caution is always there', (p) => {
    const policy = cautionsFor(p).find((c) => c.id === 'facility-policy');
    expect(policy?.text).toContain("These are the drive's own guidelines");
    expect(policy?.text).toContain("receiving facility's policy and local rules");
  });

  it.each(['preemie', 'infant'] as const)('%s: safe sleep, small parts and cords', (p) => {
    expect(ids(p)).toEqual(
      expect.arrayContaining(['infant.supervised-only', 'infant.small-parts', 'infant.no-cords', 'facility-policy']),
    );
    const sleep = cautionsFor(p).find((c) => c.id === 'infant.supervised-only');
    expect(sleep?.text).toMatch(/tummy time/);
    expect(sleep?.text).toMatch(/sleep space/);
  });

  it('elders: trailing fringe and a hot wash', () => {
    expect(ids('elder')).toEqual(['elder.no-trailing-fringe', 'elder.hot-wash', 'facility-policy']);
    const fringe = cautionsFor('elder').find((c) => c.id === 'elder.no-trailing-fringe');
    expect(fringe?.text).toMatch(/wheelchair/);
    expect(fringe?.text).toMatch(/walker/);
  });

  it.each(['child', 'teen', 'adult'] as const)('%s: only the facility-policy caution', (p) => {
    expect(ids(p)).toEqual(['facility-policy']);
  });

  it('infant cautions are not shown for adults', () => {
    expect(ids('adult')).not.toContain('infant.small-parts');
  });

  it.each(POPULATIONS.map((p) => [p]))('%s: every caution has an id, a text and a source', (p) => {
    const list = cautionsFor(p);
    expect(new Set(list.map((c) => c.id)).size).toBe(list.length);
    for (const c of list) {
      expect(c.text.trim().length).toBeGreaterThan(20);
      expect(c.source.trim().length).toBeGreaterThan(0);
    }
  });

  it('returns copies, so a caller cannot change the next caller’s text', () => {
    const first = cautionsFor('infant');
    const sleep = first[0];
    if (sleep) sleep.text = 'changed';
    expect(cautionsFor('infant')[0]?.text).not.toBe('changed');
  });
});
