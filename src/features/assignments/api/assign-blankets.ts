import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { AssignmentSource, AssignmentView, BatchResult } from '@shared/schemas/assignment';
import { assignmentKeys } from './keys';

export const assignBlanket = (pair: { blanketId: number; needId: number }) => api.post<{ assignment: AssignmentView }>('/api/assignments', pair);

export const assignBatch = (body: { pairs: Array<{ blanketId: number; needId: number }>; source: AssignmentSource }) =>
  api.post<BatchResult>('/api/assignments/batch', body);

/** Every assignment write changes the counts, the waiting list and the need lists: refresh the area. */
function useAssignmentMutation<A, R>(fn: (a: A) => Promise<R>) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: fn, onSettled: () => qc.invalidateQueries({ queryKey: assignmentKeys.all }) });
}

export const useAssignBlanket = () => useAssignmentMutation(assignBlanket);
export const useAssignBatch = () => useAssignmentMutation(assignBatch);

export const unassign = ({ id, reason }: { id: number; reason: string }) => api.delete<{ blanketId: number }>(`/api/assignments/${id}`, { reason });
export const useUnassign = () => useAssignmentMutation(unassign);

export const reassign = ({ id, needId }: { id: number; needId: number }) => api.patch<{ assignment: AssignmentView }>(`/api/assignments/${id}`, { needId });
export const useReassign = () => useAssignmentMutation(reassign);
