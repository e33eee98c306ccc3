import type { PassportStatic } from 'passport';
import type { Sequelize } from 'sequelize';
import type { Config } from '../config/env';
import type { RouteDef } from './route-table';
import { authRoutes } from './auth/auth.router';
import { userRoutes } from './users/users.router';
import { mailRoutes } from './mail/mail.router';
import { driveRoutes } from './drive/drive.router';

export interface RouteContext {
  sequelize: Sequelize;
  config: Config;
  passport: PassportStatic;
}

/** Every API route of the product, in one list; each area contributes its own. */
export function allRoutes(ctx: RouteContext): RouteDef[] {
  return [
    ...driveRoutes(),
    ...authRoutes({
      sequelize: ctx.sequelize,
      scryptLogN: ctx.config.scryptLogN,
      publicUrl: ctx.config.publicUrl,
      passport: ctx.passport,
      maxFailures: ctx.config.loginMaxFailures,
    }),
    ...userRoutes(),
    ...mailRoutes(),
  ];
}
