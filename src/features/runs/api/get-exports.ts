import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { Page } from '@shared/schemas/page';
import type { ExportView } from '@shared/schemas/run';
import { runKeys } from './keys';

export const getExports = (page: number) => api.get<Page<ExportView>>(`/api/exports?page=${page}&pageSize=20`);

export const exportsQueryOptions = (page: number) =>
  queryOptions({ queryKey: runKeys.exports(page), queryFn: () => getExports(page), placeholderData: keepPreviousData });

export function useExports(page: number) {
  return useQuery(exportsQueryOptions(page));
}
