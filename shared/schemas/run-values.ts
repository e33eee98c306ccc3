/**
 * How a delivery run's state is worded, without zod: a page that only shows or lists these values loads none of the schema
 * library. ./run.ts re-exports them, so the server and the schemas keep importing from there.
 */
import type { RunState } from './run';

export const RUN_STATE_LABELS: Record<RunState, string> = {
  empty: 'No stops yet',
  planned: 'Being planned',
  packed: 'Packed, ready to go',
  'partly-delivered': 'On the road',
  delivered: 'All delivered',
};
