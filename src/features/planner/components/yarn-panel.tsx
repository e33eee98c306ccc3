import { Card, CardTitle } from '@/components/ui/card';
import { Field, Input, Select } from '@/components/ui/field';
import { Alert } from '@/components/ui/alert';
import { YARN_WEIGHTS } from '@shared/sizing/yarn-weights';
import { WORSTED_YARDS_PER_SQ_IN } from '@shared/sizing/yarn-estimate';
import { yardsToMetres } from '@shared/sizing/units';
import type { FieldErrors, PlannerResult, PlannerState } from '../hooks/use-planner';
import { formatLength } from './terms';
import { rowCount } from '@shared/border/row-ends';

const n = (v: number) => Math.round(v).toLocaleString('en-GB');

export function YarnPanel({ state, result, errors, update }: { state: PlannerState; result: PlannerResult; errors: FieldErrors; update: (p: Partial<PlannerState>) => void }) {
  const { yarn, sizes } = result;
  return (
    <Card className="break-inside-avoid" data-testid="yarn-panel">
      <CardTitle>Yarn estimate</CardTitle>
      <p className="hidden print:block">
        Yarn weight #{state.yarnWeight}, balls of {state.skeinLength} {state.skeinUnit}, {state.marginPct} % spare.
      </p>
      <div className="no-print space-y-4">
        <Field label="Yarn weight" error={errors.yarnWeight}>
          {({ id }) => (
            <Select id={id} value={state.yarnWeight} onChange={(e) => update({ yarnWeight: e.target.value })}>
              {YARN_WEIGHTS.filter((w) => w.category > 0).map((w) => (
                <option key={w.category} value={w.category}>
                  #{w.category} {w.name} ({w.typicalYarns.join(', ')})
                </option>
              ))}
            </Select>
          )}
        </Field>
        <div className="grid grid-cols-[1fr_auto] items-start gap-2">
          <Field label="Length of one ball or skein" error={errors.skeinLength}>
            {({ id, describedBy, invalid }) => (
              <Input id={id} inputMode="decimal" autoComplete="off" value={state.skeinLength} aria-describedby={describedBy} aria-invalid={invalid} onChange={(e) => update({ skeinLength: e.target.value })} />
            )}
          </Field>
          <Field label="Unit">
            {({ id }) => (
              <Select id={id} value={state.skeinUnit} onChange={(e) => update({ skeinUnit: e.target.value as 'm' | 'yd' })} className="w-24">
                <option value="m">m</option>
                <option value="yd">yd</option>
              </Select>
            )}
          </Field>
        </div>
        <Field label="Spare yarn" hint="Extra on top, so you don't run short in a different dye lot" error={errors.marginPct}>
          {({ id, describedBy, invalid }) => (
            <div className="flex items-center gap-2">
              <Input id={id} inputMode="decimal" autoComplete="off" value={state.marginPct} aria-describedby={describedBy} aria-invalid={invalid} onChange={(e) => update({ marginPct: e.target.value })} className="w-28" />
              <span className="font-bold text-ink-soft">%</span>
            </div>
          )}
        </Field>
      </div>

      {yarn && sizes ? (
        <div className="mt-5 space-y-3" data-testid="yarn-result">
          <p className="text-2xl font-bold">
            About {n(yarn.totalMetres)} m <span className="text-lg font-normal text-ink-soft">({n(yarn.totalYards)} yd)</span>
          </p>
          {yarn.skeins !== undefined && (
            <p className="text-lg">
              <span className="font-bold">{yarn.skeins}</span> {yarn.skeins === 1 ? 'ball' : 'balls'} of {state.skeinLength} {state.skeinUnit}
            </p>
          )}
          <p>
            Body {n(yardsToMetres(yarn.bodyYards))} m and border {n(yardsToMetres(yarn.borderYards))} m, then {Math.round(yarn.margin * 100)} % spare, rounded up.
          </p>
          <p data-testid="yarn-counts">
            For the plan's {result.across} stitches × {result.rows === undefined ? '?' : rowCount(result.rows)} rows: a body of{' '}
            {formatLength(sizes.body.width, sizes.body.unit)} × {formatLength(sizes.body.length, sizes.body.unit)} at your swatch.
          </p>
          <Alert kind="info" title="A rule of thumb, not a measurement">
            Medium (#4) yarn uses about {WORSTED_YARDS_PER_SQ_IN} yd per square inch of sc, hdc or dc fabric: a figure from memory, recalled from one maker's published measurements. Other weights
            are scaled from that by their standard gauges, which is our own estimate. Your yarn, stitch and tension can use noticeably more or less: buy
            enough of one dye lot, or weigh a finished swatch for a closer figure.
          </Alert>
        </div>
      ) : (
        <p className="mt-5 text-ink-soft">Fill in your swatch (in the panel beside this one) to estimate the yarn.</p>
      )}
    </Card>
  );
}
