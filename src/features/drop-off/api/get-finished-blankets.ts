import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { Page } from '@shared/schemas/page';
import type { BlanketSummary } from '@shared/schemas/blanket-log';
import { dropOffKeys } from './keys';

/** The maker's finished blankets: the ones a drop-off can bring. */
export const getFinishedBlankets = () => api.get<Page<BlanketSummary>>('/api/blankets?status=finished&pageSize=100').then((p) => p.items);
export const finishedBlanketsQueryOptions = () => queryOptions({ queryKey: dropOffKeys.finished(), queryFn: getFinishedBlankets });
export function useFinishedBlankets() {
  return useQuery(finishedBlanketsQueryOptions());
}
