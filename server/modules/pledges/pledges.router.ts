import type { Sequelize } from 'sequelize';
import { validate } from '../../middleware/validate';
import { IdParamSchema } from '@shared/schemas/user';
import { PledgeCreateSchema, PledgeListQuerySchema, PledgeUpdateSchema, type PledgeListQuery } from '@shared/schemas/pledge';
import type { RouteDef } from '../route-table';
import { cancelPledge, createPledge, listPledges, pledgeView, updatePledge, visiblePledge } from './pledges.service';
import { listOpenNeeds } from './needs.service';
import { keptJson } from '../../lib/kept-json';

export function pledgeRoutes(sequelize: Sequelize): RouteDef[] {
  return [
    {
      method: 'get', path: '/api/needs', access: 'signed-in', summary: 'Open needs with pledged and still-wanted counts',
      handlers: [
        keptJson({ per: 'user' }, async (req) => ({ needs: await listOpenNeeds(req.user!) })),
      ],
    },
    {
      method: 'get', path: '/api/pledges', access: 'signed-in', summary: 'One page of pledges (your own, or everyone\'s for staff), filtered, searched and sorted',
      handlers: [
        validate({ query: PledgeListQuerySchema }),
        keptJson({ per: 'user' }, (req) => listPledges(req.user!, req.query as unknown as PledgeListQuery)),
      ],
    },
    {
      method: 'post', path: '/api/pledges', access: 'signed-in', summary: 'Pledge blankets against a need or wherever needed most',
      handlers: [
        validate({ body: PledgeCreateSchema }),
        async (req, res) => {
          const pledge = await sequelize.transaction((transaction) => createPledge(req.user!, req.body, transaction));
          res.status(201).json({ pledge });
        },
      ],
    },
    {
      method: 'get', path: '/api/pledges/:id', access: 'signed-in', summary: 'One pledge',
      handlers: [
        validate({ params: IdParamSchema }),
        async (req, res) => {
          const p = await visiblePledge(req.user!, Number(req.params.id));
          res.json({ pledge: await pledgeView(p.id) });
        },
      ],
    },
    {
      method: 'patch', path: '/api/pledges/:id', access: 'signed-in', summary: 'Edit, reduce or push back your pledge',
      handlers: [
        validate({ params: IdParamSchema, body: PledgeUpdateSchema }),
        async (req, res) => {
          const pledge = await sequelize.transaction((transaction) => updatePledge(req.user!, Number(req.params.id), req.body, transaction));
          res.json({ pledge });
        },
      ],
    },
    {
      method: 'delete', path: '/api/pledges/:id', access: 'signed-in', summary: 'Cancel your pledge',
      handlers: [
        validate({ params: IdParamSchema }),
        async (req, res) => {
          const pledge = await sequelize.transaction((transaction) => cancelPledge(req.user!, Number(req.params.id), transaction));
          res.json({ pledge });
        },
      ],
    },
  ];
}
