import type { SizeCategory } from '@shared/schemas/blanket';

/** Filters the board reads with; the same object keys the needs, the waiting list and the suggestion. */
export interface BoardFilters {
  siteId?: number;
  recipientId?: number;
  sizeCategory?: SizeCategory;
}

export const assignmentKeys = {
  all: ['assignments'] as const,
  needs: (f: BoardFilters) => [...assignmentKeys.all, 'needs', f] as const,
  waiting: (f: BoardFilters, page: number) => [...assignmentKeys.all, 'waiting', f, page] as const,
  list: (needId: number) => [...assignmentKeys.all, 'list', needId] as const,
  choices: () => ['assignment-board-choices'] as const,
};
