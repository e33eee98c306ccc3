import type { BlanketFields } from '@shared/schemas/blanket';

export const intakeKeys = {
  all: ['intake'] as const,
  byCode: (code: string) => [...intakeKeys.all, 'by-code', code] as const,
  check: (recipientId: number, blanket: BlanketFields) => [...intakeKeys.all, 'check', recipientId, blanket] as const,
  queue: (siteId: number, date: string, pages?: { waitingPage: number; expectedPage: number }) =>
    pages ? ([...intakeKeys.all, 'queue', siteId, date, pages] as const) : ([...intakeKeys.all, 'queue', siteId, date] as const),
  tags: (ids: number[]) => [...intakeKeys.all, 'tags', ids.join(',')] as const,
  sites: () => [...intakeKeys.all, 'sites'] as const,
  recipients: () => [...intakeKeys.all, 'recipients'] as const,
};
