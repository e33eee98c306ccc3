/**
 * The limits on a blanket's photos, without zod: a page that only shows or lists these values loads none of the schema
 * library. ./blanket-log.ts re-exports them, so the server and the schemas keep importing from there.
 */

/** A blanket carries 1 to 4 photos. */
export const MAX_PHOTOS_PER_BLANKET = 4;
export const MAX_PHOTO_BYTES = 8 * 1024 * 1024;
export const PHOTO_MIME_TYPES = ['image/jpeg', 'image/png', 'image/webp'] as const;
export type PhotoMime = (typeof PHOTO_MIME_TYPES)[number];
