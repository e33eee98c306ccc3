export const recipientKeys = {
  all: ['recipients'] as const,
  list: (active: 'true' | 'false' | 'all') => [...recipientKeys.all, 'list', active] as const,
  detail: (id: number) => [...recipientKeys.all, 'detail', id] as const,
};
