import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';

export interface Drive {
  id: number;
  name: string;
  town: string;
  summary: string;
  startsOn: string;
  endsOn: string;
}

export const driveKeys = { all: ['drive'] as const };

export const getDrive = () => api.get<{ drive: Drive | null; volunteers: number }>('/api/drive');
export const driveQueryOptions = () => queryOptions({ queryKey: driveKeys.all, queryFn: getDrive, staleTime: 10 * 60_000 });
export function useDrive() {
  return useQuery(driveQueryOptions());
}
