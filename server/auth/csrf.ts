import { randomBytes, timingSafeEqual } from 'node:crypto';
import type { Request, RequestHandler } from 'express';
import { HttpError } from '../lib/http-error';

const SAFE = new Set(['GET', 'HEAD', 'OPTIONS']);

/**
 * Synchronizer token kept in the server-side session (OWASP CSRF Prevention Cheat Sheet). The token
 * is bound to the session, so it changes when the session is regenerated at sign-in and sign-out;
 * the client fetches a fresh one from GET /api/auth/csrf after either.
 */
export function csrfToken(req: Request): string {
  if (!req.session.csrfToken) req.session.csrfToken = randomBytes(32).toString('base64url');
  return req.session.csrfToken;
}

export const csrfProtection: RequestHandler = (req, _res, next) => {
  if (SAFE.has(req.method)) return next();
  const sent = req.get('x-csrf-token') ?? '';
  const expected = req.session?.csrfToken ?? '';
  const a = Buffer.from(sent);
  const b = Buffer.from(expected);
  if (!expected || a.length !== b.length || !timingSafeEqual(a, b)) {
    return next(new HttpError(403, 'Missing or stale security token; reload the page and try again'));
  }
  next();
};
