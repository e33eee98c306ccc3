import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { GuidelineSet } from '@shared/schemas/guidelines';
import type { RecipientView } from '@shared/schemas/recipient';
import { recipientKeys } from './keys';

export const putGuidelines = ({ id, guidelines, version }: { id: number; guidelines: GuidelineSet; version?: number }) =>
  api
    .put<{ recipient: RecipientView }>(`/api/recipients/${id}/guidelines${version === undefined ? '' : `?version=${version}`}`, guidelines)
    .then((r) => r.recipient);

export function usePutGuidelines() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: putGuidelines,
    onSuccess: (r) => qc.setQueryData(recipientKeys.detail(r.id), r),
    onSettled: () => qc.invalidateQueries({ queryKey: recipientKeys.all }),
  });
}
