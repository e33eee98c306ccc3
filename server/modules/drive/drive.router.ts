import { Drive } from '../../db/models/drive';
import { User } from '../../db/models/user';
import type { RouteDef } from '../route-table';

export function driveRoutes(): RouteDef[] {
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
      method: 'get', path: '/api/health', access: 'public', summary: 'Liveness check',
      handlers: [(_req, res) => res.json({ ok: true })],
    },
  ];
}
