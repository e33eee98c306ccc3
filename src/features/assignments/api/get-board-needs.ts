import { queryOptions, useQuery } from '@tanstack/react-query';
import { api, qs } from '@/lib/api-client';
import type { BoardNeeds } from '@shared/schemas/assignment';
import { assignmentKeys, type BoardFilters } from './keys';

export const getBoardNeeds = (f: BoardFilters) =>
  api.get<BoardNeeds>(`/api/assignments/board/needs${qs({ recipientId: f.recipientId, sizeCategory: f.sizeCategory })}`).then((r) => r.needs);

export const boardNeedsQueryOptions = (f: BoardFilters) => queryOptions({ queryKey: assignmentKeys.needs(f), queryFn: () => getBoardNeeds(f) });

export function useBoardNeeds(f: BoardFilters) {
  return useQuery(boardNeedsQueryOptions(f));
}
