import { queryOptions, useQuery } from '@tanstack/react-query';
import { api, qs } from '@/lib/api-client';
import type { BlanketSummary } from '@shared/schemas/blanket-log';
import { blanketKeys } from './keys';

export const getMyBlankets = () => api.get<{ blankets: BlanketSummary[] }>(`/api/blankets${qs({ mine: true })}`).then((r) => r.blankets);

export const myBlanketsQueryOptions = () => queryOptions({ queryKey: blanketKeys.list({ mine: true }), queryFn: getMyBlankets });

export function useMyBlankets() {
  return useQuery(myBlanketsQueryOptions());
}
