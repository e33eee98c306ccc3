import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { InspectionBody } from '@shared/schemas/intake';
import type { BlanketWithCheck } from './get-blanket-by-code';
import { intakeKeys } from './keys';

export const inspectBlanket = ({ id, ...body }: InspectionBody & { id: number }) => api.post<BlanketWithCheck>(`/api/blankets/${id}/inspection`, body);

export function useInspectBlanket() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: inspectBlanket,
    onSuccess: (r) => qc.setQueryData(intakeKeys.byCode(r.blanket.code), r),
    onSettled: () => qc.invalidateQueries({ queryKey: [...intakeKeys.all, 'queue'] }),
  });
}
