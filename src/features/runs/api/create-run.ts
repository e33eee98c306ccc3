import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { RunCreate, RunView } from '@shared/schemas/run';
import { runKeys } from './keys';

export const createRun = (input: RunCreate) => api.post<{ run: RunView }>('/api/runs', input).then((r) => r.run);

export function useCreateRun() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: createRun, onSettled: () => qc.invalidateQueries({ queryKey: runKeys.all }) });
}
