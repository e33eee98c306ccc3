import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { BlanketDetail, BlanketUpdate } from '@shared/schemas/blanket-log';
import { blanketKeys } from './keys';

export const updateBlanket = ({ id, ...body }: BlanketUpdate & { id: number }) =>
  api.patch<{ blanket: BlanketDetail }>(`/api/blankets/${id}`, body).then((r) => r.blanket);

/** Edits the log or moves the status; both answer with the whole blanket, which replaces the cached one. */
export function useUpdateBlanket(onChanged?: () => void) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: updateBlanket,
    onSuccess: (b) => qc.setQueryData(blanketKeys.detail(b.id), b),
    onSettled: () => {
      void qc.invalidateQueries({ queryKey: blanketKeys.all });
      onChanged?.();
    },
  });
}
