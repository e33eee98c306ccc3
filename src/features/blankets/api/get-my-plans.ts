import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { PlanListItem } from '@shared/schemas/plan';
import { blanketKeys } from './keys';

/** The maker's saved border plans, to attach one to the blanket it was made from. */
export const getMyPlans = () => api.get<{ plans: PlanListItem[] }>('/api/plans').then((r) => r.plans);

export const myPlansQueryOptions = () => queryOptions({ queryKey: blanketKeys.plans(), queryFn: getMyPlans });

export function useMyPlans() {
  return useQuery(myPlansQueryOptions());
}
