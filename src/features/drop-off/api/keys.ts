export const dropOffKeys = {
  all: ['drop-off'] as const,
  soonest: () => [...dropOffKeys.all, 'soonest'] as const,
  slots: (siteId: number, from: string, to: string) => [...dropOffKeys.all, 'slots', siteId, from, to] as const,
  mine: () => [...dropOffKeys.all, 'mine'] as const,
  day: (siteId: number, day: string) => [...dropOffKeys.all, 'day', siteId, day] as const,
  finished: () => [...dropOffKeys.all, 'finished-blankets'] as const,
  reminders: () => [...dropOffKeys.all, 'reminders'] as const,
  thankYou: () => [...dropOffKeys.all, 'thank-you-mail'] as const,
};
