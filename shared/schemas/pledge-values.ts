/**
 * The most blankets one pledge promises, without zod: a page that only shows this limit loads none of
 * the schema library. ./pledge.ts re-exports it, so the server and the schemas keep importing from there.
 */
export const MAX_PLEDGE_QUANTITY = 50;
