import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { PlanListItem } from '@shared/schemas/plan';
import { planKeys } from './keys';

export const getPlans = () => api.get<{ plans: PlanListItem[] }>('/api/plans').then((r) => r.plans);
export const plansQueryOptions = () => queryOptions({ queryKey: planKeys.list(), queryFn: getPlans });

/** Only asked for when someone is signed in: for a visitor the answer is always 401. */
export function usePlans(enabled: boolean) {
  return useQuery({ ...plansQueryOptions(), enabled });
}
