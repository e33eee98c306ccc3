import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { PlanDetail, PlanInputDraft } from '@shared/schemas/plan';
import { planKeys } from './keys';

export const createPlan = (body: { name: string; input: PlanInputDraft }) =>
  api.post<{ plan: PlanDetail }>('/api/plans', body).then((r) => r.plan);

export function useCreatePlan() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: createPlan, onSuccess: () => qc.invalidateQueries({ queryKey: planKeys.all }) });
}
