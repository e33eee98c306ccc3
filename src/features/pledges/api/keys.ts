import type { PledgeListParams } from './get-pledges';

export const pledgeKeys = {
  all: ['pledges'] as const,
  lists: () => [...pledgeKeys.all, 'list'] as const,
  list: (params: PledgeListParams) => [...pledgeKeys.lists(), params] as const,
  detail: (id: number) => [...pledgeKeys.all, 'detail', id] as const,
};
