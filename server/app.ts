import express, { type Express } from 'express';
import session from 'express-session';
import helmet from 'helmet';
import compression from 'compression';
import path from 'node:path';
import fs from 'node:fs';
import type { Sequelize } from 'sequelize';
import connectSessionSequelize from 'connect-session-sequelize';
import type { Config } from './config/env';
import { configurePassport } from './auth/passport';
import { csrfProtection } from './auth/csrf';
import { errorHandler, notFoundHandler } from './middleware/error-handler';
import { mountRoutes, type RouteDef } from './modules/route-table';
import { allRoutes } from './modules/all-routes';
import { preparedRead } from './db/prepared-read';
import { KEPT_MAX_MS, sessionWriteGeneration } from './db/kept';
import { KeptDoor } from './lib/kept-door';
import { fixedHeaders, inTurn } from './lib/middleware-chain';
import { driveDaySpan } from './modules/bookings/drive-clock';

/** How stale the session's stamp (and its stored expiry) may grow before a request renews it. */
export const TOUCH_EVERY_MS = 60_000;

/** helmet's options: its defaults, with images from data and blob URLs (photo previews) and inline styles (the map). */
export const SECURITY_HEADERS: Parameters<typeof helmet>[0] = {
  contentSecurityPolicy: {
    directives: {
      'img-src': ["'self'", 'data:', 'blob:'],
      'style-src': ["'self'", "'unsafe-inline'"],
    },
  },
};

const SESSION_COOKIE = 'kindloop.sid';

export interface AppDeps {
  sequelize: Sequelize;
  config: Config;
  sessionSecret: string;
  /** Folder of the built client; served with a fallback to index.html for client-side routes. */
  clientDir?: string;
}

export interface KindloopApp extends Express {
  locals: Express['locals'] & { routes: RouteDef[]; close: () => void; door: KeptDoor };
}

