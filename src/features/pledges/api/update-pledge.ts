import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { PledgeUpdate, PledgeView } from '@shared/schemas/pledge';
import { pledgeKeys } from './keys';

export const updatePledge = ({ id, ...body }: PledgeUpdate & { id: number }) =>
  api.patch<{ pledge: PledgeView }>(`/api/pledges/${id}`, body).then((r) => r.pledge);

export function useUpdatePledge(onChanged?: () => void) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: updatePledge,
    onSettled: () => {
      void qc.invalidateQueries({ queryKey: pledgeKeys.all });
      onChanged?.();
    },
  });
}
