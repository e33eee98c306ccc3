import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { SiteView } from '@shared/schemas/site';
import { intakeKeys } from './keys';

/** The open drop-off sites an organiser can receive at. */
export const getIntakeSites = () => api.get<{ sites: SiteView[] }>('/api/sites?active=true').then((r) => r.sites);

export const intakeSitesQueryOptions = () => queryOptions({ queryKey: intakeKeys.sites(), queryFn: getIntakeSites, staleTime: 5 * 60_000 });

export function useIntakeSites() {
  return useQuery(intakeSitesQueryOptions());
}
