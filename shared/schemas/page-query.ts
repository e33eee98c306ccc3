import { z } from 'zod';
import { DEFAULT_PAGE_SIZE, MAX_PAGE_SIZE } from './page';

/** `page` counts from 1; `pageSize` defaults to 25 and is at most 100. */
export const PageQuerySchema = z.object({
  page: z.coerce.number({ error: 'page must be a number' }).int('page must be a whole number').min(1, 'page starts at 1').default(1),
  pageSize: z.coerce
    .number({ error: 'pageSize must be a number' })
    .int('pageSize must be a whole number')
    .min(1, 'pageSize must be at least 1')
    .max(MAX_PAGE_SIZE, `pageSize: at most ${MAX_PAGE_SIZE}`)
    .default(DEFAULT_PAGE_SIZE),
  dir: z.enum(['asc', 'desc'], { error: "dir is 'asc' or 'desc'" }).optional(),
});

/** A free-text search over a list: trimmed, at most 100 characters; empty means no search. */
export const SearchSchema = z
  .string()
  .trim()
  .max(100, 'q: at most 100 characters')
  .optional()
  .transform((s) => (s ? s : undefined));
