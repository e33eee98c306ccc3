import type { PassportStatic } from 'passport';
import type { Sequelize } from 'sequelize';
import type { Config } from '../config/env';
import type { RouteDef } from './route-table';
import { authRoutes } from './auth/auth.router';
import { userRoutes } from './users/users.router';
import { mailRoutes } from './mail/mail.router';
import { driveRoutes } from './drive/drive.router';
import { toolRoutes } from './tools/tools.router';
import { planRoutes } from './plans/plans.router';
import { intakeRoutes } from './intake/intake.router';
import { recipientRoutes } from './recipients/recipients.router';
import { siteRoutes } from './sites/sites.router';
import { guidelineRoutes } from './guidelines/guidelines.router';
import { pledgeRoutes } from './pledges/pledges.router';
import { blanketRoutes } from './blankets/blankets.router';
import { photoRoutes } from './photos/photos.router';
import { bookingRoutes } from './bookings/bookings.router';
import { assignmentRoutes } from './assignments/assignments.router';
import { runRoutes } from './runs/runs.router';

export interface RouteContext {
  sequelize: Sequelize;
  config: Config;
  passport: PassportStatic;
}

/** Every API route of the product, in one list; each area contributes its own. */
export function allRoutes(ctx: RouteContext): RouteDef[] {
  return [
    ...driveRoutes(ctx.config),
    // Before any /api/blankets/:id route: it holds /api/blankets/tags and /api/blankets/by-code/:code.
    ...intakeRoutes({ sequelize: ctx.sequelize, publicUrl: ctx.config.publicUrl }),
    ...authRoutes({
      sequelize: ctx.sequelize,
      scryptLogN: ctx.config.scryptLogN,
      publicUrl: ctx.config.publicUrl,
      passport: ctx.passport,
      maxFailures: ctx.config.loginMaxFailures,
    }),
    ...userRoutes(),
    ...mailRoutes(ctx.sequelize),
    ...toolRoutes(),
    ...planRoutes(),
    ...recipientRoutes({ sequelize: ctx.sequelize }),
    ...siteRoutes(),
    ...bookingRoutes({ sequelize: ctx.sequelize, publicUrl: ctx.config.publicUrl, mailFrom: ctx.config.mailFrom, testClock: ctx.config.testClock }),
    ...guidelineRoutes(),
    ...pledgeRoutes(ctx.sequelize),
    ...blanketRoutes(ctx.sequelize),
    ...photoRoutes(ctx.sequelize, ctx.config),
    ...assignmentRoutes(ctx.sequelize),
    ...runRoutes({ sequelize: ctx.sequelize, exportDir: ctx.config.exportDir, publicUrl: ctx.config.publicUrl }),
  ];
}
