import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { RecipientView } from '@shared/schemas/recipient';
import { recipientKeys } from './keys';

export const getRecipient = (id: number) => api.get<{ recipient: RecipientView }>(`/api/recipients/${id}`).then((r) => r.recipient);

export const recipientQueryOptions = (id: number) => queryOptions({ queryKey: recipientKeys.detail(id), queryFn: () => getRecipient(id) });

export function useRecipient(id: number) {
  return useQuery(recipientQueryOptions(id));
}