export function createApp(deps: AppDeps): KindloopApp {
  const { sequelize, config } = deps;
  const app = express() as KindloopApp;
  app.disable('x-powered-by');
  app.set('trust proxy', 'loopback');

  // A session asking again for a kept answer, with nothing written since, is answered first, with
  // the headers it had the first time, security headers included (server/lib/kept-door.ts).
  const door = new KeptDoor({
    cookieName: SESSION_COOKIE,
    secret: deps.sessionSecret,
    touchEveryMs: TOUCH_EVERY_MS,
    daySpan: driveDaySpan,
    // The session rows as the store below reads and keeps them.
    keptSessionRow: (sid) => keptSessionRow(sid),
    readSessionRow: (sid) => readSessionRow(sid),
  });
  app.use(door.middleware);

  // helmet's headers depend on these options only, so they are worked out once (lib/middleware-chain.ts).
  app.use(fixedHeaders(helmet(SECURITY_HEADERS)));
  // gzip for the API's JSON and the built client alike: lists and bundles shrink to about a third.
  // The API's routes get it route by route (mountRoutes), so that kept answers, which carry their
  // own gzip, skip it; a request passes through it at most once.
  const gzip = compression();
  const compressed = new WeakSet<express.Request>();
  const compress: express.RequestHandler = (req, res, next) => {
    if (compressed.has(req)) return next();
    compressed.add(req);
    gzip(req, res, next);
  };
  const isApi = (url: string) => url.length >= 4 && url.slice(0, 4).toLowerCase() === '/api' && (url.length === 4 || url[4] === '/' || url[4] === '?');
  app.use((req, res, next) => (isApi(req.url) ? next() : compress(req, res, next)));

  const SequelizeStore = connectSessionSequelize(session.Store);
  // disableTouch is an option of the store (7.x) that its type declarations leave out.
  const storeOptions: ConstructorParameters<typeof SequelizeStore>[0] & { disableTouch: boolean } = {
    db: sequelize,
    table: 'Session',
    checkExpirationInterval: 15 * 60_000,
    // express-session touches the store after every request it did not save; the stamp below saves
    // the row at most once a minute instead, which moves its expiry along with it.
    disableTouch: true,
    extendDefaultFields: (defaults: { data: string; expires: Date }, s: { passport?: { user?: number } }) => ({
      data: defaults.data,
      expires: defaults.expires,
      userId: s.passport?.user ?? null,
    }),
  };
  // Reading the session is the one store call every request makes; it goes through a prepared
  // statement instead of a model query (the store's writes stay as they are), and its row is kept
  // until anything writes to the sessions table (server/db/kept.ts): a sign-out, a revocation, the
  // expiry sweep or another session's renewal. Each request still checks its session against that.
  const keptSessions = new Map<string, { generation: number; at: number; data: string }>();
  const answer = (fn: (err: unknown, session?: session.SessionData | null) => void, stored: string | null | undefined) => {
    let data: session.SessionData | null;
    try {
      data = stored ? (JSON.parse(stored) as session.SessionData) : null;
    } catch (err) {
      return fn(err);
    }
    fn(null, data);
  };
  /** A session's stored row as kept, while nothing has been written to sessions since it was read. */
  const keptSessionRow = (sid: string): string | undefined => {
    const kept = keptSessions.get(sid);
    return kept && kept.generation === sessionWriteGeneration() && Date.now() - kept.at < KEPT_MAX_MS ? kept.data : undefined;
  };
  /** A session's stored row, read and kept (undefined when there is none). */
  const readSessionRow = async (sid: string): Promise<string | undefined> => {
    const generation = sessionWriteGeneration();
    const [row] = await preparedRead<{ data: string | null }>(sequelize, 'SELECT data FROM sessions WHERE sid = ?', [sid]);
    // Only rows that exist are kept: a stream of made-up ids must not fill the memory.
    if (row?.data && sessionWriteGeneration() === generation) {
      if (keptSessions.size >= 10_000) keptSessions.clear();
      keptSessions.set(sid, { generation, at: Date.now(), data: row.data });
    }
    return row?.data ?? undefined;
  };
  class SessionStore extends SequelizeStore {
    override get(sid: string, fn: (err: unknown, session?: session.SessionData | null) => void) {
      const kept = keptSessionRow(sid);
      if (kept !== undefined) {
        queueMicrotask(() => answer(fn, kept));
        return;
      }
      readSessionRow(sid).then((data) => answer(fn, data), fn);
    }
  }
  const store = new SessionStore(storeOptions);

  const passport = configurePassport(config.scryptLogN);

  const sessions = session({
    name: SESSION_COOKIE,
    secret: deps.sessionSecret,
    store,
    resave: false,
    saveUninitialized: false,
    // The cookie is sent again whenever the session is saved, which the stamp below does at least
    // once a minute while it is used, so its expiry trails the server's idle limit by under a
    // minute without re-signing a cookie on every answer.
    rolling: false,
    // express-session ids are 24 random bytes (192 bits), above OWASP's 128-bit recommendation.
    cookie: {
      httpOnly: true,
      sameSite: 'lax',
      secure: config.cookieSecure,
      maxAge: config.sessionIdleMinutes * 60_000,
    },
  });
  // The store only sweeps expired rows every quarter hour and a copied cookie can be replayed, so
  // the idle limit is enforced here too (OWASP Session Management: idle timeouts on the server).
  const idleMs = config.sessionIdleMinutes * 60_000;
  /** The stamp each session was last renewed from in this process, and when. */
  const renewing = new Map<string, { from: number | undefined; at: number }>();
  const stampSession: express.RequestHandler = (req, _res, next) => {
    const now = Date.now();
    const last = req.session.lastSeen;
    if (last !== undefined && now - last > idleMs) {
      return req.session.regenerate((err) => next(err));
    }
    // Only sessions that hold something are stamped; an anonymous GET creates no row. A changed
    // stamp makes express-session write the row, so it is renewed at most once a minute: a read
    // does not cost a write, and the idle limit and the stored expiry lag by under a minute.
    const held = req.session as typeof req.session & { passport?: { user?: number } };
    const holds = held.passport?.user !== undefined || held.csrfToken;
    // Requests that arrive together read the same stale stamp; only the first renews it, or each
    // would save the same row at once (under 50 connections those saves queued for seconds). Should
    // that save fail, a request a few seconds later tries again.
    const renewal = renewing.get(req.sessionID);
    const beingRenewed = renewal !== undefined && renewal.from === last && now - renewal.at < 5_000;
    if (holds && (last === undefined || now - last >= TOUCH_EVERY_MS) && !beingRenewed) {
      if (renewing.size >= 10_000) renewing.clear();
      renewing.set(req.sessionID, { from: last, at: now });
      req.session.lastSeen = now;
    }
    next();
  };
  // Every API request: its JSON body, its session, the idle stamp, who signed in, the CSRF check;
  // mounted as one layer (lib/middleware-chain.ts).
  app.use('/api', inTurn([express.json({ limit: '200kb' }), sessions, stampSession, passport.initialize(), passport.session(), csrfProtection]));

  const routes = allRoutes({ sequelize, config, passport });
  app.use(mountRoutes(routes, { compress }));
  app.use('/api', notFoundHandler);

  if (deps.clientDir && fs.existsSync(path.join(deps.clientDir, 'index.html'))) {
    const dir = deps.clientDir;
    app.use(express.static(dir, { index: false, maxAge: '1h' }));
    app.get(/^(?!\/api\/).*/, (_req, res) => res.sendFile(path.join(dir, 'index.html')));
  }
  app.use(notFoundHandler);
  app.use(errorHandler);

  app.locals.routes = routes;
  app.locals.door = door;
  app.locals.close = () => (store as unknown as { stopExpiringSessions: () => void }).stopExpiringSessions();
  return app;
}
