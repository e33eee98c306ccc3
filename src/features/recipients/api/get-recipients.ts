import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { RecipientView } from '@shared/schemas/recipient';
import { recipientKeys } from './keys';

export const getRecipients = (active: 'true' | 'false' | 'all' = 'all') =>
  api.get<{ recipients: RecipientView[] }>(`/api/recipients?active=${active}`).then((r) => r.recipients);

export const recipientsQueryOptions = (active: 'true' | 'false' | 'all' = 'all') =>
  queryOptions({ queryKey: recipientKeys.list(active), queryFn: () => getRecipients(active) });

export function useRecipients(active: 'true' | 'false' | 'all' = 'all') {
  return useQuery(recipientsQueryOptions(active));
}
