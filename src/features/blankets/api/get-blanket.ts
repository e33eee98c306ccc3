import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { BlanketDetail } from '@shared/schemas/blanket-log';
import { blanketKeys } from './keys';

export const getBlanket = (id: number) => api.get<{ blanket: BlanketDetail }>(`/api/blankets/${id}`).then((r) => r.blanket);

export const blanketQueryOptions = (id: number) => queryOptions({ queryKey: blanketKeys.detail(id), queryFn: () => getBlanket(id) });

export function useBlanket(id: number) {
  return useQuery(blanketQueryOptions(id));
}
