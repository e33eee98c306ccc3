import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { SiteView } from '@shared/schemas/site';
import { siteKeys } from './keys';

export const getSites = (active: 'true' | 'false' | 'all' = 'all') => api.get<{ sites: SiteView[] }>(`/api/sites?active=${active}`).then((r) => r.sites);

export const sitesQueryOptions = (active: 'true' | 'false' | 'all' = 'all') => queryOptions({ queryKey: siteKeys.list(active), queryFn: () => getSites(active) });

export function useSites(active: 'true' | 'false' | 'all' = 'all') {
  return useQuery(sitesQueryOptions(active));
}
