import { useMemo, useState } from 'react';
import { RotateCcw } from 'lucide-react';
import { Button } from '@/components/ui/button';
import { Checkbox, Field, Input, Select } from '@/components/ui/field';
import { Alert } from '@/components/ui/alert';
import { defaultGuidelines } from '@shared/guidelines/defaults';
import { describeGuidelines } from '@shared/guidelines/describe';
import { featureLabel, fibreLabel, formatIn, yarnWeightName } from '@shared/guidelines/wording';
import { FEATURES, FIBRES, POPULATION_LABELS, YARN_WEIGHTS } from '@shared/schemas/blanket-values';
import type { Feature, Fibre } from '@shared/schemas/blanket';
import type { GuidelineSet } from '@shared/schemas/guidelines';
import { preload, usePreloaded } from '@/lib/lazy-zod-resolver';
import { fieldErrors, zodErrors } from './field-errors';

const guidelineSchema = preload(() => import('@shared/schemas/guidelines').then((m) => m.GuidelineSetSchema));

interface Props {
  guidelines: GuidelineSet;
  busy: boolean;
  error: unknown;
  onSave: (g: GuidelineSet) => void;
  saved?: boolean;
}

const toggle = <T,>(list: readonly T[], item: T, on: boolean): T[] => (on ? [...list.filter((x) => x !== item), item] : list.filter((x) => x !== item));

const SIZE_FIELDS = [
  ['minWidthCm', 'Smallest width'],
  ['maxWidthCm', 'Largest width'],
  ['minLengthCm', 'Smallest length'],
  ['maxLengthCm', 'Largest length'],
] as const;

const REQUIREMENTS = [
  ['requireMachineWashable', 'Must be machine washable'],
  ['requireDryerSafe', 'Must be safe in a tumble dryer'],
  ['requireSmokeFree', 'From a smoke-free home only'],
  ['requirePetFree', 'From a pet-free home only'],
  ['requireNewYarn', 'New yarn only'],
] as const;

