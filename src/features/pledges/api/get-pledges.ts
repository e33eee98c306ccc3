import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api, qs } from '@/lib/api-client';
import type { PledgePage, PledgeSort, PledgeStatus } from '@shared/schemas/pledge';
import { MAX_PAGE_SIZE } from '@shared/schemas/page';
import { pledgeKeys } from './keys';

export interface PledgeListParams {
  mine?: boolean;
  status?: PledgeStatus;
  /** The filters behind the pledged figures of the drive at a glance. */
  needId?: number;
  promising?: boolean;
  from?: string;
  to?: string;
  q?: string;
  sort?: PledgeSort;
  dir?: 'asc' | 'desc';
  page?: number;
  pageSize?: number;
}

export const getPledges = (p: PledgeListParams) => api.get<PledgePage>(`/api/pledges${qs({ ...p })}`);

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

/** One page of everyone's pledges, for staff, with the filters the page holds. */
export function usePledges(p: PledgeListParams) {
  return useQuery(pledgesQueryOptions(p));
}
