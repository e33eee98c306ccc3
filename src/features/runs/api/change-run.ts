import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { DeliverBody, RunView } from '@shared/schemas/run';
import { runKeys } from './keys';

/**
 * Every change to a run answers with the whole run, so one hook covers them: the page says which
 * change, and the answer replaces the cached run at once.
 */
export type RunChange =
  | { kind: 'route' }
  | { kind: 'order'; stopOrder: number[]; version: number }
  | { kind: 'pack'; stopId: number; boxes?: Array<{ blanketId: number; box: number }> }
  | { kind: 'unpack'; stopId: number; reason: string }
  | { kind: 'deliver'; stopId: number; body: DeliverBody }
  | { kind: 'undeliver'; stopId: number; reason: string };

async function send(runId: number, c: RunChange): Promise<RunView> {
  const base = `/api/runs/${runId}`;
  const res = await (() => {
    switch (c.kind) {
      case 'route':
        return api.post<{ run: RunView }>(`${base}/route`);
      case 'order':
        return api.patch<{ run: RunView }>(base, { stopOrder: c.stopOrder, version: c.version });
      case 'pack':
        return api.post<{ run: RunView }>(`${base}/stops/${c.stopId}/packed`, { boxes: c.boxes ?? [] });
      case 'unpack':
        return api.delete<{ run: RunView }>(`${base}/stops/${c.stopId}/packed`, { reason: c.reason });
      case 'deliver':
        return api.post<{ run: RunView }>(`${base}/stops/${c.stopId}/delivered`, c.body);
      case 'undeliver':
        return api.delete<{ run: RunView }>(`${base}/stops/${c.stopId}/delivered`, { reason: c.reason });
    }
  })();
  return res.run;
}

export function useChangeRun(runId: number) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (c: RunChange) => send(runId, c),
    onSuccess: (run) => qc.setQueryData(runKeys.detail(runId), run),
    onSettled: () => qc.invalidateQueries({ queryKey: runKeys.all }),
  });
}
