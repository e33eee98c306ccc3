import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api, qs } from '@/lib/api-client';
import type { IntakeQueue } from '@shared/schemas/intake-views';
import { intakeKeys } from './keys';

/** Which page of the waiting and the expected lists to show; the day's lists come whole. */
export interface QueuePages {
  waitingPage: number;
  expectedPage: number;
}

export const getIntakeQueue = (siteId: number, date: string, pages: QueuePages) =>
  api.get<{ queue: IntakeQueue }>(`/api/intake/queue${qs({ siteId, date, ...pages })}`).then((r) => r.queue);

export const intakeQueueQueryOptions = (siteId: number | null, date: string, pages: QueuePages = { waitingPage: 1, expectedPage: 1 }) =>
  queryOptions({
    queryKey: intakeKeys.queue(siteId ?? 0, date, pages),
    queryFn: () => getIntakeQueue(siteId!, date, pages),
    enabled: siteId !== null,
    refetchInterval: 30_000,
    placeholderData: keepPreviousData,
  });

export function useIntakeQueue(siteId: number | null, date: string, pages?: QueuePages) {
  return useQuery(intakeQueueQueryOptions(siteId, date, pages));
}
