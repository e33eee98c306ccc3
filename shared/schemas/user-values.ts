/**
 * The roles a person can have, without zod: a page that only shows or lists these values loads none of the schema
 * library. ./user.ts re-exports them, so the server and the schemas keep importing from there.
 */

export const ROLES = ['volunteer', 'organiser', 'coordinator'] as const;
