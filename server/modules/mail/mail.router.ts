import type { Sequelize } from 'sequelize';
import type { z } from 'zod';
import { IdParamSchema } from '@shared/schemas/user';
import { PageQuerySchema } from '@shared/schemas/page-query';
import { OutboxQuerySchema } from '@shared/schemas/mail';
import { validate } from '../../middleware/validate';
import type { RouteDef } from '../route-table';
import * as service from './mail.service';

export function mailRoutes(sequelize: Sequelize): RouteDef[] {
  return [
    {
      method: 'get', path: '/api/mail/caught', access: ['coordinator'],
      summary: 'Mail held by the local catcher, newest first (single-use links shown only to their addressee)',
      handlers: [
        validate({ query: PageQuerySchema }),
        async (req, res) => {
          const q = req.query as unknown as z.infer<typeof PageQuerySchema>;
          res.json({ mail: await service.listCaught(req.user!.email, q), outbox: await service.outboxCounts() });
        },
      ],
    },
    {
      method: 'get', path: '/api/mail/caught/:id', access: ['coordinator'], summary: 'One caught message',
      handlers: [
        validate({ params: IdParamSchema }),
        async (req, res) => {
          res.json({ mail: await service.getCaught(req.user!.email, Number(req.params.id)) });
        },
      ],
    },
    {
      method: 'get', path: '/api/mail/outbox', access: ['coordinator'],
      summary: 'Mail not yet sent: waiting for another try, failed, or given up (?show=)',
      handlers: [
        validate({ query: OutboxQuerySchema }),
        async (req, res) => {
          const q = req.query as unknown as z.infer<typeof OutboxQuerySchema>;
          res.json({ messages: await service.listOutbox(q), counts: await service.outboxCounts() });
        },
      ],
    },
    {
      method: 'post', path: '/api/mail/outbox/:id/send-again', access: ['coordinator'],
      summary: 'Try a waiting, failed or given-up message again now, with a fresh week of retries',
      handlers: [
        validate({ params: IdParamSchema }),
        async (req, res) => {
          res.json({ message: await service.sendAgain(sequelize, Number(req.params.id)) });
        },
      ],
    },
    {
      method: 'post', path: '/api/mail/outbox/:id/give-up', access: ['coordinator'], summary: 'Stop trying to send a message',
      handlers: [
        validate({ params: IdParamSchema }),
        async (req, res) => {
          res.json({ message: await service.giveUp(sequelize, Number(req.params.id)) });
        },
      ],
    },
  ];
}
