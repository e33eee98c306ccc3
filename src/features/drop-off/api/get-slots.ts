import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { SiteSlotsView } from '@shared/schemas/booking';
import { dropOffKeys } from './keys';

export const getSlots = (siteId: number, from: string, to: string) => api.get<SiteSlotsView>(`/api/sites/${siteId}/slots?from=${from}&to=${to}`);
export const slotsQueryOptions = (siteId: number, from: string, to: string) =>
  queryOptions({ queryKey: dropOffKeys.slots(siteId, from, to), queryFn: () => getSlots(siteId, from, to) });
export function useSlots(siteId: number | null, from: string, to: string) {
  return useQuery({ ...slotsQueryOptions(siteId ?? 0, from, to), enabled: siteId !== null });
}
