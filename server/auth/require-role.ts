import type { RequestHandler } from 'express';
import type { Role } from '@shared/schemas/user';
import { HttpError } from '../lib/http-error';

export type Access = 'public' | 'signed-in' | Role[];

/** The one gate for role checks: 401 when nobody is signed in, 403 when the role isn't allowed. */
export function requireRole(access: Access): RequestHandler {
  return (req, _res, next) => {
    if (access === 'public') return next();
    if (!req.user) return next(new HttpError(401, 'Please sign in first'));
    if (!req.user.active) return next(new HttpError(403, 'This account has been deactivated'));
    if (access === 'signed-in' || access.includes(req.user.role)) return next();
    next(new HttpError(403, 'Your role does not allow this'));
  };
}
