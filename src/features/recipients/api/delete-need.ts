import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { recipientKeys } from './keys';

export const deleteNeed = ({ recipientId, needId }: { recipientId: number; needId: number }) =>
  api.delete<void>(`/api/recipients/${recipientId}/needs/${needId}`);

export function useDeleteNeed() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: deleteNeed, onSettled: () => qc.invalidateQueries({ queryKey: recipientKeys.all }) });
}
