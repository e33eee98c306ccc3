import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { planKeys } from './keys';

export const deletePlan = (id: number) => api.delete<void>(`/api/plans/${id}`);

export function useDeletePlan() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: deletePlan, onSuccess: () => qc.invalidateQueries({ queryKey: planKeys.all }) });
}
