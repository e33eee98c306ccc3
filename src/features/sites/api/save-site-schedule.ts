import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { SiteView } from '@shared/schemas/site';
import type { Closure, OpeningHours } from '@shared/schemas/schedule';
import { siteKeys } from './keys';

export interface SiteScheduleInput {
  id: number;
  openingHours: OpeningHours;
  slotMinutes: number;
  slotCapacity: number;
  closures: Closure[];
}

/** Opening hours, slot length, visits per slot and closures, saved together. */
export const saveSiteSchedule = ({ id, ...input }: SiteScheduleInput) => api.patch<{ site: SiteView }>(`/api/sites/${id}`, input).then((r) => r.site);

export function useSaveSiteSchedule() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: saveSiteSchedule, onSettled: () => qc.invalidateQueries({ queryKey: siteKeys.all }) });
}
