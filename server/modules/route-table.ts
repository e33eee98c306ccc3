import { Router, type RequestHandler } from 'express';
import { requireRole, type Access } from '../auth/require-role';

export type Method = 'get' | 'post' | 'put' | 'patch' | 'delete';

export interface RouteDef {
  method: Method;
  /** Full path as the client calls it, e.g. /api/pledges/:id */
  path: string;
  access: Access;
  handlers: RequestHandler[];
  summary: string;
}

/**
 * Every API route is declared as data. The app mounts them with their role gate, and the role-matrix
 * test reads the same list, so a route cannot be added without its access rule being tested.
 */
export function mountRoutes(routes: RouteDef[]): Router {
  const router = Router();
  for (const r of routes) router[r.method](r.path, requireRole(r.access), ...r.handlers);
  return router;
}
