import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api, qs } from '@/lib/api-client';
import type { PledgeSort, PledgeStatus, PledgeView } from '@shared/schemas/pledge';
import { MAX_PAGE_SIZE, type Page } from '@shared/schemas/page';
import { pledgeKeys } from './keys';

export interface PledgeListParams {
  mine?: boolean;
  status?: PledgeStatus;
  q?: string;
  sort?: PledgeSort;
  dir?: 'asc' | 'desc';
  page?: number;
  pageSize?: number;
}

export const getPledges = (p: PledgeListParams) => api.get<Page<PledgeView>>(`/api/pledges${qs({ ...p })}`);

export const pledgesQueryOptions = (p: PledgeListParams) =>
  queryOptions({ queryKey: pledgeKeys.list(p), queryFn: () => getPledges(p), placeholderData: keepPreviousData });

/**
 * The signed-in person's own pledges, soonest due first (organisers would otherwise get everyone's):
 * one page of the most a page may hold, which is more than any one maker promises at a time.
 */
export const myPledgesQueryOptions = () =>
  queryOptions({
    queryKey: pledgeKeys.list({ mine: true, pageSize: MAX_PAGE_SIZE }),
    queryFn: () => getPledges({ mine: true, pageSize: MAX_PAGE_SIZE }),
    select: (p) => p.items,
  });

export function useMyPledges() {
  return useQuery(myPledgesQueryOptions());
}
