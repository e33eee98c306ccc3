import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { Page } from '@shared/schemas/page';
import type { OutboxCounts, OutboxItem, OutboxShow } from '@shared/schemas/mail';
import { mailKeys } from './keys';

export const getOutbox = (show: OutboxShow, page: number) =>
  api.get<{ messages: Page<OutboxItem>; counts: OutboxCounts }>(`/api/mail/outbox?show=${show}&page=${page}&pageSize=10`);
export const outboxQueryOptions = (show: OutboxShow = 'unsent', page = 1) =>
  queryOptions({ queryKey: mailKeys.outbox(show, page), queryFn: () => getOutbox(show, page), refetchInterval: 5000, placeholderData: keepPreviousData });
export function useOutbox(show: OutboxShow = 'unsent', page = 1) {
  return useQuery(outboxQueryOptions(show, page));
}
