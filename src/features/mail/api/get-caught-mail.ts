import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';

export interface CaughtMail {
  id: number;
  from: string;
  to: string;
  subject: string;
  text: string;
  attachments: Array<{ filename: string; contentType: string; content: string }> | null;
  receivedAt: string;
}

export const mailKeys = { all: ['mail'] as const, list: () => [...mailKeys.all, 'list'] as const };

export const getCaughtMail = () =>
  api.get<{ mail: CaughtMail[]; outbox: { pending: number; failed: number; sent: number } }>('/api/mail/caught');
export const caughtMailQueryOptions = () => queryOptions({ queryKey: mailKeys.list(), queryFn: getCaughtMail, refetchInterval: 5000 });
export function useCaughtMail() {
  return useQuery(caughtMailQueryOptions());
}
