export const blanketKeys = {
  all: ['blankets'] as const,
  list: (filter: { mine?: boolean } = {}) => [...blanketKeys.all, 'list', filter] as const,
  detail: (id: number) => [...blanketKeys.all, 'detail', id] as const,
  plans: () => [...blanketKeys.all, 'my-plans'] as const,
};
