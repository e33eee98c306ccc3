import { queryOptions, useQuery } from '@tanstack/react-query';
import { api, qs } from '@/lib/api-client';
import type { PledgeView } from '@shared/schemas/pledge';
import { pledgeKeys } from './keys';

/** The signed-in person's own pledges (organisers would otherwise get everyone's). */
export const getMyPledges = () => api.get<{ pledges: PledgeView[] }>(`/api/pledges${qs({ mine: true })}`).then((r) => r.pledges);

export const myPledgesQueryOptions = () => queryOptions({ queryKey: pledgeKeys.list({ mine: true }), queryFn: getMyPledges });

export function useMyPledges() {
  return useQuery(myPledgesQueryOptions());
}
