import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import type { Checklist } from '@shared/schemas/intake';
import { suggestOutcome, CHECKLIST_ITEMS } from '@shared/intake/rules';
import { check } from '@shared/guidelines/check';
import { defaultGuidelines } from '@shared/guidelines/defaults';
import { allGoodChecklist as allGood, plainBlanket } from '../fixtures/blankets';

const infant = defaultGuidelines('infant');
const child = defaultGuidelines('child');
const adult = defaultGuidelines('adult');
const crib = plainBlanket({ widthCm: 85, lengthCm: 105 });
const others = [{ recipientId: 2, name: 'Ward', guidelines: child }];

describe('the outcome the intake table suggests', () => {
  it('passes a clean blanket that meets the guidelines', () => {
    const s = suggestOutcome(allGood, check(crib, infant, others, { recipientId: 1 }), infant);
    expect(s).toMatchObject({ outcome: 'checked', redirectRecipientId: null, fixes: [] });
  });

  it('sends fringe on an infant blanket back for a fix, with the fix in the maker\'s words', () => {
    const s = suggestOutcome(allGood, check({ ...crib, features: ['fringe'] }, infant, others, { recipientId: 1 }), infant);
    expect(s.outcome).toBe('needs_fix');
    expect(s.fixes.join(' ')).toMatch(/fringe/i);
  });

  it('redirects what fails here for a reason the maker cannot fix but fits elsewhere as it is', () => {
    const woolly = { ...crib, fibres: ['wool' as const] };
    const s = suggestOutcome(allGood, check(woolly, infant, [{ recipientId: 3, name: 'Hospice', guidelines: adult }], { recipientId: 1 }), infant);
    expect(s).toMatchObject({ outcome: 'redirect', redirectRecipientId: 3 });
  });

  it('declines what nobody takes', () => {
    const s = suggestOutcome(allGood, check({ ...crib, machineWashable: false }, infant, others, { recipientId: 1 }), infant);
    expect(s.outcome).toBe('declined');
  });

  it('declines an odour where the unit wants smoke-free or pet-free homes, but asks for a wash where it does not', () => {
    const smelly = { ...allGood, noSmokeOrPetOdour: false };
    expect(suggestOutcome(smelly, check(crib, infant), infant).outcome).toBe('declined');
    const relaxed = { ...adult, requireSmokeFree: false, requirePetFree: false };
    const s = suggestOutcome(smelly, check({ ...crib, widthCm: 120, lengthCm: 150 }, relaxed), relaxed);
    expect(s.outcome).toBe('needs_fix');
    expect(s.fixes.join(' ')).toMatch(/Wash it/);
  });

  it('turns every fixable checklist failure into a fix, whatever else is true', () => {
    const fixable = CHECKLIST_ITEMS.filter((i) => i.fix !== null && i.key !== 'noSmokeOrPetOdour');
    fc.assert(
      fc.property(fc.subarray(fixable.map((i) => i.key), { minLength: 1 }), (keys) => {
        const list = { ...allGood, ...Object.fromEntries(keys.map((k) => [k, false])) } as Checklist;
        const s = suggestOutcome(list, check(crib, infant), infant);
        expect(s.outcome).toBe('needs_fix');
        expect(s.fixes).toHaveLength(keys.length);
        expect(s.because).toHaveLength(keys.length);
      }),
    );
  });
});
