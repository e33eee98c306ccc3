import { validate } from '../../middleware/validate';
import { IdParamSchema } from '@shared/schemas/user';
import { PlanCreateSchema } from '@shared/schemas/plan';
import type { RouteDef } from '../route-table';
import * as service from './plans.service';

/** A maker's saved planner results. Plans are private to their maker, whatever the role. */
export function planRoutes(): RouteDef[] {
  return [
    {
      method: 'get', path: '/api/plans', access: 'signed-in', summary: 'My saved plans',
      handlers: [
        async (req, res) => {
          res.json({ plans: await service.listPlans(req.user!.id) });
        },
      ],
    },
    {
      method: 'post', path: '/api/plans', access: 'signed-in', summary: 'Save a plan',
      handlers: [
        validate({ body: PlanCreateSchema }),
        async (req, res) => {
          res.status(201).json({ plan: await service.createPlan(req.user!.id, req.body) });
        },
      ],
    },
    {
      method: 'get', path: '/api/plans/:id', access: 'signed-in', summary: 'One of my saved plans',
      handlers: [
        validate({ params: IdParamSchema }),
        async (req, res) => {
          res.json({ plan: await service.getPlan(req.user!.id, Number(req.params.id)) });
        },
      ],
    },
    {
      method: 'delete', path: '/api/plans/:id', access: 'signed-in', summary: 'Delete one of my saved plans',
      handlers: [
        validate({ params: IdParamSchema }),
        async (req, res) => {
          await service.deletePlan(req.user!.id, Number(req.params.id));
          res.status(204).end();
        },
      ],
    },
  ];
}
