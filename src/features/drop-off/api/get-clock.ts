import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { dropOffKeys } from './keys';

export const getClock = () => api.get<{ timeZone: string; today: string }>('/api/drive/clock');
export const clockQueryOptions = () => queryOptions({ queryKey: dropOffKeys.clock(), queryFn: getClock, staleTime: 60_000 });
export function useClock() {
  return useQuery(clockQueryOptions());
}
