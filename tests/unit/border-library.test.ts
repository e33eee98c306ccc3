import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { BORDER_LIBRARY, borderById, borderDepthCm, instructionsUk, BORDER_YARN_ADVICE } from '@shared/border/library';
import { fitEdge } from '@shared/border/fit';
import { planBorder } from '@shared/border/plan';
import { EDGE_ORDER } from '@shared/border/round';
import { usToUkText, ukToUsText } from '@shared/sizing/stitch-names';
import { usLabelForMm } from '@shared/sizing/hooks';

const count = (text: string, token: string) =>
  (text.match(new RegExp(`(?<![A-Za-z])${token}(?![A-Za-z])`, 'gi')) ?? []).length;

describe('border library', () => {
  it('holds 6 to 8 borders with unique kebab-case ids and names', () => {
    expect(BORDER_LIBRARY.length).toBeGreaterThanOrEqual(6);
    expect(BORDER_LIBRARY.length).toBeLessThanOrEqual(8);
    const ids = BORDER_LIBRARY.map((b) => b.id);
    expect(new Set(ids).size).toBe(ids.length);
    expect(new Set(BORDER_LIBRARY.map((b) => b.name)).size).toBe(ids.length);
    for (const id of ids) expect(id).toMatch(/^[a-z0-9]+(-[a-z0-9]+)*$/);
  });

  it('gives every border sane numbers', () => {
    for (const b of BORDER_LIBRARY) {
      expect(Number.isInteger(b.multiple) && b.multiple >= 1).toBe(true);
      expect(Number.isInteger(b.offset) && b.offset >= 0).toBe(true);
      expect(b.lead).toBeLessThanOrEqual(Math.max(b.offset, 0) + b.multiple);
      expect(b.centre).toBeLessThan(b.multiple);
      expect(b.rounds).toBeGreaterThanOrEqual(1);
      expect(b.depthPerRoundCm).toBeGreaterThan(0);
      expect(b.yarnFactor).toBeGreaterThan(0);
      expect([1, 2, 3]).toContain(b.difficulty);
      expect(b.look.length).toBeGreaterThan(10);
      expect(b.look).not.toMatch(/\n/);
      expect(b.instructions).toMatch(/\.$/);
    }
    expect(borderById('plain-hdc-round')?.multiple).toBe(1);
    expect(borderById('crab-stitch-edge')).toMatchObject({ multiple: 1, offset: 0 });
    expect(borderById('no-such-border')).toBeUndefined();
    expect(borderDepthCm(borderById('plain-hdc-round')!)).toBe(2);
  });

  it('plain borders (multiple 1) need no change on any edge', () => {
    for (const b of BORDER_LIBRARY.filter((x) => x.multiple === 1)) {
      for (const n of [1, 7, 30, 123]) expect(fitEdge(n, b.multiple, b.offset).change).toBe(0);
      const p = planBorder({ across: 47, rows: { count: 31, pattern: ['dc'] }, multiple: b.multiple, offset: b.offset, lead: b.lead, centre: b.centre });
      for (const e of EDGE_ORDER) expect(p.edges[e]).toMatchObject({ change: 0, positions: [] });
    }
  });

  it('plans every library border on a sample blanket in both modes', () => {
    for (const b of BORDER_LIBRARY) {
      for (const mode of ['per-edge', 'continuous'] as const) {
        const p = planBorder({ across: 61, rows: 47, multiple: b.multiple, offset: b.offset, lead: b.lead, centre: b.centre, mode });
        expect(p.round.repeats).toBeGreaterThan(0);
        expect(p.cornerReport).toHaveLength(4);
      }
    }
  });

  it('the five-dc shell centres a shell on every corner when fitted per edge', () => {
    const shell = borderById('five-dc-shell')!;
    const p = planBorder({ across: 30, rows: 23, multiple: shell.multiple, offset: shell.offset, lead: shell.lead, centre: shell.centre });
    expect(p.cornerReport.every((c) => c.centred)).toBe(true);
  });

  it('recommends medium yarn with a 5 mm (H-8) hook', () => {
    expect(BORDER_YARN_ADVICE.yarnWeight).toBe(4);
    expect(usLabelForMm(BORDER_YARN_ADVICE.hookMm)).toBe('H-8');
    expect(BORDER_YARN_ADVICE.ruffleFix.yarnWeight).toBe(3);
  });
});

describe('UK terms', () => {
  it('converts a shell instruction without cascading', () => {
    expect(usToUkText('Ch 1, sc in same st, *skip next st, 5 dc in next st, skip next st, sc in next st')).toBe(
      'Ch 1, dc in same st, *skip next st, 5 tr in next st, skip next st, dc in next st',
    );
    expect(usToUkText('hdc, dc, tr, dtr, sc')).toBe('htr, tr, dtr, trtr, dc');
    expect(usToUkText('Sc in first st; SC2TOG; 4-dc bobble; reverse sc')).toBe('Dc in first st; DC2TOG; 4-tr bobble; reverse dc');
    // Words that merely contain the letters stay as they are.
    expect(usToUkText('scallop treble decrease describe')).toBe('scallop treble decrease describe');
  });

  it('keeps the number of each stitch in every library instruction', () => {
    for (const b of BORDER_LIBRARY) {
      const uk = instructionsUk(b);
      expect(count(uk, 'dc')).toBe(count(b.instructions, 'sc'));
      expect(count(uk, 'tr')).toBe(count(b.instructions, 'dc'));
      expect(count(uk, 'htr')).toBe(count(b.instructions, 'hdc'));
      expect(count(uk, 'dtr')).toBe(count(b.instructions, 'tr'));
      expect(count(uk, 'sc')).toBe(0);
      expect(count(uk, 'hdc')).toBe(0);
      expect(ukToUsText(uk)).toBe(b.instructions);
    }
  });

  it('round-trips any mix of stitch tokens', () => {
    const token = fc.constantFrom('sc', 'hdc', 'dc', 'tr', 'dtr', 'ch', 'sl st', '5', 'in next', ',', 'Sc', 'DC', 'sc2tog', 'scallop');
    fc.assert(
      fc.property(fc.array(token, { maxLength: 30 }), (parts) => {
        const us = parts.join(' ');
        expect(ukToUsText(usToUkText(us))).toBe(us);
      }),
    );
  });
});
