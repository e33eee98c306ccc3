import type { Sequelize } from 'sequelize';
import { validate } from '../../middleware/validate';
import { IdParamSchema } from '@shared/schemas/user';
import { BlanketCreateSchema, BlanketListQuerySchema, BlanketUpdateSchema, type BlanketListQuery } from '@shared/schemas/blanket-log';
import type { RouteDef } from '../route-table';
import { blanketDetail, createBlanket, listBlankets, updateBlanket } from './blankets.service';
import { keptJson } from '../../lib/kept-json';

export function blanketRoutes(sequelize: Sequelize): RouteDef[] {
  return [
    {
      method: 'get', path: '/api/blankets', access: 'signed-in', summary: 'One page of blankets (your own, or everyone\'s for staff), filtered, searched and sorted',
      handlers: [
        validate({ query: BlanketListQuerySchema }),
        keptJson({ per: 'user' }, (req) => listBlankets(req.user!, req.query as unknown as BlanketListQuery)),
      ],
    },
    {
      method: 'post', path: '/api/blankets', access: 'signed-in', summary: 'Log a blanket under one of your pledges',
      handlers: [
        validate({ body: BlanketCreateSchema }),
        async (req, res) => {
          const id = await sequelize.transaction((transaction) => createBlanket(req.user!, req.body, transaction));
          const blanket = await blanketDetail(req.user!, id);
          // id, code and status at the top level are what every client needs straight after logging.
          res.status(201).json({ id: blanket.id, code: blanket.code, status: blanket.status, blanket });
        },
      ],
    },
    {
      method: 'get', path: '/api/blankets/:id', access: 'signed-in', summary: 'One blanket with photos, history and its self-check',
      handlers: [
        validate({ params: IdParamSchema }),
        async (req, res) => {
          res.json({ blanket: await blanketDetail(req.user!, Number(req.params.id)) });
        },
      ],
    },
    {
      method: 'patch', path: '/api/blankets/:id', access: 'signed-in', summary: 'Correct the log or move the blanket to its next status',
      handlers: [
        validate({ params: IdParamSchema, body: BlanketUpdateSchema }),
        async (req, res) => {
          const id = Number(req.params.id);
          await sequelize.transaction((transaction) => updateBlanket(req.user!, id, req.body, transaction));
          res.json({ blanket: await blanketDetail(req.user!, id) });
        },
      ],
    },
  ];
}
