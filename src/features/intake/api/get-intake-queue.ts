import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { IntakeQueue } from '@shared/schemas/intake';
import { intakeKeys } from './keys';

export const getIntakeQueue = (siteId: number, date: string) => api.get<{ queue: IntakeQueue }>(`/api/intake/queue?siteId=${siteId}&date=${date}`).then((r) => r.queue);

export const intakeQueueQueryOptions = (siteId: number | null, date: string) =>
  queryOptions({ queryKey: intakeKeys.queue(siteId ?? 0, date), queryFn: () => getIntakeQueue(siteId!, date), enabled: siteId !== null, refetchInterval: 30_000 });

export function useIntakeQueue(siteId: number | null, date: string) {
  return useQuery(intakeQueueQueryOptions(siteId, date));
}
