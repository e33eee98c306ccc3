import type { Sequelize } from 'sequelize';
import type { z } from 'zod';
import { validate } from '../../middleware/validate';
import { IdParamSchema } from '@shared/schemas/user';
import {
  AssignBatchBodySchema,
  AssignBodySchema,
  AssignmentListQuerySchema,
  BoardQuerySchema,
  ReassignBodySchema,
  SuggestBodySchema,
  UnassignBodySchema,
} from '@shared/schemas/assignment';
import type { RouteDef } from '../route-table';
import * as service from './assignments.service';

const STAFF = ['organiser', 'coordinator'] as const;

/** The assignment board's routes and the suggestion; organisers and coordinators only. */
export function assignmentRoutes(sequelize: Sequelize): RouteDef[] {
  return [
    {
      method: 'get', path: '/api/assignments', access: [...STAFF], summary: 'One page of live assignments, by need or recipient',
      handlers: [
        validate({ query: AssignmentListQuerySchema }),
        async (req, res) => {
          res.json(await service.listAssignments(req.query as unknown as z.infer<typeof AssignmentListQuerySchema>));
        },
      ],
    },
    {
      method: 'post', path: '/api/assignments', access: [...STAFF], summary: 'Assign a checked blanket to a need',
      handlers: [
        validate({ body: AssignBodySchema }),
        async (req, res) => {
          res.status(201).json({ assignment: await service.assign(sequelize, req.user!, req.body) });
        },
      ],
    },
    {
      method: 'post', path: '/api/assignments/batch', access: [...STAFF], summary: 'Assign many blankets in one transaction, with an outcome per pair',
      handlers: [
        validate({ body: AssignBatchBodySchema }),
        async (req, res) => {
          res.json(await service.assignBatch(sequelize, req.user!, req.body));
        },
      ],
    },
    {
      method: 'patch', path: '/api/assignments/:id', access: [...STAFF], summary: 'Move an assigned blanket to another need',
      handlers: [
        validate({ params: IdParamSchema, body: ReassignBodySchema }),
        async (req, res) => {
          res.json({ assignment: await service.reassign(sequelize, req.user!, Number(req.params.id), req.body) });
        },
      ],
    },
    {
      method: 'delete', path: '/api/assignments/:id', access: [...STAFF], summary: 'Unassign a blanket, with a reason, back to the checked blankets',
      handlers: [
        validate({ params: IdParamSchema, body: UnassignBodySchema }),
        async (req, res) => {
          res.json(await service.unassign(sequelize, req.user!, Number(req.params.id), req.body.reason));
        },
      ],
    },
    {
      method: 'get', path: '/api/assignments/board/needs', access: [...STAFF], summary: 'Open needs with wanted, assigned and open counts and their urgency',
      handlers: [
        validate({ query: BoardQuerySchema }),
        async (req, res) => {
          res.json({ needs: await service.boardNeeds(req.query as unknown as z.infer<typeof BoardQuerySchema>) });
        },
      ],
    },
    {
      method: 'get', path: '/api/assignments/board/waiting', access: [...STAFF], summary: 'One page of checked blankets waiting, with where each fits and why not',
      handlers: [
        validate({ query: BoardQuerySchema }),
        async (req, res) => {
          res.json(await service.boardWaiting(req.query as unknown as z.infer<typeof BoardQuerySchema>));
        },
      ],
    },
    {
      method: 'post', path: '/api/matching/suggest', access: [...STAFF], summary: 'Suggest the best assignment of waiting blankets to open needs (writes nothing)',
      handlers: [
        validate({ body: SuggestBodySchema }),
        async (req, res) => {
          res.json(await service.suggest(req.body));
        },
      ],
    },
  ];
}
