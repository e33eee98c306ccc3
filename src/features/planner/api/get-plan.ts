import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { PlanDetail } from '@shared/schemas/plan';
import { planKeys } from './keys';

export const getPlan = (id: number) => api.get<{ plan: PlanDetail }>(`/api/plans/${id}`).then((r) => r.plan);
export const planQueryOptions = (id: number) => queryOptions({ queryKey: planKeys.detail(id), queryFn: () => getPlan(id) });

export function usePlan(id: number | null) {
  return useQuery({ ...planQueryOptions(id ?? 0), enabled: id !== null });
}
