import type { RequestHandler } from 'express';
import type { PassportStatic } from 'passport';
import rateLimit, { ipKeyGenerator } from 'express-rate-limit';
import {
  LoginSchema,
  PasswordResetConfirmSchema,
  PasswordResetRequestSchema,
  RegisterSchema,
} from '@shared/schemas/user';
import { validate } from '../../middleware/validate';
import { csrfToken } from '../../auth/csrf';
import { HttpError } from '../../lib/http-error';
import type { RouteDef } from '../route-table';
import * as service from './auth.service';

const WRONG = 'Wrong e-mail or password';

function logIn(req: Parameters<RequestHandler>[0], user: Express.User): Promise<void> {
  // passport 0.7 regenerates the session id inside logIn (OWASP Session Management: new id at
  // sign-in, against session fixation); the old session's CSRF token goes with it.
  return new Promise<void>((resolve, reject) => req.logIn(user, (e) => (e ? reject(e) : resolve()))).then(() => {
    // The new session starts stamped (saved with this answer), so the first page it loads does not
    // wait for the stamp to be written.
    req.session.lastSeen = Date.now();
  });
}

const HOUR = 60 * 60_000;
const emailOf = (req: Parameters<RequestHandler>[0]) => String(req.body?.email ?? '').trim().toLowerCase();
/** The client's network address as a limiter key (an IPv6 client by its /56, so it cannot rotate addresses). */
const addressOf = (req: Parameters<RequestHandler>[0]) => ipKeyGenerator(req.ip ?? '');

const limiter = (opts: Parameters<typeof rateLimit>[0] & { message: string }) =>
  rateLimit({ standardHeaders: 'draft-8', legacyHeaders: false, ...opts, message: { error: { message: opts.message, issues: [] } } });

/**
 * Sign-in, reset and registration limits (docs/decisions/0009-sign-in-throttling.md). Failed sign-ins
 * count per account and network address together (OWASP Authentication Cheat Sheet, "Login
 * Throttling"), so someone guessing a maker's password slows only their own attempts: the maker,
 * from their own address, still gets in. A second, looser count per address alone caps one client
 * trying many accounts. Resets are limited the same two ways, registrations per network address.
 */
export function authLimits(maxFailures: number) {
  const signInMessage = 'Too many failed sign-ins from here; wait a few minutes and try again';
  return {
    signInPerAddress: limiter({
      windowMs: 15 * 60_000, limit: maxFailures * 3, skipSuccessfulRequests: true, message: signInMessage,
      keyGenerator: (req) => `sign-in:${addressOf(req)}`,
    }),
    signInPerAccountAndAddress: limiter({
      windowMs: 15 * 60_000, limit: maxFailures, skipSuccessfulRequests: true, message: signInMessage,
      keyGenerator: (req) => `sign-in:${emailOf(req)}|${addressOf(req)}`,
    }),
    resetPerAddress: limiter({
      windowMs: 15 * 60_000, limit: 10, message: 'Too many reset requests from here; wait a few minutes and try again',
      keyGenerator: (req) => `reset:${addressOf(req)}`,
    }),
    resetPerAccountAndAddress: limiter({
      windowMs: 15 * 60_000, limit: 3, message: 'You asked for a reset link for this address a moment ago; check the inbox, or wait a few minutes',
      keyGenerator: (req) => `reset:${emailOf(req)}|${addressOf(req)}`,
    }),
    confirmPerAddress: limiter({
      windowMs: 15 * 60_000, limit: 10, message: 'Too many tries from here; wait a few minutes and try again',
      keyGenerator: (req) => `reset-confirm:${addressOf(req)}`,
    }),
    // A 409 tells whether an address has an account, so refusals are what is counted; 20 a window
    // lets a double-clicked form or a small race through, and a venue's shared network signs up freely.
    registerFailuresPerAddress: limiter({
      windowMs: HOUR, limit: 20, skipSuccessfulRequests: true,
      message: 'Too many sign-up attempts from here; wait a while, or sign in if you already have an account',
      keyGenerator: (req) => `register-failed:${addressOf(req)}`,
    }),
    registerPerAddress: limiter({
      windowMs: HOUR, limit: 100, message: 'Too many new accounts from here in the last hour; try again later',
      keyGenerator: (req) => `register:${addressOf(req)}`,
    }),
  };
}

export function authRoutes(ctx: service.AuthContext & { passport: PassportStatic; maxFailures: number }): RouteDef[] {
  const limits = authLimits(ctx.maxFailures);

  const login: RequestHandler = (req, res, next) => {
    ctx.passport.authenticate('local', { session: false }, async (err: unknown, user: Express.User | false) => {
      try {
        if (err) return next(err);
        if (!user) throw new HttpError(401, WRONG);
        await logIn(req, user);
        res.json({ user });
      } catch (e) {
        next(e);
      }
    })(req, res, next);
  };

  return [
    {
      method: 'get', path: '/api/auth/csrf', access: 'public', summary: 'Security token for requests that change data',
      handlers: [(req, res) => res.json({ csrfToken: csrfToken(req) })],
    },
    {
      method: 'post', path: '/api/auth/register', access: 'public', summary: "Create a maker's account and sign in",
      handlers: [
        limits.registerPerAddress,
        limits.registerFailuresPerAddress,
        validate({ body: RegisterSchema }),
        async (req, res) => {
          const user = await service.register(ctx, req.body);
          await logIn(req, { ...user, active: true });
          res.status(201).json({ user });
        },
      ],
    },
    {
      method: 'post', path: '/api/auth/login', access: 'public', summary: 'Sign in with e-mail and password',
      handlers: [limits.signInPerAddress, validate({ body: LoginSchema }), limits.signInPerAccountAndAddress, login],
    },
    {
      method: 'post', path: '/api/auth/logout', access: 'public', summary: 'Sign out',
      handlers: [
        (req, res, next) =>
          req.logOut((err) => {
            if (err) return next(err);
            req.session.destroy((e) => (e ? next(e) : res.status(204).end()));
          }),
      ],
    },
    {
      method: 'get', path: '/api/auth/me', access: 'signed-in', summary: 'The signed-in user',
      handlers: [(req, res) => res.json({ user: req.user })],
    },
    {
      method: 'post', path: '/api/auth/password-reset', access: 'public', summary: 'E-mail a single-use reset link',
      handlers: [
        limits.resetPerAddress,
        validate({ body: PasswordResetRequestSchema }),
        limits.resetPerAccountAndAddress,
        (req, res) => {
          // The answer goes before the account is even looked up, so it takes the same time whether
          // the address has an account or not (OWASP Authentication Cheat Sheet, "Authentication
          // and Error Messages"); the lookup, the token and the mail follow on their own.
          res.status(202).json({ message: 'If that address has an account, a reset link is on its way.' });
          service.requestPasswordReset(ctx, req.body.email).catch((err: unknown) => console.error('password reset:', (err as Error).message));
        },
      ],
    },
    {
      method: 'post', path: '/api/auth/password-reset/confirm', access: 'public', summary: 'Set a new password from a reset link',
      handlers: [
        limits.confirmPerAddress,
        validate({ body: PasswordResetConfirmSchema }),
        async (req, res) => {
          const user = await service.confirmPasswordReset(ctx, req.body.token, req.body.password);
          res.json({ user });
        },
      ],
    },
  ];
}
