import { queryOptions, useQuery } from '@tanstack/react-query';
import { api, qs } from '@/lib/api-client';
import type { AssignmentView } from '@shared/schemas/assignment';
import type { Page } from '@shared/schemas/page';
import { MAX_PAGE_SIZE } from '@shared/schemas/page';
import { assignmentKeys } from './keys';

/** The live assignments of one need; a need wants at most a few dozen, so its first full page is all of them in practice. */
export const getNeedAssignments = (needId: number) => api.get<Page<AssignmentView>>(`/api/assignments${qs({ needId, pageSize: MAX_PAGE_SIZE })}`);

export const needAssignmentsQueryOptions = (needId: number, enabled: boolean) =>
  queryOptions({ queryKey: assignmentKeys.list(needId), queryFn: () => getNeedAssignments(needId), enabled });

export function useNeedAssignments(needId: number, enabled: boolean) {
  return useQuery(needAssignmentsQueryOptions(needId, enabled));
}
