import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { Page } from '@shared/schemas/page';
import type { RunSummary } from '@shared/schemas/run';
import { runKeys } from './keys';

export type RunsWhen = 'upcoming' | 'past';

export const getRuns = (when: RunsWhen, page: number) => api.get<Page<RunSummary>>(`/api/runs?when=${when}&page=${page}&pageSize=10`);

export const runsQueryOptions = (when: RunsWhen, page: number) =>
  queryOptions({ queryKey: runKeys.list(when, page), queryFn: () => getRuns(when, page), placeholderData: keepPreviousData });

export function useRuns(when: RunsWhen, page: number) {
  return useQuery(runsQueryOptions(when, page));
}
