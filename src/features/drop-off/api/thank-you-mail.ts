import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { ThankYouPreference } from '@shared/schemas/user';
import { dropOffKeys } from './keys';

/** Whether the maker is e-mailed where their blankets went once a delivery run drops them off. */
export const getThankYouMail = () => api.get<ThankYouPreference>('/api/users/me/thank-you-mail');
export const thankYouMailQueryOptions = () => queryOptions({ queryKey: dropOffKeys.thankYou(), queryFn: getThankYouMail });
export function useThankYouMail() {
  return useQuery(thankYouMailQueryOptions());
}

export const setThankYouMail = (thankYouMail: boolean) => api.put<ThankYouPreference>('/api/users/me/thank-you-mail', { thankYouMail });
export function useSetThankYouMail() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: setThankYouMail, onSettled: () => qc.invalidateQueries({ queryKey: dropOffKeys.thankYou() }) });
}
