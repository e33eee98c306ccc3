import type { BlanketListParams } from './get-blankets';

export const blanketKeys = {
  all: ['blankets'] as const,
  lists: () => [...blanketKeys.all, 'list'] as const,
  list: (params: BlanketListParams) => [...blanketKeys.lists(), params] as const,
  detail: (id: number) => [...blanketKeys.all, 'detail', id] as const,
  plans: () => [...blanketKeys.all, 'my-plans'] as const,
};
