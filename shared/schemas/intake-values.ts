/**
 * The most tags one printed sheet carries, without zod: a page that only shows or lists these values loads none of the schema
 * library. ./intake.ts re-exports them, so the server and the schemas keep importing from there.
 */

export const MAX_TAGS_PER_SHEET = 60;
