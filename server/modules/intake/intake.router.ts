import type { Sequelize } from 'sequelize';
import type { z } from 'zod';
import { validate } from '../../middleware/validate';
import { IdParamSchema } from '@shared/schemas/user';
import { BlanketCodeParamSchema, InspectionBodySchema, IntakeBodySchema, IntakeQueueQuerySchema, TagsQuerySchema } from '@shared/schemas/intake';
import type { RouteDef } from '../route-table';
import type { IntakeQueue } from '@shared/schemas/intake-views';
import * as service from './intake.service';
import { keptJson } from '../../lib/kept-json';

const STAFF = ['organiser', 'coordinator'] as const;

/**
 * The intake table's routes. /api/blankets/tags and /api/blankets/by-code/:code must be listed
 * before any /api/blankets/:id route, or ":id" would swallow "tags".
 */
export function intakeRoutes(ctx: { sequelize: Sequelize; publicUrl: string }): RouteDef[] {
  return [
    {
      method: 'get', path: '/api/blankets/tags', access: 'signed-in', summary: 'Tag sheet data with QR codes for blankets',
      handlers: [
        validate({ query: TagsQuerySchema }),
        async (req, res) => {
          const { ids } = req.query as unknown as z.infer<typeof TagsQuerySchema>;
          res.json({ tags: await service.tags(ids, req.user!, ctx.publicUrl) });
        },
      ],
    },
    {
      method: 'get', path: '/api/blankets/by-code/:code', access: [...STAFF], summary: 'Find a blanket by the code on its tag',
      handlers: [
        validate({ params: BlanketCodeParamSchema }),
        async (req, res) => {
          res.json(await service.findByCode(String(req.params.code)));
        },
      ],
    },
    {
      method: 'post', path: '/api/blankets/:id/intake', access: [...STAFF], summary: 'Receive a blanket at a drop-off site and re-measure it',
      handlers: [
        validate({ params: IdParamSchema, body: IntakeBodySchema }),
        async (req, res) => {
          res.json(await service.receive(ctx.sequelize, Number(req.params.id), req.body, req.user!));
        },
      ],
    },
    {
      method: 'post', path: '/api/blankets/:id/inspection', access: [...STAFF], summary: 'Inspect a received blanket and record the outcome',
      handlers: [
        validate({ params: IdParamSchema, body: InspectionBodySchema }),
        async (req, res) => {
          res.json(await service.inspect(ctx.sequelize, Number(req.params.id), req.body, req.user!, ctx.publicUrl));
        },
      ],
    },
    {
      method: 'get', path: '/api/intake/queue', access: [...STAFF], summary: 'What arrived at a site on a day and what waits for inspection',
      handlers: [
        validate({ query: IntakeQueueQuerySchema }),
        // Kept until a write, or until the first booked visit still expected has ended (it then
        // shows as not arrived).
        keptJson<{ queue: IntakeQueue }>({ per: 'role', until: (a) => firstExpectedEnd(a.queue.bookedArrivals) }, async (req) => ({
          queue: await service.queue(req.query as unknown as z.infer<typeof IntakeQueueQuerySchema>),
        })),
      ],
    },
  ];
}

/** When the earliest booked visit still expected ends (Infinity when none is). */
function firstExpectedEnd(arrivals: Array<{ end: string; arrival: string }>): number {
  let first = Infinity;
  for (const a of arrivals) if (a.arrival === 'expected') first = Math.min(first, Date.parse(a.end));
  return first;
}
