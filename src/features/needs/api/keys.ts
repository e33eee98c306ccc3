export const needKeys = {
  all: ['needs'] as const,
  list: () => [...needKeys.all, 'list'] as const,
};
