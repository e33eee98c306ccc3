import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { dropOffKeys } from './keys';

export const getReminders = () => api.get<{ bookingReminders: boolean }>('/api/bookings/reminders');
export const remindersQueryOptions = () => queryOptions({ queryKey: dropOffKeys.reminders(), queryFn: getReminders });
export function useReminders() {
  return useQuery(remindersQueryOptions());
}

export const setReminders = (bookingReminders: boolean) => api.put<{ bookingReminders: boolean }>('/api/bookings/reminders', { bookingReminders });
export function useSetReminders() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: setReminders, onSettled: () => qc.invalidateQueries({ queryKey: dropOffKeys.reminders() }) });
}
