import { planBorder, type BorderPlan } from '@shared/border/plan';
import { bodyCountsFromGauge, type BodyCounts } from '@shared/sizing/gauge';
import { estimateYarn, type YarnEstimate } from '@shared/sizing/yarn-estimate';
import type { BorderFitRequest, SizeFromGaugeRequest, YarnEstimateRequest } from '@shared/schemas/border-fit';
import { HttpError } from '../../lib/http-error';

/**
 * The schemas catch every input we know to be wrong; the engines still throw RangeError for the
 * rare combination they alone can judge, and that is the caller's mistake, not a server fault.
 */
function asClientError<T>(field: string, run: () => T): T {
  try {
    return run();
  } catch (err) {
    if (err instanceof RangeError) throw new HttpError(400, err.message, [{ path: field, message: err.message }]);
    throw err;
  }
}

export function borderFit(req: BorderFitRequest): BorderPlan {
  return asClientError('rows', () =>
    planBorder({
      across: req.across,
      rows: req.rows,
      multiple: req.multiple,
      offset: req.offset,
      strategy: req.strategy,
      mode: req.mode,
      lead: req.lead,
      centre: req.centre,
      cornerStitches: req.cornerStitches,
    }),
  );
}

export function sizeFromGauge(req: SizeFromGaugeRequest): BodyCounts {
  return asClientError('borderDepth', () => bodyCountsFromGauge(req));
}

export function yarnEstimate(req: YarnEstimateRequest): YarnEstimate {
  return asClientError('yarnWeight', () => estimateYarn(req));
}
