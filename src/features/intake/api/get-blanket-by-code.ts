import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { IntakeBlanketView } from '@shared/schemas/intake-views';
import type { CheckAnswer } from './check-blanket';
import { intakeKeys } from './keys';

export interface BlanketWithCheck {
  blanket: IntakeBlanketView;
  check: CheckAnswer | null;
}

export const getBlanketByCode = (code: string) => api.get<BlanketWithCheck>(`/api/blankets/by-code/${encodeURIComponent(code)}`);

export const blanketByCodeQueryOptions = (code: string) =>
  queryOptions({ queryKey: intakeKeys.byCode(code), queryFn: () => getBlanketByCode(code), enabled: code !== '' });

export function useBlanketByCode(code: string) {
  return useQuery(blanketByCodeQueryOptions(code));
}
