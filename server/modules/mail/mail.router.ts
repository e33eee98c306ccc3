import { CaughtMail } from '../../db/models/caught-mail';
import { MailMessage } from '../../db/models/mail-message';
import { IdParamSchema } from '@shared/schemas/user';
import { validate } from '../../middleware/validate';
import { notFound } from '../../lib/http-error';
import type { RouteDef } from '../route-table';

export function mailRoutes(): RouteDef[] {
  return [
    {
      method: 'get', path: '/api/mail/caught', access: ['coordinator'], summary: 'Mail held by the local catcher',
      handlers: [
        async (_req, res) => {
          const mail = await CaughtMail.findAll({ order: [['id', 'DESC']], limit: 200 });
          const outbox = {
            pending: await MailMessage.count({ where: { status: 'pending' } }),
            failed: await MailMessage.count({ where: { status: 'failed' } }),
            sent: await MailMessage.count({ where: { status: 'sent' } }),
          };
          res.json({ mail, outbox });
        },
      ],
    },
    {
      method: 'get', path: '/api/mail/caught/:id', access: ['coordinator'], summary: 'One caught message',
      handlers: [
        validate({ params: IdParamSchema }),
        async (req, res) => {
          const mail = await CaughtMail.findByPk(Number(req.params.id));
          if (!mail) throw notFound('That message');
          res.json({ mail });
        },
      ],
    },
  ];
}
