import { Drive } from '../../db/models/drive';
import { User } from '../../db/models/user';
import type { RouteDef } from '../route-table';
import type { Config } from '../../config/env';
import type { MapTilesResponse } from '@shared/schemas/map';
import { driveProgress } from './progress.service';
import { driveGlance, glanceWeeks } from './glance.service';
import { validate } from '../../middleware/validate';
import { GlanceWeeksQuerySchema, type GlanceWeeksQuery } from '@shared/schemas/glance';
import { keptJson } from '../../lib/kept-json';

export function driveRoutes(config: Pick<Config, 'tiles'>): RouteDef[] {
  return [
    {
      method: 'get', path: '/api/drive', access: 'public', summary: 'The drive this site runs',
      handlers: [
        async (_req, res) => {
          const drive = await Drive.findOne({ order: [['id', 'ASC']] });
          const volunteers = await User.count({ where: { role: 'volunteer', active: true } });
          res.json({ drive, volunteers });
        },
      ],
    },
    {
      method: 'get', path: '/api/drive/progress', access: ['organiser', 'coordinator'], summary: 'Wanted, pledged, finished, in hand and assigned per recipient; blankets per status',
      handlers: [
        keptJson({ per: 'role' }, async () => ({ progress: await driveProgress() })),
      ],
    },
    {
      method: 'get', path: '/api/drive/glance', access: ['organiser', 'coordinator'], summary: 'The drive at a glance: blankets at each step per open need and per week, needs at risk, blankets waiting longest, next runs and latest exports',
      handlers: [
        async (_req, res) => {
          res.json({ glance: await driveGlance() });
        },
      ],
    },
    {
      method: 'get', path: '/api/drive/glance/weeks', access: ['organiser', 'coordinator'], summary: 'The drive at a glance week by week for one need: blankets pledged for it, and its blankets reaching each step',
      handlers: [
        validate({ query: GlanceWeeksQuerySchema }),
        async (req, res) => {
          const { needId } = req.query as unknown as GlanceWeeksQuery;
          res.json({ weeks: await glanceWeeks(needId) });
        },
      ],
    },
    {
      method: 'get', path: '/api/map', access: 'public', summary: "The maps' tile server and its attribution (TILE_URL), or null for the demo town's own basemap",
      handlers: [
        (_req, res) => {
          const body: MapTilesResponse = { tiles: config.tiles };
          res.json(body);
        },
      ],
    },
    {
      method: 'get', path: '/api/health', access: 'public', summary: 'Liveness check',
      handlers: [(_req, res) => res.json({ ok: true })],
    },
  ];
}
