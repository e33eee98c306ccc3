import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { BlanketSummary } from '@shared/schemas/blanket-log';
import { blanketKeys } from './keys';

/** Every blanket of the drive; the server answers this in full to organisers and coordinators only. */
export const getAllBlankets = () => api.get<{ blankets: BlanketSummary[] }>('/api/blankets').then((r) => r.blankets);

export const allBlanketsQueryOptions = () => queryOptions({ queryKey: blanketKeys.list({ mine: false }), queryFn: getAllBlankets });

export function useAllBlankets() {
  return useQuery(allBlanketsQueryOptions());
}
