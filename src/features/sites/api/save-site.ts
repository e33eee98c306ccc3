import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { SiteView } from '@shared/schemas/site';
import { siteKeys } from './keys';

/** The site's own fields; its schedule is saved on its own (save-site-schedule.ts). */
export type SiteInput = Omit<SiteView, 'id' | 'openingHours' | 'slotMinutes' | 'slotCapacity' | 'closures'>;

/** Adds a site, or changes one when `id` is given. */
export const saveSite = ({ id, ...input }: SiteInput & { id?: number }) =>
  (id === undefined ? api.post<{ site: SiteView }>('/api/sites', input) : api.patch<{ site: SiteView }>(`/api/sites/${id}`, input)).then((r) => r.site);

export function useSaveSite() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: saveSite, onSettled: () => qc.invalidateQueries({ queryKey: siteKeys.all }) });
}
