import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { RecipientView } from '@shared/schemas/recipient';
import type { RecipientInput } from './create-recipient';
import { recipientKeys } from './keys';

export const updateRecipient = ({ id, ...patch }: Partial<RecipientInput> & { id: number; version?: number }) =>
  api.patch<{ recipient: RecipientView }>(`/api/recipients/${id}`, patch).then((r) => r.recipient);

export function useUpdateRecipient() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: updateRecipient,
    onSuccess: (r) => qc.setQueryData(recipientKeys.detail(r.id), r),
    onSettled: () => qc.invalidateQueries({ queryKey: recipientKeys.all }),
  });
}
