import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { BlanketTag } from '@shared/schemas/intake-views';
import { intakeKeys } from './keys';

export const getTags = (ids: number[]) => api.get<{ tags: BlanketTag[] }>(`/api/blankets/tags?ids=${ids.join(',')}`).then((r) => r.tags);

export const tagsQueryOptions = (ids: number[]) => queryOptions({ queryKey: intakeKeys.tags(ids), queryFn: () => getTags(ids), enabled: ids.length > 0 });

export function useTags(ids: number[]) {
  return useQuery(tagsQueryOptions(ids));
}
