import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { BlanketCreateInput, BlanketDetail } from '@shared/schemas/blanket-log';
import { blanketKeys } from './keys';

export const createBlanket = (body: BlanketCreateInput) =>
  api.post<{ id: number; code: string; status: string; blanket: BlanketDetail }>('/api/blankets', body).then((r) => r.blanket);

/** `onChanged` lets the page refresh what else a new blanket changes (its pledge's counts). */
export function useCreateBlanket(onChanged?: () => void) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: createBlanket,
    onSuccess: (b) => qc.setQueryData(blanketKeys.detail(b.id), b),
    onSettled: () => {
      void qc.invalidateQueries({ queryKey: blanketKeys.all });
      onChanged?.();
    },
  });
}
