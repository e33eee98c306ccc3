import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { RunView } from '@shared/schemas/run';
import { runKeys } from './keys';

export const getRun = (id: number) => api.get<{ run: RunView }>(`/api/runs/${id}`).then((r) => r.run);

export const runQueryOptions = (id: number) => queryOptions({ queryKey: runKeys.detail(id), queryFn: () => getRun(id) });

export function useRun(id: number) {
  return useQuery(runQueryOptions(id));
}
