import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api, qs } from '@/lib/api-client';
import type { BlanketStatus } from '@shared/schemas/blanket';
import type { GlanceStep } from '@shared/drive/glance';
import type { BlanketSort, BlanketSummary } from '@shared/schemas/blanket-log';
import { MAX_PAGE_SIZE, type Page } from '@shared/schemas/page';
import { blanketKeys } from './keys';

/** What one page of the blanket list asks the server for; the server filters, sorts and pages. */
export interface BlanketListParams {
  mine?: boolean;
  status?: BlanketStatus;
  /** The filters behind the figures of the drive at a glance. */
  step?: GlanceStep;
  needId?: number;
  reached?: GlanceStep;
  from?: string;
  to?: string;
  q?: string;
  sort?: BlanketSort;
  dir?: 'asc' | 'desc';
  page?: number;
  pageSize?: number;
}

export const getBlankets = (p: BlanketListParams) => api.get<Page<BlanketSummary>>(`/api/blankets${qs({ ...p })}`);

export const blanketsQueryOptions = (p: BlanketListParams) =>
  queryOptions({ queryKey: blanketKeys.list(p), queryFn: () => getBlankets(p), placeholderData: keepPreviousData });

/** One page of blankets: the caller's own (`mine`) or, for staff, everyone's. */
export function useBlankets(p: BlanketListParams) {
  return useQuery(blanketsQueryOptions(p));
}

/** A maker's own blankets for their summary: one page of the most a page may hold, newest first. */
export function useMyBlankets() {
  return useQuery(blanketsQueryOptions({ mine: true, pageSize: MAX_PAGE_SIZE }));
}
