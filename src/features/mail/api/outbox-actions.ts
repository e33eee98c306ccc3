import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { OutboxItem } from '@shared/schemas/mail';
import { mailKeys } from './keys';

export const sendAgain = (id: number) => api.post<{ message: OutboxItem }>(`/api/mail/outbox/${id}/send-again`);
export const giveUp = (id: number) => api.post<{ message: OutboxItem }>(`/api/mail/outbox/${id}/give-up`);

export function useSendAgain() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: sendAgain, onSettled: () => qc.invalidateQueries({ queryKey: mailKeys.all }) });
}
export function useGiveUp() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: giveUp, onSettled: () => qc.invalidateQueries({ queryKey: mailKeys.all }) });
}
