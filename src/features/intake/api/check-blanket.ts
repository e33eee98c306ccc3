import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { Caution } from '@shared/guidelines/cautions';
import type { BlanketFields, Population } from '@shared/schemas/blanket';
import type { GuidelineCheckResult, GuidelineSet } from '@shared/schemas/guidelines';
import { intakeKeys } from './keys';

export interface CheckAnswer extends GuidelineCheckResult {
  recipient: { id: number; name: string; population: Population; active: boolean };
  guidelines: GuidelineSet;
  cautions: Caution[];
}

export const checkBlanket = (recipientId: number, blanket: BlanketFields) => api.post<CheckAnswer>('/api/guidelines/check', { recipientId, blanket });

/** The check re-runs as the organiser corrects the log; the last answer stays on screen meanwhile. */
export const checkBlanketQueryOptions = (recipientId: number | null, blanket: BlanketFields) =>
  queryOptions({
    queryKey: intakeKeys.check(recipientId ?? 0, blanket),
    queryFn: () => checkBlanket(recipientId!, blanket),
    enabled: recipientId !== null,
    placeholderData: keepPreviousData,
    staleTime: 60_000,
  });

export function useCheckBlanket(recipientId: number | null, blanket: BlanketFields) {
  return useQuery(checkBlanketQueryOptions(recipientId, blanket));
}
