import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { RecipientView } from '@shared/schemas/recipient';
import { intakeKeys } from './keys';

export type IntakeRecipient = Pick<RecipientView, 'id' | 'name' | 'population' | 'kind'>;

/** The recipients a blanket can be checked against or sent to. */
export const getIntakeRecipients = () =>
  api
    .get<{ recipients: RecipientView[] }>('/api/recipients?active=true')
    .then((r) => r.recipients.map(({ id, name, population, kind }): IntakeRecipient => ({ id, name, population, kind })));

export const intakeRecipientsQueryOptions = () => queryOptions({ queryKey: intakeKeys.recipients(), queryFn: getIntakeRecipients, staleTime: 5 * 60_000 });

export function useIntakeRecipients() {
  return useQuery(intakeRecipientsQueryOptions());
}
