import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { NeedCreate, NeedView } from '@shared/schemas/recipient';
import { recipientKeys } from './keys';

export interface SaveNeedInput {
  recipientId: number;
  /** Absent for a new need. */
  needId?: number;
  need: NeedCreate;
  version?: number;
}

/** Adds a need, or changes one when `needId` is given. */
export const saveNeed = ({ recipientId, needId, need, version }: SaveNeedInput) =>
  (needId === undefined
    ? api.post<{ need: NeedView }>(`/api/recipients/${recipientId}/needs`, need)
    : api.patch<{ need: NeedView }>(`/api/recipients/${recipientId}/needs/${needId}`, { ...need, version })
  ).then((r) => r.need);

export function useSaveNeed() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: saveNeed, onSettled: () => qc.invalidateQueries({ queryKey: recipientKeys.all }) });
}
