export const pledgeKeys = {
  all: ['pledges'] as const,
  list: (filter: { mine?: boolean } = {}) => [...pledgeKeys.all, 'list', filter] as const,
  detail: (id: number) => [...pledgeKeys.all, 'detail', id] as const,
};
