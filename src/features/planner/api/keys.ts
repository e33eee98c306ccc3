export const planKeys = {
  all: ['plans'] as const,
  list: () => [...planKeys.all, 'list'] as const,
  detail: (id: number) => [...planKeys.all, 'detail', id] as const,
};
