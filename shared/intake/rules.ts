import type { BlanketStatus } from '../schemas/blanket';
import type { GuidelineCheckResult, GuidelineSet } from '../schemas/guidelines';
import type { Checklist, InspectionOutcome } from '../schemas/intake';

/**
 * The intake table's rules: what may be received, what the organiser looks at, and the outcome the
 * table suggests from what they found. Pure and shared, so the inspection panel shows the same
 * suggestion the server records.
 */

/** Statuses a blanket may be received from: a drop-off without a booking is normal, and a mended one comes back. */
export const RECEIVABLE_STATUSES = ['finished', 'booked', 'needs_fix'] as const satisfies readonly BlanketStatus[];

/** What an organiser looks at on the table, in the order they usually look. */
export const CHECKLIST_ITEMS = [
  {
    key: 'endsWovenIn',
    label: 'Ends woven in',
    fix: 'Weave in the loose yarn ends securely, so none can be pulled out.',
  },
  {
    key: 'noFingertipHoles',
    label: 'No holes a fingertip passes through',
    fix: 'Close the holes a fingertip can pass through (often a dropped or missed stitch).',
  },
  {
    key: 'nothingLoose',
    label: 'Nothing loose or coming apart',
    fix: 'Secure the loose or unravelling parts so nothing can come away.',
  },
  { key: 'clean', label: 'Clean', fix: 'Wash it as the yarn label says and let it dry fully.' },
  {
    key: 'noSmokeOrPetOdour',
    label: 'No smoke or pet odour',
    fix: 'Wash it and air it well away from smoke and pets.',
  },
  { key: 'matchesLog', label: 'Matches its log', fix: null },
] as const;
export type ChecklistKey = (typeof CHECKLIST_ITEMS)[number]['key'];

export const OUTCOME_LABELS: Record<InspectionOutcome, string> = {
  checked: 'Checked, ready to go',
  needs_fix: 'Back to the maker for a fix',
  declined: 'Declined',
  redirect: 'Send to another recipient',
};

export interface Suggestion {
  outcome: InspectionOutcome;
  /** Set when the suggestion is to redirect: the first recipient that takes it as it is. */
  redirectRecipientId: number | null;
  /** Plain reasons for the suggestion, checklist first, then the guideline check. */
  because: string[];
  /** What the maker could put right at home, whatever the outcome; the fix e-mail lists these. */
  fixes: string[];
}

/**
 * The outcome the table suggests from the checklist and the guideline check. Odour is the one
 * checklist failure a wash rarely cures, so where the unit wants smoke-free or pet-free homes it
 * means decline; the other checklist failures the maker can put right. Otherwise the check's own
 * verdict decides: ready → checked, mend → needs_fix, reroute → redirect when another recipient
 * takes it as it is (a fix first when it only fits elsewhere after one), decline → declined.
 */
export function suggestOutcome(
  checklist: Checklist,
  result: GuidelineCheckResult,
  guidelines: Pick<GuidelineSet, 'requireSmokeFree' | 'requirePetFree'>,
): Suggestion {
  const failed = CHECKLIST_ITEMS.filter((item) => !checklist[item.key]);
  const because: string[] = failed.map((item) => `Not so: ${item.label.toLowerCase()}.`);
  because.push(...result.reasons.map((r) => r.message));

  const odourFails = !checklist.noSmokeOrPetOdour;
  const checklistFixes = failed.flatMap((item): string[] => (item.fix === null ? [] : [item.fix]));
  const ruleFixes = result.reasons.map((r) => r.fix).filter((f): f is string => f !== undefined);
  const fixes = [...checklistFixes, ...ruleFixes];

  if (odourFails && (guidelines.requireSmokeFree || guidelines.requirePetFree)) {
    return { outcome: 'declined', redirectRecipientId: null, because, fixes };
  }

  if (checklistFixes.length > 0 && result.verdict !== 'decline') {
    return { outcome: 'needs_fix', redirectRecipientId: null, because, fixes };
  }
  switch (result.verdict) {
    case 'ready':
      return { outcome: 'checked', redirectRecipientId: null, because, fixes };
    case 'mend':
      return { outcome: 'needs_fix', redirectRecipientId: null, because, fixes };
    case 'reroute': {
      const first = result.alsoFits[0];
      if (first) return { outcome: 'redirect', redirectRecipientId: first.recipientId, because, fixes };
      const afterMend = result.alsoFitsAfterMend[0];
      return {
        outcome: 'needs_fix',
        redirectRecipientId: null,
        because: afterMend ? [...because, `After the fix it would suit ${afterMend.name}.`] : because,
        fixes,
      };
    }
    case 'decline':
      return { outcome: 'declined', redirectRecipientId: null, because, fixes };
  }
}

/** What the drop-off table found, in the words the maker reads: the checklist first, then the guidelines. */
export function findingsOf(checklist: Partial<Checklist> | null | undefined, ruleMessages: readonly string[]): string[] {
  const failed = CHECKLIST_ITEMS.filter((item) => checklist && checklist[item.key] === false);
  return [...failed.map((item) => `Not so: ${item.label.toLowerCase()}.`), ...ruleMessages];
}
