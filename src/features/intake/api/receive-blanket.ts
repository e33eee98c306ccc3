import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { IntakeBody } from '@shared/schemas/intake';
import type { BlanketWithCheck } from './get-blanket-by-code';
import { intakeKeys } from './keys';

export const receiveBlanket = ({ id, ...body }: IntakeBody & { id: number }) => api.post<BlanketWithCheck>(`/api/blankets/${id}/intake`, body);

export function useReceiveBlanket() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: receiveBlanket,
    onSuccess: (r) => qc.setQueryData(intakeKeys.byCode(r.blanket.code), r),
    onSettled: () => qc.invalidateQueries({ queryKey: [...intakeKeys.all, 'queue'] }),
  });
}
