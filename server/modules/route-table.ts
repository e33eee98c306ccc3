import { Router, type RequestHandler } from 'express';
import { requireRole, type Access } from '../auth/require-role';
import { sendsOwnEncoding } from '../lib/kept-json';

export type Method = 'get' | 'post' | 'put' | 'patch' | 'delete';

export interface RouteDef {
  method: Method;
  /** Full path as the client calls it, e.g. /api/pledges/:id */
  path: string;
  access: Access;
  handlers: RequestHandler[];
  summary: string;
}

export interface MountOptions {
  /**
   * Compression for the answers of routes that do not gzip their own (kept answers carry theirs,
   * made once), so those do not pay for wrapping the response on every request.
   */
  compress?: RequestHandler;
}

/** The area a path belongs to: its first segment after /api/, as Express matches it (any case). */
const AREA = /^\/api\/([^/]+)/i;
const areaOf = (path: string) => AREA.exec(path)?.[1]?.toLowerCase();

/**
 * Every API route is declared as data. The app mounts them with their role gate, and the role-matrix
 * test reads the same list, so a route cannot be added without its access rule being tested.
 *
 * The routes are grouped by area (/api/blankets, /api/runs, ...) in the order they are listed, and
 * a request only walks its own area's routes. Only literal areas can be grouped without changing
 * which route answers first; should a route's area be a parameter, all routes stay in one list.
 */
export function mountRoutes(routes: RouteDef[], opts: MountOptions = {}): RequestHandler {
  const add = (router: Router, r: RouteDef) => {
    const own = r.handlers.some(sendsOwnEncoding);
    const front = opts.compress && !own ? [opts.compress] : [];
    router[r.method](r.path, ...front, requireRole(r.access), ...r.handlers);
  };
  const literal = routes.every((r) => {
    const area = areaOf(r.path);
    return area !== undefined && /^[a-z0-9_-]+$/.test(area);
  });
  if (!literal) {
    const router = Router();
    for (const r of routes) add(router, r);
    return router;
  }
  const areas = new Map<string, Router>();
  for (const r of routes) {
    const area = areaOf(r.path)!;
    let router = areas.get(area);
    if (!router) areas.set(area, (router = Router()));
    add(router, r);
  }
  return (req, res, next) => {
    const area = areaOf(req.path);
    const router = area === undefined ? undefined : areas.get(area);
    if (!router) return next();
    router(req, res, next);
  };
}
