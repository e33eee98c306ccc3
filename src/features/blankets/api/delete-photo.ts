import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { blanketKeys } from './keys';

export const deletePhoto = ({ blanketId, photoId }: { blanketId: number; photoId: number }) =>
  api.delete<void>(`/api/blankets/${blanketId}/photos/${photoId}`);

export function useDeletePhoto() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: deletePhoto,
    onSettled: () => {
      void qc.invalidateQueries({ queryKey: blanketKeys.all });
    },
  });
}
