import { validate } from '../../middleware/validate';
import { BorderFitRequestSchema, SizeFromGaugeRequestSchema, YarnEstimateRequestSchema } from '@shared/schemas/border-fit';
import type { RouteDef } from '../route-table';
import * as service from './tools.service';

/** The planner's arithmetic for clients other than our own screen, which computes it in the browser. */
export function toolRoutes(): RouteDef[] {
  return [
    {
      method: 'post', path: '/api/tools/border-fit', access: 'public', summary: 'Fit a border multiple to a blanket',
      handlers: [
        validate({ body: BorderFitRequestSchema }),
        (req, res) => {
          res.json(service.borderFit(req.body));
        },
      ],
    },
    {
      method: 'post', path: '/api/tools/size-from-gauge', access: 'public', summary: 'Starting counts from a swatch and a target size',
      handlers: [
        validate({ body: SizeFromGaugeRequestSchema }),
        (req, res) => {
          res.json(service.sizeFromGauge(req.body));
        },
      ],
    },
    {
      method: 'post', path: '/api/tools/yarn-estimate', access: 'public', summary: 'Yarn for a blanket, by area',
      handlers: [
        validate({ body: YarnEstimateRequestSchema }),
        (req, res) => {
          res.json(service.yarnEstimate(req.body));
        },
      ],
    },
  ];
}
