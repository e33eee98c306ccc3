import { describe, it, expect } from 'vitest';
import {
  WORSTED_YARDS_PER_SQ_IN,
  WORSTED_YARDS_PER_SQ_IN_SOURCE,
  YARN_PER_AREA,
  YARN_PER_AREA_SCALING_SOURCE,
} from '@shared/sizing/yarn-estimate';

describe('yarn per area', () => {
  // Source: from memory — about 0.87 yd of worsted per square inch of sc/hdc/dc at 5 mm, recalled
  // from one maker's published measurements that we cannot name. A rule of thumb, not a standard.
  it('about 0.87 yd of worsted per square inch at 5 mm (from memory: a rule of thumb)', () => {
    expect(WORSTED_YARDS_PER_SQ_IN).toBe(0.87);
    expect(WORSTED_YARDS_PER_SQ_IN_SOURCE).toMatch(/^from memory/);
    expect(WORSTED_YARDS_PER_SQ_IN_SOURCE).toMatch(/rule of thumb/);
    expect(YARN_PER_AREA.find((r) => r.category === 4)!.yardsPerSqIn).toBe(0.87);
  });

  it('other weights are scaled from it: common practice (no published source)', () => {
    expect(YARN_PER_AREA_SCALING_SOURCE).toMatch(/common practice \(no published source\)/);
    for (const row of YARN_PER_AREA.filter((r) => r.category !== 4)) expect(row.basis).toBe('scaled estimate');
  });
});
