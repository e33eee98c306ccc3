import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { PledgeView } from '@shared/schemas/pledge';
import { pledgeKeys } from './keys';

export const cancelPledge = (id: number) => api.delete<{ pledge: PledgeView }>(`/api/pledges/${id}`).then((r) => r.pledge);

export function useCancelPledge(onChanged?: () => void) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: cancelPledge,
    onSettled: () => {
      void qc.invalidateQueries({ queryKey: pledgeKeys.all });
      onChanged?.();
    },
  });
}
