import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { SlotView, SoonestSlotView } from '@shared/schemas/booking';
import { dropOffKeys } from './keys';

export interface Soonest {
  timeZone: string;
  soonest: SoonestSlotView[];
  nextBySite: Record<number, SlotView | null>;
}

export const getSoonest = () => api.get<Soonest>('/api/slots/soonest?limit=6');
export const soonestQueryOptions = () => queryOptions({ queryKey: dropOffKeys.soonest(), queryFn: getSoonest });
export function useSoonest() {
  return useQuery(soonestQueryOptions());
}
