import type { Sequelize } from 'sequelize';
import type { z } from 'zod';
import { validate } from '../../middleware/validate';
import { IdParamSchema } from '@shared/schemas/user';
import {
  DeliverSchema,
  ExportListQuerySchema,
  ManifestQuerySchema,
  PackSchema,
  RunBlanketAddSchema,
  RunBlanketParamsSchema,
  RunCreateSchema,
  RunListQuerySchema,
  RunStopParamsSchema,
  RunUpdateSchema,
  StopAddSchema,
  UndoSchema,
  type RunListQuery,
} from '@shared/schemas/run';
import type { Access } from '../../auth/require-role';
import type { RouteDef } from '../route-table';
import * as service from './runs.service';
import { listExports, sendExport, streamManifest } from './manifest.service';

/** Organisers see runs, pack and export; planning the route and delivering belong to coordinators, as in the status machine. */
const STAFF: Access = ['organiser', 'coordinator'];
const COORDINATOR: Access = ['coordinator'];

export function runRoutes(deps: { sequelize: Sequelize; exportDir: string; publicUrl: string }): RouteDef[] {
  const { sequelize, exportDir, publicUrl } = deps;
  const runId = (p: unknown) => Number((p as { id: string }).id);
  const stopId = (p: unknown) => Number((p as { stopId: string }).stopId);
  return [
    {
      method: 'get', path: '/api/runs', access: STAFF, summary: 'One page of delivery runs, upcoming or past',
      handlers: [
        validate({ query: RunListQuerySchema }),
        async (req, res) => {
          res.json(await service.listRuns(req.query as unknown as RunListQuery));
        },
      ],
    },
    {
      method: 'get', path: '/api/runs/waiting', access: STAFF, summary: 'Recipients with assigned blankets that no run carries yet',
      handlers: [
        async (_req, res) => {
          res.json({ recipients: await service.waitingRecipients(sequelize) });
        },
      ],
    },
    {
      method: 'post', path: '/api/runs', access: COORDINATOR, summary: 'Plan a delivery run: date, driver, start site and stops',
      handlers: [
        validate({ body: RunCreateSchema }),
        async (req, res) => {
          res.status(201).json({ run: await service.createRun(sequelize, req.body, req.user!) });
        },
      ],
    },
    {
      method: 'get', path: '/api/runs/:id', access: STAFF, summary: 'One run with its stops, blankets, boxes, legs and cautions',
      handlers: [
        validate({ params: IdParamSchema }),
        async (req, res) => {
          res.json({ run: await service.getRun(runId(req.params)) });
        },
      ],
    },
    {
      method: 'patch', path: '/api/runs/:id', access: COORDINATOR, summary: 'Change a run\'s date, driver, start, notes or stop order',
      handlers: [
        validate({ params: IdParamSchema, body: RunUpdateSchema }),
        async (req, res) => {
          res.json({ run: await service.updateRun(sequelize, runId(req.params), req.body) });
        },
      ],
    },
    {
      method: 'post', path: '/api/runs/:id/route', access: COORDINATOR, summary: 'Order the stops by the suggested round trip',
      handlers: [
        validate({ params: IdParamSchema }),
        async (req, res) => {
          res.json({ run: await service.applySuggestedRoute(sequelize, runId(req.params)) });
        },
      ],
    },
    {
      method: 'post', path: '/api/runs/:id/stops', access: COORDINATOR, summary: 'Add a recipient as a stop, with its waiting blankets',
      handlers: [
        validate({ params: IdParamSchema, body: StopAddSchema }),
        async (req, res) => {
          res.status(201).json({ run: await service.addStop(sequelize, runId(req.params), req.body.recipientId) });
        },
      ],
    },
    {
      method: 'delete', path: '/api/runs/:id/stops/:stopId', access: COORDINATOR, summary: 'Take an unpacked stop off the run',
      handlers: [
        validate({ params: RunStopParamsSchema }),
        async (req, res) => {
          res.json({ run: await service.removeStop(sequelize, runId(req.params), stopId(req.params)) });
        },
      ],
    },
    {
      method: 'post', path: '/api/runs/:id/blankets', access: COORDINATOR, summary: 'Put one assigned blanket on the run',
      handlers: [
        validate({ params: IdParamSchema, body: RunBlanketAddSchema }),
        async (req, res) => {
          const body = req.body as z.infer<typeof RunBlanketAddSchema>;
          res.status(201).json({ run: await service.addBlanket(sequelize, runId(req.params), body.blanketId, body.box) });
        },
      ],
    },
    {
      method: 'delete', path: '/api/runs/:id/blankets/:blanketId', access: COORDINATOR, summary: 'Take an unpacked blanket off the run',
      handlers: [
        validate({ params: RunBlanketParamsSchema }),
        async (req, res) => {
          res.json({ run: await service.removeBlanket(sequelize, runId(req.params), Number(req.params.blanketId)) });
        },
      ],
    },
    {
      method: 'post', path: '/api/runs/:id/stops/:stopId/packed', access: STAFF, summary: 'Mark a stop packed: its blankets move to packed, in their boxes',
      handlers: [
        validate({ params: RunStopParamsSchema, body: PackSchema }),
        async (req, res) => {
          res.json({ run: await service.packStop(sequelize, runId(req.params), stopId(req.params), req.body, req.user!) });
        },
      ],
    },
    {
      method: 'delete', path: '/api/runs/:id/stops/:stopId/packed', access: STAFF, summary: 'Unpack a stop, with the reason',
      handlers: [
        validate({ params: RunStopParamsSchema, body: UndoSchema }),
        async (req, res) => {
          res.json({ run: await service.unpackStop(sequelize, runId(req.params), stopId(req.params), req.body.reason, req.user!) });
        },
      ],
    },
    {
      method: 'post', path: '/api/runs/:id/stops/:stopId/delivered', access: STAFF, summary: 'Mark a stop delivered, with the count received and who signed (coordinators, or the run’s driver)',
      handlers: [
        validate({ params: RunStopParamsSchema, body: DeliverSchema }),
        async (req, res) => {
          res.json({ run: await service.deliverStop(sequelize, runId(req.params), stopId(req.params), req.body, req.user!, publicUrl) });
        },
      ],
    },
    {
      method: 'delete', path: '/api/runs/:id/stops/:stopId/delivered', access: STAFF, summary: 'Undo a delivery, with the reason (coordinators, or the run’s driver)',
      handlers: [
        validate({ params: RunStopParamsSchema, body: UndoSchema }),
        async (req, res) => {
          res.json({ run: await service.undeliverStop(sequelize, runId(req.params), stopId(req.params), req.body.reason, req.user!) });
        },
      ],
    },
    {
      method: 'get', path: '/api/runs/:id/manifest.csv', access: STAFF, summary: 'The run\'s delivery list as CSV (RFC 4180), kept in the export folder',
      handlers: [
        validate({ params: IdParamSchema, query: ManifestQuerySchema }),
        async (req, res) => {
          const { bom } = req.query as unknown as { bom: boolean };
          await streamManifest(sequelize, exportDir, { kind: 'run', id: runId(req.params) }, { bom }, req.user!, res);
        },
      ],
    },
    {
      method: 'get', path: '/api/recipients/:id/manifest.csv', access: STAFF, summary: 'Everything given to one recipient as CSV (RFC 4180), kept in the export folder',
      handlers: [
        validate({ params: IdParamSchema, query: ManifestQuerySchema }),
        async (req, res) => {
          const { bom } = req.query as unknown as { bom: boolean };
          await streamManifest(sequelize, exportDir, { kind: 'recipient', id: runId(req.params) }, { bom }, req.user!, res);
        },
      ],
    },
    {
      method: 'get', path: '/api/exports', access: STAFF, summary: 'One page of the manifests written, newest first',
      handlers: [
        validate({ query: ExportListQuerySchema }),
        async (req, res) => {
          res.json(await listExports(req.query as unknown as { page: number; pageSize: number }));
        },
      ],
    },
    {
      method: 'get', path: '/api/exports/:id', access: STAFF, summary: 'Download a manifest written earlier, as it was',
      handlers: [
        validate({ params: IdParamSchema }),
        async (req, res) => {
          await sendExport(exportDir, runId(req.params), res);
        },
      ],
    },
  ];
}
