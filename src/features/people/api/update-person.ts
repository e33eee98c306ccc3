import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { Role } from '@shared/schemas/user';
import { peopleKeys } from './keys';

export const updatePerson = ({ id, ...patch }: { id: number; role?: Role; active?: boolean }) =>
  api.patch<{ user: { id: number } }>(`/api/users/${id}`, patch);

export function useUpdatePerson() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: updatePerson, onSettled: () => qc.invalidateQueries({ queryKey: peopleKeys.all }) });
}
