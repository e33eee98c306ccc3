import type { Sequelize } from 'sequelize';
import type { z } from 'zod';
import { validate } from '../../middleware/validate';
import { IdParamSchema } from '@shared/schemas/user';
import { DriveClockUpdateSchema, TestClockSchema, type DriveClockView } from '@shared/schemas/schedule';
import { isoIn } from '@shared/scheduling/slots';
import { clockIsSet, setClock } from '../../lib/clock';
import { HttpError } from '../../lib/http-error';
import {
  BookingCreateSchema,
  BookingListQuerySchema,
  BookingUpdateSchema,
  ReminderPreferenceSchema,
  SlotQuerySchema,
  SoonestQuerySchema,
} from '@shared/schemas/booking';
import { User } from '../../db/models/user';
import type { RouteDef } from '../route-table';
import * as service from './bookings.service';
import { siteSlots, soonestSlots } from './slots.service';
import { driveNow, driveZone, setDriveZone } from './drive-clock';

export interface BookingRouteContext {
  sequelize: Sequelize;
  publicUrl: string;
  mailFrom: string;
  /** Whether PUT /api/drive/clock/now may set the product clock (TEST_CLOCK). */
  testClock?: boolean;
}

async function clockView(): Promise<DriveClockView> {
  const c = await driveNow();
  return { timeZone: c.zone, today: c.today, now: isoIn(c.nowMs, c.zone), set: clockIsSet() };
}

export function bookingRoutes(ctx: BookingRouteContext): RouteDef[] {
  const bctx: service.BookingContext = { sequelize: ctx.sequelize, publicUrl: ctx.publicUrl, mailFrom: ctx.mailFrom };
  return [
    {
      method: 'get', path: '/api/drive/clock', access: 'public', summary: "The drive's time zone and today's date in it",
      handlers: [
        async (_req, res) => {
          res.json(await clockView());
        },
      ],
    },
    {
      method: 'put', path: '/api/drive/clock', access: ['coordinator'], summary: "Set the drive's time zone (an IANA name)",
      handlers: [
        validate({ body: DriveClockUpdateSchema }),
        async (req, res) => {
          const { timeZone } = req.body as z.infer<typeof DriveClockUpdateSchema>;
          await ctx.sequelize.transaction((t) => setDriveZone(timeZone, t));
          res.json(await clockView());
        },
      ],
    },
    {
      method: 'put', path: '/api/drive/clock/now', access: ['coordinator'], summary: 'Set the product clock for browser tests (TEST_CLOCK servers only; 404 elsewhere)',
      handlers: [
        validate({ body: TestClockSchema }),
        async (req, res) => {
          if (!ctx.testClock) throw new HttpError(404, "This server's clock follows the real time; it can be set only on a test server (TEST_CLOCK)");
          const { now } = req.body as z.infer<typeof TestClockSchema>;
          setClock(now === null ? null : Date.parse(now));
          res.json(await clockView());
        },
      ],
    },
    {
      method: 'get', path: '/api/sites/:id/slots', access: 'signed-in', summary: "A site's drop-off slots between two days, with the room left in each",
      handlers: [
        validate({ params: IdParamSchema, query: SlotQuerySchema }),
        async (req, res) => {
          const q = req.query as unknown as z.infer<typeof SlotQuerySchema>;
          res.json(await siteSlots(Number(req.params.id), q.from, q.to));
        },
      ],
    },
    {
      method: 'get', path: '/api/slots/soonest', access: 'signed-in', summary: 'The soonest drop-off slots with room across sites, and each site\'s next one',
      handlers: [
        validate({ query: SoonestQuerySchema }),
        async (req, res) => {
          const q = req.query as unknown as z.infer<typeof SoonestQuerySchema>;
          res.json(await soonestSlots(q.limit));
        },
      ],
    },
    {
      method: 'get', path: '/api/bookings', access: 'signed-in', summary: "Your drop-off bookings, or a site's day (?siteId=&day=, organisers)",
      handlers: [
        validate({ query: BookingListQuerySchema }),
        async (req, res) => {
          const q = req.query as unknown as z.infer<typeof BookingListQuerySchema>;
          res.json({ bookings: await service.listBookings(req.user!, q), timeZone: await driveZone() });
        },
      ],
    },
    {
      method: 'post', path: '/api/bookings', access: 'signed-in', summary: 'Book a drop-off slot for finished blankets (409 when full)',
      handlers: [
        validate({ body: BookingCreateSchema }),
        async (req, res) => {
          res.status(201).json({ booking: await service.createBooking(bctx, req.user!, req.body) });
        },
      ],
    },
    {
      method: 'get', path: '/api/bookings/reminders', access: 'signed-in', summary: 'Whether you get a reminder the day before a drop-off',
      handlers: [
        async (req, res) => {
          const me = await User.findByPk(req.user!.id, { attributes: ['id', 'bookingReminders'] });
          res.json({ bookingReminders: me?.bookingReminders ?? true });
        },
      ],
    },
    {
      method: 'put', path: '/api/bookings/reminders', access: 'signed-in', summary: 'Turn drop-off reminders on or off',
      handlers: [
        validate({ body: ReminderPreferenceSchema }),
        async (req, res) => {
          const { bookingReminders } = req.body as z.infer<typeof ReminderPreferenceSchema>;
          await ctx.sequelize.transaction((transaction) => User.update({ bookingReminders }, { where: { id: req.user!.id }, transaction }));
          res.json({ bookingReminders });
        },
      ],
    },
    {
      method: 'post', path: '/api/bookings/:id/missed', access: ['organiser', 'coordinator'], summary: 'Mark that the maker did not come (after the slot); the blankets are finished again',
      handlers: [
        validate({ params: IdParamSchema }),
        async (req, res) => {
          res.json({ booking: await service.markMissed(bctx, req.user!, Number(req.params.id)) });
        },
      ],
    },
    {
      method: 'get', path: '/api/bookings/:id', access: 'signed-in', summary: 'One drop-off booking',
      handlers: [
        validate({ params: IdParamSchema }),
        async (req, res) => {
          res.json({ booking: await service.getBooking(req.user!, Number(req.params.id)) });
        },
      ],
    },
    {
      method: 'patch', path: '/api/bookings/:id', access: 'signed-in', summary: 'Move a drop-off to another slot or change its blankets',
      handlers: [
        validate({ params: IdParamSchema, body: BookingUpdateSchema }),
        async (req, res) => {
          res.json({ booking: await service.moveBooking(bctx, req.user!, Number(req.params.id), req.body) });
        },
      ],
    },
    {
      method: 'delete', path: '/api/bookings/:id', access: 'signed-in', summary: 'Cancel a drop-off; its blankets are finished again',
      handlers: [
        validate({ params: IdParamSchema }),
        async (req, res) => {
          res.json({ booking: await service.cancelBooking(bctx, req.user!, Number(req.params.id)) });
        },
      ],
    },
  ];
}
