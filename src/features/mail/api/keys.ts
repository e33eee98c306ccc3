export const mailKeys = {
  all: ['mail'] as const,
  caught: (page: number) => [...mailKeys.all, 'caught', page] as const,
  outbox: (show: string, page: number) => [...mailKeys.all, 'outbox', show, page] as const,
};
