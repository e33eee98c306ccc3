import { validate } from '../../middleware/validate';
import { GuidelineCheckBodySchema } from '@shared/schemas/guidelines';
import type { RouteDef } from '../route-table';
import { checkAgainst } from './guidelines.service';

export function guidelineRoutes(): RouteDef[] {
  return [
    {
      method: 'post', path: '/api/guidelines/check', access: 'signed-in',
      summary: "Check a blanket against a recipient's guidelines, with where else it fits",
      handlers: [
        validate({ body: GuidelineCheckBodySchema }),
        async (req, res) => {
          // Flat, in the shape of check() itself, with the recipient, its guidelines and the cautions beside it.
          res.json(await checkAgainst(req.body.recipientId, req.body.blanket, undefined, { activeOnly: req.user!.role === 'volunteer' }));
        },
      ],
    },
  ];
}
