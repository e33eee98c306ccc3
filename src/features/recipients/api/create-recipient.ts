import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { RecipientView } from '@shared/schemas/recipient';
import { recipientKeys } from './keys';

export type RecipientInput = Omit<RecipientView, 'id' | 'version' | 'guidelines' | 'guidelineSummary' | 'needs'>;

export const createRecipient = (input: RecipientInput) => api.post<{ recipient: RecipientView }>('/api/recipients', input).then((r) => r.recipient);

export function useCreateRecipient() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: createRecipient, onSuccess: () => qc.invalidateQueries({ queryKey: recipientKeys.all }) });
}
