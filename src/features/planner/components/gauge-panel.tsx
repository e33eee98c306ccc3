import { Card, CardTitle } from '@/components/ui/card';
import { Field, Input } from '@/components/ui/field';
import { Button } from '@/components/ui/button';
import { Alert } from '@/components/ui/alert';
import { rowCount } from '@shared/border/row-ends';
import { countsInUse, type FieldErrors, type PlannerResult, type PlannerState } from '../hooks/use-planner';
import { ChoiceGroup } from './choice-group';
import { formatLength, inTerms } from './terms';

type Update = (p: Partial<PlannerState>) => void;

function NumberField({ label, hint, value, error, onChange, suffix }: { label: string; hint?: string; value: string; error?: string; onChange: (v: string) => void; suffix?: string }) {
  return (
    <Field label={label} hint={hint} error={error}>
      {({ id, describedBy, invalid }) => (
        <div className="flex items-center gap-2">
          <Input id={id} inputMode="decimal" autoComplete="off" value={value} aria-describedby={describedBy} aria-invalid={invalid} onChange={(e) => onChange(e.target.value)} />
          {suffix && <span className="shrink-0 font-bold text-ink-soft">{suffix}</span>}
        </div>
      )}
    </Field>
  );
}

export function GaugePanel({ state, result, errors, update }: { state: PlannerState; result: PlannerResult; errors: FieldErrors; update: Update }) {
  const t = (s: string) => inTerms(s, state.terms);
  const per = state.unit === 'cm' ? '10 cm' : '4 in';
  const u = state.unit;
  const { sizing, sizes, pattern } = result;
  const rowMultiple = pattern?.length ?? 1;
  const inUse = countsInUse(state, result);
  const planRows = result.rows === undefined ? '?' : rowCount(result.rows);
  return (
    <Card className="break-inside-avoid" data-testid="gauge-panel">
      <CardTitle>Size from your swatch</CardTitle>
      <p className="hidden print:block">
        Swatch {state.gaugeStitches} stitches and {state.gaugeRows} rows per {per}; target {state.targetWidth} × {state.targetLength} {u}; border {state.borderDepth} {u} deep.
        {result.across !== undefined && ` Counts in this plan: ${result.across} stitches × ${planRows} rows, ${inUse.matchesSwatch ? 'from the swatch and the target size' : 'the maker\'s own'}.`}
      </p>
      <div className="no-print space-y-5">
        <ChoiceGroup
          legend="Measure in"
          value={state.unit}
          onChange={(unit) => update({ unit })}
          columns={2}
          choices={[
            { value: 'cm', label: 'Centimetres', hint: 'Swatch counted over 10 cm' },
            { value: 'in', label: 'Inches', hint: 'Swatch counted over 4 in' },
          ]}
        />
        <div className="grid gap-4 sm:grid-cols-2">
          <NumberField label={`Swatch stitches per ${per}`} value={state.gaugeStitches} error={errors.gaugeStitches} onChange={(v) => update({ gaugeStitches: v })} />
          <NumberField label={`Swatch rows per ${per}`} value={state.gaugeRows} error={errors.gaugeRows} onChange={(v) => update({ gaugeRows: v })} />
        </div>
        <p className="text-sm text-ink-soft">Work the swatch in the body's own stitch and measure it after washing, the way the blanket will be used.</p>
        <div className="grid gap-4 sm:grid-cols-2">
          <NumberField label="Finished width" hint="Border included" value={state.targetWidth} error={errors.targetWidth} onChange={(v) => update({ targetWidth: v })} suffix={u} />
          <NumberField label="Finished length" hint="Border included" value={state.targetLength} error={errors.targetLength} onChange={(v) => update({ targetLength: v })} suffix={u} />
        </div>
        <NumberField
          label="Border depth on one side"
          hint={state.depthTouched ? 'Your own figure' : 'Set from the border you chose, foundation round included; change it if yours differs'}
          value={state.borderDepth}
          error={errors.borderDepth}
          onChange={(v) => update({ borderDepth: v })}
          suffix={u}
        />
        <fieldset className="space-y-1">
          <legend className="font-bold">Body stitch pattern</legend>
          <p className="text-sm text-ink-soft">If the body's own pattern repeats, e.g. "a multiple of 2 plus 1". Leave 1 plus 0 for a plain stitch.</p>
          <div className="flex flex-wrap items-start gap-2">
            <div className="w-28">
              <NumberField label="Multiple of" value={state.stitchMultiple} error={errors.stitchMultiple} onChange={(v) => update({ stitchMultiple: v })} />
            </div>
            <div className="w-28">
              <NumberField label="plus" value={state.stitchOffset} error={errors.stitchOffset} onChange={(v) => update({ stitchOffset: v })} />
            </div>
          </div>
        </fieldset>
      </div>

      {sizing ? (
        <div className="mt-5 space-y-2 rounded-xl border-2 border-heather-300 bg-heather-50 p-4" data-testid="gauge-result">
          <p className="text-lg font-bold">
            Start with {sizing.stitches} stitches and {sizing.rows} rows
          </p>
          <p>{t(sizing.startingChain.note)}</p>
          <p>
            Body about {formatLength(sizing.body.width, u)} × {formatLength(sizing.body.length, u)}; finished about {formatLength(sizing.finished.width, u)} ×{' '}
            {formatLength(sizing.finished.length, u)} with the border.
          </p>
          <p className="text-sm text-ink-soft">
            The swatch gives {sizing.exact.stitches.toFixed(1)} stitches and {sizing.exact.rows.toFixed(1)} rows, rounded to the nearest count that fits the body pattern
            {rowMultiple > 1 ? ` and a whole number of ${rowMultiple}-row repeats` : ''}.
          </p>
          {inUse.matchesSwatch ? (
            <p className="font-bold text-moss-700" data-testid="counts-in-use">
              The plan, the drawing and the yarn estimate use these counts.
            </p>
          ) : (
            <Button variant="secondary" className="no-print" onClick={() => update({ across: String(sizing.stitches), rows: String(sizing.rows), countsTouched: false })}>
              Use {sizing.stitches} stitches and {sizing.rows} rows in the plan
            </Button>
          )}
        </div>
      ) : (
        <p className="mt-5 text-ink-soft">Fill in the swatch and the size to see the counts to start with.</p>
      )}

      {sizes && !inUse.matchesSwatch && (
        <div className="mt-4" data-testid="finished-size">
        <Alert kind="warning" title="Your plan uses your own counts">
          The plan, the drawing and the yarn estimate use your {result.across} stitches × {planRows} rows. At this swatch that makes a body of{' '}
          {formatLength(sizes.body.width, u)} × {formatLength(sizes.body.length, u)}, finished about {formatLength(sizes.finished.width, u)} ×{' '}
          {formatLength(sizes.finished.length, u)}
          {sizing ? `, not the ${state.targetWidth} × ${state.targetLength} ${u} above` : ''}.
        </Alert>
        </div>
      )}
    </Card>
  );
}
