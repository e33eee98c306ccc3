import { Card, CardTitle } from '@/components/ui/card';
import { Field, Input } from '@/components/ui/field';
import { ROW_END_ALLOWANCES } from '@shared/border/row-ends';
import { ROW_PRESETS, type FieldErrors, type PlannerState, type RowPresetId } from '../hooks/use-planner';
import { ChoiceGroup } from './choice-group';
import { inTerms } from './terms';

function presetHint(id: RowPresetId): string {
  const preset = ROW_PRESETS.find((p) => p.id === id)!;
  if (id === 'plain') return '1 stitch per row end';
  if (id === 'custom') return 'Type the rows of one repeat';
  const per = [...new Set(preset.pattern!)].map((t) => {
    const n = ROW_END_ALLOWANCES[t].stitches;
    return preset.pattern!.length > 1 ? `${t} rows take ${n}` : `${n} stitch${n === 1 ? '' : 'es'} per row end`;
  });
  return per.join(', ');
}

export function BodyInputs({ state, errors, update }: { state: PlannerState; errors: FieldErrors; update: (p: Partial<PlannerState>) => void }) {
  const t = (s: string) => inTerms(s, state.terms);
  return (
    <Card>
      <CardTitle>Your blanket</CardTitle>
      <div className="space-y-5">
        <div className="grid gap-4 sm:grid-cols-2">
          <Field label="Stitches across" hint="In one row of the body" error={errors.across}>
            {({ id, describedBy, invalid }) => (
              <Input id={id} inputMode="numeric" autoComplete="off" value={state.across} aria-describedby={describedBy} aria-invalid={invalid} onChange={(e) => update({ across: e.target.value })} />
            )}
          </Field>
          <Field label="Rows" hint="In the body, before any border" error={errors.rows}>
            {({ id, describedBy, invalid }) => (
              <Input id={id} inputMode="numeric" autoComplete="off" value={state.rows} aria-describedby={describedBy} aria-invalid={invalid} onChange={(e) => update({ rows: e.target.value })} />
            )}
          </Field>
        </div>
        <ChoiceGroup
          legend="What the rows are"
          hint="Taller rows take more foundation stitches along the sides."
          value={state.rowPreset}
          onChange={(rowPreset) => update({ rowPreset })}
          columns={2}
          choices={ROW_PRESETS.map((p) => ({ value: p.id, label: t(p.label), hint: t(presetHint(p.id)) }))}
        />
        {state.rowPreset === 'custom' && (
          <Field
            label="Rows of one repeat"
            hint={state.terms === 'uk' ? 'In UK terms, e.g. "dc, dc, tr" (dc, htr, tr, dtr, trtr)' : 'In US terms, e.g. "sc, sc, dc" (sc, hdc, dc, tr, dtr)'}
            error={errors.customPattern}
          >
            {({ id, describedBy, invalid }) => (
              <Input id={id} autoComplete="off" value={state.customPattern} aria-describedby={describedBy} aria-invalid={invalid} onChange={(e) => update({ customPattern: e.target.value })} />
            )}
          </Field>
        )}
        {state.rowPreset !== 'custom' && errors.customPattern && <p className="font-bold text-brick-700">{errors.customPattern}</p>}
      </div>
    </Card>
  );
}
