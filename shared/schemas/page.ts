/**
 * One page of a list, as every paged route answers it. No zod here: the client reads these
 * constants and types on pages that carry no schemas (the query schema is in page-query.ts).
 */

/** The most rows one page of a list may carry; lists that grow with the drive are paged on the server. */
export const MAX_PAGE_SIZE = 100;
export const DEFAULT_PAGE_SIZE = 25;

/** One page of a list, with how many rows match in all. */
export interface Page<T> {
  items: T[];
  total: number;
  page: number;
  pageSize: number;
}

export const pageCount = (p: Pick<Page<unknown>, 'total' | 'pageSize'>) => Math.max(1, Math.ceil(p.total / p.pageSize));
