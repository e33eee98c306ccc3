import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { WaitingRecipient } from '@shared/schemas/run';
import { runKeys } from './keys';

export const getWaiting = () => api.get<{ recipients: WaitingRecipient[] }>('/api/runs/waiting').then((r) => r.recipients);

export const waitingQueryOptions = () => queryOptions({ queryKey: runKeys.waiting(), queryFn: getWaiting });

export function useWaiting() {
  return useQuery(waitingQueryOptions());
}
