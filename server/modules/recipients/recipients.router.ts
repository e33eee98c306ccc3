import type { Sequelize } from 'sequelize';
import { z } from 'zod';
import { validate } from '../../middleware/validate';
import { IdParamSchema } from '@shared/schemas/user';
import { PutRecipientGuidelinesBodySchema } from '@shared/schemas/guidelines';
import {
  NeedCreateSchema,
  NeedParamsSchema,
  NeedUpdateSchema,
  RecipientCreateSchema,
  RecipientListQuerySchema,
  RecipientUpdateSchema,
} from '@shared/schemas/recipient';
import type { RouteDef } from '../route-table';
import * as service from './recipients.service';
import { keptJson } from '../../lib/kept-json';

const MANAGERS = ['organiser', 'coordinator'] as const;

const VersionQuerySchema = z.object({
  version: z.coerce.number({ error: 'version must be a number' }).int().min(0).optional(),
});

export function recipientRoutes(ctx: { sequelize: Sequelize }): RouteDef[] {
  return [
    {
      method: 'get', path: '/api/recipients', access: 'signed-in', summary: 'Recipients with their needs and guidelines',
      handlers: [
        validate({ query: RecipientListQuerySchema }),
        keptJson({ per: 'role' }, async (req) => {
          const q = req.query as unknown as z.infer<typeof RecipientListQuerySchema>;
          return { recipients: await service.listRecipients(req.user!.role, q.active) };
        }),
      ],
    },
    {
      method: 'post', path: '/api/recipients', access: [...MANAGERS], summary: 'Add a recipient',
      handlers: [
        validate({ body: RecipientCreateSchema }),
        async (req, res) => {
          res.status(201).json({ recipient: await service.createRecipient(ctx.sequelize, req.body, req.user!.role) });
        },
      ],
    },
    {
      method: 'get', path: '/api/recipients/:id', access: 'signed-in', summary: 'One recipient with its needs and guidelines',
      handlers: [
        validate({ params: IdParamSchema }),
        async (req, res) => {
          res.json({ recipient: await service.getRecipient(Number(req.params.id), req.user!.role) });
        },
      ],
    },
    {
      method: 'patch', path: '/api/recipients/:id', access: [...MANAGERS], summary: 'Change a recipient',
      handlers: [
        validate({ params: IdParamSchema, body: RecipientUpdateSchema }),
        async (req, res) => {
          res.json({ recipient: await service.updateRecipient(Number(req.params.id), req.body, req.user!.role) });
        },
      ],
    },
    {
      method: 'put', path: '/api/recipients/:id/guidelines', access: [...MANAGERS], summary: "Replace a recipient's guideline set",
      handlers: [
        validate({ params: IdParamSchema, query: VersionQuerySchema, body: PutRecipientGuidelinesBodySchema }),
        async (req, res) => {
          const q = req.query as unknown as z.infer<typeof VersionQuerySchema>;
          res.json({ recipient: await service.putGuidelines(Number(req.params.id), req.body, req.user!.role, q.version) });
        },
      ],
    },
    {
      method: 'post', path: '/api/recipients/:id/needs', access: [...MANAGERS], summary: 'Add a need to a recipient',
      handlers: [
        validate({ params: IdParamSchema, body: NeedCreateSchema }),
        async (req, res) => {
          res.status(201).json({ need: await service.createNeed(Number(req.params.id), req.body) });
        },
      ],
    },
    {
      method: 'patch', path: '/api/recipients/:id/needs/:needId', access: [...MANAGERS], summary: 'Change a need',
      handlers: [
        validate({ params: NeedParamsSchema, body: NeedUpdateSchema }),
        async (req, res) => {
          res.json({ need: await service.updateNeed(Number(req.params.id), Number(req.params.needId), req.body) });
        },
      ],
    },
    {
      method: 'delete', path: '/api/recipients/:id/needs/:needId', access: [...MANAGERS], summary: 'Remove a need nobody has pledged against',
      handlers: [
        validate({ params: NeedParamsSchema }),
        async (req, res) => {
          await service.deleteNeed(Number(req.params.id), Number(req.params.needId));
          res.status(204).end();
        },
      ],
    },
  ];
}
