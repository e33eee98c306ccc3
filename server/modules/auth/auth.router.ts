import type { RequestHandler } from 'express';
import type { PassportStatic } from 'passport';
import rateLimit from 'express-rate-limit';
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
  return new Promise((resolve, reject) => req.logIn(user, (e) => (e ? reject(e) : resolve())));
}

export function authRoutes(ctx: service.AuthContext & { passport: PassportStatic; maxFailures: number }): RouteDef[] {
  const limitMessage = { error: { message: 'Too many failed sign-ins; wait a few minutes and try again', issues: [] } };
  // Failures are counted per address and per account; a successful sign-in doesn't count.
  const perAddress = rateLimit({
    windowMs: 15 * 60_000,
    limit: ctx.maxFailures * 3,
    skipSuccessfulRequests: true,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    message: limitMessage,
  });
  const perAccount = rateLimit({
    windowMs: 15 * 60_000,
    limit: ctx.maxFailures,
    skipSuccessfulRequests: true,
    keyGenerator: (req) => `acct:${String(req.body?.email ?? '').trim().toLowerCase()}`,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    message: limitMessage,
  });
  const resetLimit = rateLimit({ windowMs: 15 * 60_000, limit: 10, standardHeaders: 'draft-8', legacyHeaders: false, message: limitMessage });

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
      handlers: [perAddress, validate({ body: LoginSchema }), perAccount, login],
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
        resetLimit,
        validate({ body: PasswordResetRequestSchema }),
        async (req, res) => {
          await service.requestPasswordReset(ctx, req.body.email);
          res.status(202).json({ message: 'If that address has an account, a reset link is on its way.' });
        },
      ],
    },
    {
      method: 'post', path: '/api/auth/password-reset/confirm', access: 'public', summary: 'Set a new password from a reset link',
      handlers: [
        resetLimit,
        validate({ body: PasswordResetConfirmSchema }),
        async (req, res) => {
          const user = await service.confirmPasswordReset(ctx, req.body.token, req.body.password);
          res.json({ user });
        },
      ],
    },
  ];
}
