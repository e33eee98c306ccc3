export const siteKeys = {
  all: ['sites'] as const,
  list: (active: 'true' | 'false' | 'all') => [...siteKeys.all, 'list', active] as const,
};
