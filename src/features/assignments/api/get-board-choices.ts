import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { SiteView } from '@shared/schemas/site';
import type { RecipientView } from '@shared/schemas/recipient';
import { assignmentKeys } from './keys';

/** The drop-off sites and active recipients the board's filters offer. */
export const getBoardChoices = async () => {
  const [sites, recipients] = await Promise.all([
    api.get<{ sites: SiteView[] }>('/api/sites').then((r) => r.sites),
    api.get<{ recipients: RecipientView[] }>('/api/recipients?active=true').then((r) => r.recipients),
  ]);
  return { sites, recipients };
};

export const boardChoicesQueryOptions = () => queryOptions({ queryKey: assignmentKeys.choices(), queryFn: getBoardChoices, staleTime: 5 * 60_000 });

export function useBoardChoices() {
  return useQuery(boardChoicesQueryOptions());
}
