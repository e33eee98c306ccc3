import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api, qs } from '@/lib/api-client';
import type { WaitingBlanket } from '@shared/schemas/assignment';
import type { Page } from '@shared/schemas/page';
import { assignmentKeys, type BoardFilters } from './keys';

export const WAITING_PAGE_SIZE = 10;

export const getWaitingBlankets = (f: BoardFilters, page: number) =>
  api.get<Page<WaitingBlanket>>(`/api/assignments/board/waiting${qs({ ...f, page, pageSize: WAITING_PAGE_SIZE })}`);

export const waitingBlanketsQueryOptions = (f: BoardFilters, page: number) =>
  queryOptions({ queryKey: assignmentKeys.waiting(f, page), queryFn: () => getWaitingBlankets(f, page), placeholderData: keepPreviousData });

export function useWaitingBlankets(f: BoardFilters, page: number) {
  return useQuery(waitingBlanketsQueryOptions(f, page));
}
