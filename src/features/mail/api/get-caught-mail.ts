import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { Page } from '@shared/schemas/page';
import type { OutboxCounts } from '@shared/schemas/mail';
import { mailKeys } from './keys';

export interface CaughtMail {
  id: number;
  from: string;
  to: string;
  subject: string;
  text: string;
  attachments: Array<{ filename: string; contentType: string; content: string }> | null;
  receivedAt: string;
  /** Single-use links the server took out because the reader is not their addressee. */
  linksHidden: number;
}

export const getCaughtMail = (page: number) =>
  api.get<{ mail: Page<CaughtMail>; outbox: OutboxCounts }>(`/api/mail/caught?page=${page}&pageSize=20`);
export const caughtMailQueryOptions = (page = 1) =>
  queryOptions({ queryKey: mailKeys.caught(page), queryFn: () => getCaughtMail(page), refetchInterval: 5000, placeholderData: keepPreviousData });
export function useCaughtMail(page = 1) {
  return useQuery(caughtMailQueryOptions(page));
}
