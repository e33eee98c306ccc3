import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { PledgeCreate, PledgeView } from '@shared/schemas/pledge';
import { pledgeKeys } from './keys';

export const createPledge = (body: PledgeCreate) => api.post<{ pledge: PledgeView }>('/api/pledges', body).then((r) => r.pledge);

/** `onChanged` lets the page refresh what else a pledge changes (the needs' counts). */
export function useCreatePledge(onChanged?: () => void) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: createPledge,
    onSettled: () => {
      void qc.invalidateQueries({ queryKey: pledgeKeys.all });
      onChanged?.();
    },
  });
}
