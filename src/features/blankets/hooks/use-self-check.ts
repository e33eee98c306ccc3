import { useMemo } from 'react';
import type { BlanketFields } from '@shared/schemas/blanket';
import type { GuidelineCheckResult } from '@shared/schemas/guidelines';
import type { RecipientBrief } from '@shared/schemas/pledge';
import { preload, usePreloaded } from '@/lib/lazy-zod-resolver';

export type SelfCheck =
  /** The check itself is still loading, a moment after the form has painted. */
  | { state: 'pending' }
  | { state: 'incomplete'; missing: string[] }
  | { state: 'checked'; recipient: RecipientBrief; result: GuidelineCheckResult }
  | { state: 'anywhere'; fits: Array<{ name: string }>; nearly: Array<{ name: string }> };

const selfCheck = preload(() => import('./self-check'));

/** The self-check on what the maker has typed so far, once the check has loaded (see ./self-check.ts). */
export function useSelfCheck(fields: Partial<BlanketFields>, recipient: RecipientBrief | null, others: RecipientBrief[]): SelfCheck {
  const loaded = usePreloaded(selfCheck);
  const key = JSON.stringify(fields);
  return useMemo(
    (): SelfCheck => (loaded ? loaded.runSelfCheck(fields, recipient, others) : { state: 'pending' }),
    // eslint-disable-next-line react-hooks/exhaustive-deps -- `key` stands for `fields`, which is a fresh object each render
    [key, recipient, others, loaded],
  );
}