/** Edits a recipient's guideline set, starting from the population's defaults, with a live plain-words summary. */
export function GuidelineEditor({ guidelines, busy, error, onSave, saved }: Props) {
  const [g, setG] = useState<GuidelineSet>(guidelines);
  const [sizeText, setSizeText] = useState<Record<string, string>>(() => Object.fromEntries(SIZE_FIELDS.map(([k]) => [k, String(guidelines[k])])));
  const [toleranceText, setToleranceText] = useState(String(guidelines.toleranceValue));
  // The check joins in once the schema has loaded, a moment after the page paints; a save waits for it.
  const schema = usePreloaded(guidelineSchema);
  const parsed = useMemo(() => schema?.safeParse(g), [schema, g]);
  const local = parsed && !parsed.success ? zodErrors(parsed.error.issues) : {};
  const summarised = parsed ? (parsed.success ? parsed.data : null) : g;
  const errors = { ...fieldErrors(error), ...local };
  const set = <K extends keyof GuidelineSet>(key: K, value: GuidelineSet[K]) => setG((d) => ({ ...d, [key]: value }));

  const reset = () => {
    const d = defaultGuidelines(g.population);
    setG(d);
    setSizeText(Object.fromEntries(SIZE_FIELDS.map(([k]) => [k, String(d[k])])));
    setToleranceText(String(d.toleranceValue));
  };

  return (
    <form
      className="space-y-6"
      noValidate
      onSubmit={async (e) => {
        e.preventDefault();
        const checked = parsed ?? (await guidelineSchema()).safeParse(g);
        if (checked.success) onSave(checked.data);
      }}
    >
      {error instanceof Error && <Alert kind="error">{error.message}</Alert>}
      {saved && <Alert kind="success">Guidelines saved.</Alert>}
      <div className="flex flex-wrap items-center justify-between gap-3">
        <p className="text-ink-soft">
          For <strong>{POPULATION_LABELS[g.population].toLowerCase()}</strong>. Start from our defaults and change what this recipient asked for.
        </p>
        <Button variant="secondary" onClick={reset}>
          <RotateCcw className="size-4" aria-hidden /> Start from the defaults
        </Button>
      </div>

      <fieldset>
        <legend className="mb-2 text-lg font-bold">Size, in centimetres</legend>
        <p className="mb-3 text-sm text-ink-soft">Either way round: a blanket that fits when turned passes.</p>
        <div className="grid gap-4 sm:grid-cols-4">
          {SIZE_FIELDS.map(([key, label]) => (
            <Field key={key} label={label} hint={`about ${formatIn(g[key])} in`} error={errors[key]}>
              {(a) => (
                <Input
                  id={a.id}
                  inputMode="decimal"
                  aria-describedby={a.describedBy}
                  aria-invalid={a.invalid}
                  value={sizeText[key]}
                  onChange={(e) => {
                    setSizeText((s) => ({ ...s, [key]: e.target.value }));
                    set(key, Number(e.target.value));
                  }}
                />
              )}
            </Field>
          ))}
        </div>
        <div className="mt-4 grid gap-4 sm:grid-cols-4">
          <Field label="Leeway" error={errors.toleranceValue}>
            {(a) => (
              <Input
                id={a.id}
                inputMode="decimal"
                aria-describedby={a.describedBy}
                aria-invalid={a.invalid}
                value={toleranceText}
                onChange={(e) => {
                  setToleranceText(e.target.value);
                  set('toleranceValue', Number(e.target.value));
                }}
              />
            )}
          </Field>
          <Field label="Leeway in" error={errors.toleranceUnit}>
            {(a) => (
              <Select id={a.id} value={g.toleranceUnit} onChange={(e) => set('toleranceUnit', e.target.value as GuidelineSet['toleranceUnit'])}>
                <option value="cm">centimetres</option>
                <option value="percent">per cent</option>
              </Select>
            )}
          </Field>
        </div>
      </fieldset>

      <fieldset>
        <legend className="mb-2 text-lg font-bold">Yarn weights taken</legend>
        {errors.yarnWeights && <p className="mb-2 text-sm font-bold text-brick-700" role="alert">{errors.yarnWeights}</p>}
        <div className="grid gap-x-4 sm:grid-cols-4">
          {YARN_WEIGHTS.map((w) => (
            <Checkbox key={w} label={`${w} · ${yarnWeightName(w)}`} checked={g.yarnWeights.includes(w)} onChange={(e) => set('yarnWeights', toggle(g.yarnWeights, w, e.target.checked).sort((a, b) => a - b))} />
          ))}
        </div>
      </fieldset>

      <div className="grid gap-6 md:grid-cols-2">
        <fieldset>
          <legend className="mb-1 text-lg font-bold">Only these fibres</legend>
          <p className="mb-2 text-sm text-ink-soft">Tick none to take any fibre that is not refused.</p>
          <div className="grid grid-cols-2 gap-x-4">
            {FIBRES.map((f: Fibre) => (
              <Checkbox key={f} label={fibreLabel(f)} checked={g.acceptedFibres.includes(f)} onChange={(e) => set('acceptedFibres', toggle(g.acceptedFibres, f, e.target.checked))} />
            ))}
          </div>
        </fieldset>
        <fieldset>
          <legend className="mb-1 text-lg font-bold">Refused fibres</legend>
          {errors.refusedFibres && <p className="mb-2 text-sm font-bold text-brick-700" role="alert">{errors.refusedFibres}</p>}
          <div className="grid grid-cols-2 gap-x-4">
            {FIBRES.map((f: Fibre) => (
              <Checkbox key={f} label={fibreLabel(f)} checked={g.refusedFibres.includes(f)} onChange={(e) => set('refusedFibres', toggle(g.refusedFibres, f, e.target.checked))} />
            ))}
          </div>
        </fieldset>
      </div>

      <fieldset>
        <legend className="mb-2 text-lg font-bold">Refused features</legend>
        <div className="grid gap-x-4 sm:grid-cols-2">
          {FEATURES.map((f: Feature) => (
            <Checkbox key={f} label={featureLabel(f)} checked={g.refusedFeatures.includes(f)} onChange={(e) => set('refusedFeatures', toggle(g.refusedFeatures, f, e.target.checked))} />
          ))}
        </div>
      </fieldset>

      <fieldset>
        <legend className="mb-2 text-lg font-bold">Care and home</legend>
        <div className="grid gap-x-4 sm:grid-cols-2">
          {REQUIREMENTS.map(([key, label]) => (
            <Checkbox key={key} label={label} checked={g[key]} onChange={(e) => set(key, e.target.checked)} />
          ))}
        </div>
      </fieldset>

      <section aria-label="Summary for makers" className="rounded-xl bg-oat-100 p-4">
        <p className="mb-2 font-bold">What makers will read</p>
        {summarised ? (
          <ul className="list-disc space-y-1 pl-5">
            {describeGuidelines(summarised).map((line) => (
              <li key={line}>{line}</li>
            ))}
          </ul>
        ) : (
          <p className="text-brick-700">Put the marked fields right to see the summary.</p>
        )}
      </section>

      <Button type="submit" size="lg" busy={busy} disabled={parsed ? !parsed.success : false}>
        Save the guidelines
      </Button>
    </form>
  );
}
