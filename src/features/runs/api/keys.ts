export const runKeys = {
  all: ['runs'] as const,
  list: (when: string, page: number) => [...runKeys.all, 'list', when, page] as const,
  waiting: () => [...runKeys.all, 'waiting'] as const,
  detail: (id: number) => [...runKeys.all, 'detail', id] as const,
  exports: (page: number) => [...runKeys.all, 'exports', page] as const,
};
