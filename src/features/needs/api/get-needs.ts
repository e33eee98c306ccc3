import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { OpenNeed } from '@shared/schemas/pledge';
import { needKeys } from './keys';

export const getNeeds = () => api.get<{ needs: OpenNeed[] }>('/api/needs').then((r) => r.needs);

export const needsQueryOptions = () => queryOptions({ queryKey: needKeys.list(), queryFn: getNeeds });

export function useNeeds() {
  return useQuery(needsQueryOptions());
}
