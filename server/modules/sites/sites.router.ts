import type { z } from 'zod';
import { validate } from '../../middleware/validate';
import { IdParamSchema } from '@shared/schemas/user';
import { SiteCreateSchema, SiteListQuerySchema, SiteUpdateSchema } from '@shared/schemas/site';
import type { RouteDef } from '../route-table';
import * as service from './sites.service';

export function siteRoutes(): RouteDef[] {
  return [
    {
      method: 'get', path: '/api/sites', access: 'signed-in', summary: 'Drop-off sites',
      handlers: [
        validate({ query: SiteListQuerySchema }),
        async (req, res) => {
          const q = req.query as unknown as z.infer<typeof SiteListQuerySchema>;
          // Volunteers choose where to bring a blanket; closed sites are no use to them.
          const active = req.user!.role === 'volunteer' ? 'true' : q.active;
          res.json({ sites: await service.listSites(active) });
        },
      ],
    },
    {
      method: 'post', path: '/api/sites', access: ['coordinator'], summary: 'Add a drop-off site',
      handlers: [
        validate({ body: SiteCreateSchema }),
        async (req, res) => {
          res.status(201).json({ site: await service.createSite(req.body) });
        },
      ],
    },
    {
      method: 'get', path: '/api/sites/:id', access: 'signed-in', summary: 'One drop-off site',
      handlers: [
        validate({ params: IdParamSchema }),
        async (req, res) => {
          res.json({ site: await service.getSite(Number(req.params.id), { activeOnly: req.user!.role === 'volunteer' }) });
        },
      ],
    },
    {
      method: 'patch', path: '/api/sites/:id', access: ['coordinator'], summary: 'Change a drop-off site',
      handlers: [
        validate({ params: IdParamSchema, body: SiteUpdateSchema }),
        async (req, res) => {
          res.json({ site: await service.updateSite(Number(req.params.id), req.body) });
        },
      ],
    },
  ];
}
