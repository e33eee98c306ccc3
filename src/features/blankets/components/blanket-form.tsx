import { lazy, Suspense, useState, type ReactNode } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import { Card } from '@/components/ui/card';
import { Button } from '@/components/ui/button';
import { Alert } from '@/components/ui/alert';
import { Checkbox, Field, Input, Select, Textarea } from '@/components/ui/field';
import { ProgressBar } from '@/components/ui/progress-bar';
import { applyServerErrors } from '@/components/ui/form-errors';
import { ApiError } from '@/lib/api-client';
import { formatDay } from '@/components/ui/format-day';
import { cn } from '@/components/ui/cn';
import { BODY_STITCHES, FEATURES, FIBRES, YARN_WEIGHTS } from '@shared/schemas/blanket-values';
import type { PledgeView, RecipientBrief } from '@shared/schemas/pledge';
import { BORDER_CHOICES } from '@shared/border/library-names';
import { capitalise, featureLabel, fibreLabel } from '@shared/guidelines/wording';
import { sizeCategoryRow } from '@shared/guidelines/size-categories';
import type { PlanListItem } from '@shared/schemas/plan';
import { FORM_FIELDS, SERVER_FIELD_RENAMES, guidelineFields, inUnit, cmFrom, type BlanketFormValues } from './blanket-form-values';
import { lazyZodResolver } from '@/lib/lazy-zod-resolver';
import { BODY_STITCH_LABELS, yarnWeightLabel, NO_LIBRARY_BORDER } from './labels';
import { useSelfCheck } from '../hooks/use-self-check';
import { Cautions } from '@/components/ui/cautions';
import { CHECK_PENDING, SelfCheckFrame } from './self-check-frame';
import { PhotoPicker, photoProblems } from './photo-picker';

/** The panel comes with the check it shows, a moment after the form; the cautions are there from the start. */
const SelfCheckPanel = lazy(() => import('./self-check-panel').then((m) => ({ default: m.SelfCheckPanel })));

/** The form's schema (and zod with it) loads right after the form paints; a submit waits for it. */
const resolver = lazyZodResolver<BlanketFormValues>(() => import('./blanket-form-schema').then((m) => m.BlanketFormSchema));

function Section({ title, children, hint }: { title: string; children: ReactNode; hint?: string }) {
  return (
    <Card className="space-y-4">
      <div>
        <h2 className="text-xl font-bold">{title}</h2>
        {hint && <p className="text-ink-soft">{hint}</p>}
      </div>
      {children}
    </Card>
  );
}

const pledgeWords = (p: PledgeView) =>
  `${p.need?.recipient.name ?? 'Wherever it’s needed most'} · ${sizeCategoryRow(p.sizeCategory).label} · ${p.blanketsLogged} of ${p.quantity} logged · by ${formatDay(p.dueDate)}`;

interface Props {
  mode: 'create' | 'edit';
  /** The pledges a blanket can go under; in edit mode, just its own. */
  pledges: PledgeView[];
  defaultValues: BlanketFormValues;
  /** Every recipient collecting now, for the check of a blanket pledged "wherever it's needed most". */
  otherRecipients: RecipientBrief[];
  plans: PlanListItem[];
  firstName: string;
  /** Photos it may still take (create mode). */
  photoRoom?: number;
  /** Saves the blanket (and sends the photos); throws an ApiError on refusal. */
  onSubmit: (values: BlanketFormValues, photos: File[]) => Promise<void>;
  /** 0..1 while photos are on their way; null otherwise. */
  uploadProgress: number | null;
  submitLabel: string;
  /** A message the page wants above the submit button (e.g. the blanket saved but a photo did not). */
  notice?: ReactNode;
}

/** The blanket log: every field from the issue, with the self-check running as the maker types. */
export function BlanketForm({ mode, pledges, defaultValues, otherRecipients, plans, firstName, photoRoom = 0, onSubmit, uploadProgress, submitLabel, notice }: Props) {
  const { register, handleSubmit, formState, setError, control, getValues, setValue } = useForm<BlanketFormValues>({
    resolver,
    defaultValues,
  });
  const [photos, setPhotos] = useState<File[]>([]);
  const [unplaced, setUnplaced] = useState<string[]>([]);
  const [photoError, setPhotoError] = useState<string | undefined>();
  const values = useWatch({ control }) as Partial<BlanketFormValues>;
  const pledge = pledges.find((p) => p.id === Number(values.pledgeId)) ?? null;
  const recipient = pledge?.need?.recipient ?? null;
  const outcome = useSelfCheck(guidelineFields(values), recipient, otherRecipients);
  const e = formState.errors;

  const switchUnit = (unit: 'cm' | 'in') => {
    const from = getValues('unit');
    if (from === unit) return;
    for (const key of ['width', 'length'] as const) {
      const v = getValues(key);
      if (typeof v === 'number' && Number.isFinite(v)) setValue(key, inUnit(cmFrom(v, from), unit));
    }
    setValue('unit', unit);
  };

  const submit = handleSubmit(async (v) => {
    setUnplaced([]);
    setPhotoError(undefined);
    if (photoProblems(photos, photoRoom).length > 0) return;
    try {
      await onSubmit(v, photos);
    } catch (err) {
      const rest = applyServerErrors(err, setError, FORM_FIELDS, SERVER_FIELD_RENAMES);
      // A refusal without field issues (a lost connection, a conflict) still needs saying.
      if (!(err instanceof ApiError) || err.issues.length === 0) rest.push(err instanceof Error ? err.message : 'Saving did not work; please try again');
      const photoIssue = rest.find((m) => /photo/i.test(m));
      setPhotoError(photoIssue);
      setUnplaced(rest.filter((m) => m !== photoIssue));
    }
  });

  const unit = values.unit ?? 'cm';
  const busy = formState.isSubmitting;
  const cautions = recipient?.cautions ?? [];

  return (
    <form onSubmit={submit} noValidate className="grid gap-6 lg:grid-cols-3" aria-label="Blanket log">
      <div className="space-y-6 lg:col-span-2">
        <Section title="Which pledge is it for?">
          {mode === 'create' ? (
            <Field label="Pledge" error={e.pledgeId?.message}>
              {({ id, describedBy, invalid }) => (
                <Select id={id} aria-describedby={describedBy} aria-invalid={invalid} {...register('pledgeId', { valueAsNumber: true })}>
                  {pledges.map((p) => (
                    <option key={p.id} value={p.id}>
                      {pledgeWords(p)}
                    </option>
                  ))}
                </Select>
              )}
            </Field>
          ) : (
            <p>{pledge ? pledgeWords(pledge) : 'Its pledge'}</p>
          )}
        </Section>

        <Section title="Size" hint="Lay it flat without stretching and measure across the middle, border included.">
          <fieldset>
            <legend className="mb-2 font-bold">I measured in</legend>
            <div className="inline-flex rounded-xl border-2 border-oat-300 bg-white p-1" role="radiogroup" aria-label="Unit">
              {(['cm', 'in'] as const).map((u) => (
                <button
                  key={u}
                  type="button"
                  role="radio"
                  aria-checked={unit === u}
                  onClick={() => switchUnit(u)}
                  className={cn('min-h-9 rounded-lg px-4 font-bold', unit === u ? 'bg-heather-700 text-white' : 'text-ink hover:bg-oat-100')}
                >
                  {u === 'cm' ? 'Centimetres' : 'Inches'}
                </button>
              ))}
            </div>
          </fieldset>
          <div className="grid gap-4 sm:grid-cols-2">
            <Field label={`Width (${unit})`} error={e.width?.message}>
              {({ id, describedBy, invalid }) => (
                <Input id={id} type="number" inputMode="decimal" step="0.1" min={0} aria-describedby={describedBy} aria-invalid={invalid} {...register('width', { valueAsNumber: true })} />
              )}
            </Field>
            <Field label={`Length (${unit})`} error={e.length?.message}>
              {({ id, describedBy, invalid }) => (
                <Input id={id} type="number" inputMode="decimal" step="0.1" min={0} aria-describedby={describedBy} aria-invalid={invalid} {...register('length', { valueAsNumber: true })} />
              )}
            </Field>
          </div>
          {unit === 'in' && typeof values.width === 'number' && typeof values.length === 'number' && Number.isFinite(values.width) && Number.isFinite(values.length) && (
            <p className="text-ink-soft">
              Saved as {cmFrom(values.width, 'in')} × {cmFrom(values.length, 'in')} cm.
            </p>
          )}
        </Section>

        <Section title="Yarn">
          <div className="grid gap-4 sm:grid-cols-2">
            <Field label="Yarn weight" hint="The number in the yarn symbol on the ball band (Craft Yarn Council categories)" error={e.yarnWeight?.message}>
              {({ id, describedBy, invalid }) => (
                <Select id={id} aria-describedby={describedBy} aria-invalid={invalid} {...register('yarnWeight', { valueAsNumber: true })}>
                  {YARN_WEIGHTS.map((w) => (
                    <option key={w} value={w}>
                      {yarnWeightLabel(w)}
                    </option>
                  ))}
                </Select>
              )}
            </Field>
            <Field label="Colours" hint="In words, e.g. “sage and cream stripes”" error={e.colours?.message}>
              {({ id, describedBy, invalid }) => <Input id={id} maxLength={200} aria-describedby={describedBy} aria-invalid={invalid} {...register('colours')} />}
            </Field>
          </div>
          <fieldset aria-describedby={e.fibres ? 'fibres-error' : undefined}>
            <legend className="mb-1 font-bold">Fibres (as on the ball band)</legend>
            <div className="grid grid-cols-2 gap-x-4 sm:grid-cols-3">
              {FIBRES.map((f) => (
                <Checkbox key={f} label={capitalise(fibreLabel(f))} value={f} {...register('fibres')} />
              ))}
            </div>
            {e.fibres && (
              <p id="fibres-error" className="text-sm font-bold text-brick-700" role="alert">
                {e.fibres.message ?? 'Choose the fibres'}
              </p>
            )}
          </fieldset>
          <Checkbox label="All of it is new yarn (nothing reclaimed or unravelled)" {...register('newYarn')} />
        </Section>

        <Section title="Stitches and border" hint="Made from a plan in the planner? Choose it and its border comes with it.">
          <div className="grid gap-4 sm:grid-cols-2">
            <Field label="Body stitch" error={e.bodyStitch?.message}>
              {({ id, describedBy, invalid }) => (
                <Select id={id} aria-describedby={describedBy} aria-invalid={invalid} {...register('bodyStitch')}>
                  {BODY_STITCHES.map((s) => (
                    <option key={s} value={s}>
                      {BODY_STITCH_LABELS[s]}
                    </option>
                  ))}
                </Select>
              )}
            </Field>
            <Field label="Border" error={e.borderId?.message}>
              {({ id, describedBy, invalid }) => (
                <Select id={id} aria-describedby={describedBy} aria-invalid={invalid} {...register('borderId')}>
                  <option value="">{NO_LIBRARY_BORDER}</option>
                  {BORDER_CHOICES.map((b) => (
                    <option key={b.id} value={b.id}>
                      {b.name}
                    </option>
                  ))}
                </Select>
              )}
            </Field>
            <Field label="Saved plan" error={e.planId?.message}>
              {({ id, describedBy, invalid }) => (
                <Select
                  id={id}
                  aria-describedby={describedBy}
                  aria-invalid={invalid}
                  {...register('planId', {
                    onChange: (ev: { target: { value: string } }) => {
                      const plan = plans.find((p) => String(p.id) === ev.target.value);
                      if (plan) setValue('borderId', plan.borderId);
                    },
                  })}
                >
                  <option value="">None</option>
                  {plans.map((p) => (
                    <option key={p.id} value={String(p.id)}>
                      {p.name}
                    </option>
                  ))}
                </Select>
              )}
            </Field>
          </div>
        </Section>

        <Section title="Trims and extras" hint="Tick everything on the blanket, even small things.">
          <div className="grid gap-x-4 sm:grid-cols-2">
            {FEATURES.map((f) => (
              <Checkbox key={f} label={capitalise(featureLabel(f))} value={f} {...register('features')} />
            ))}
          </div>
        </Section>

        <Section title="Care and your home" hint="Units ask because their laundries are hot and some of the people they look after have allergies.">
          <div className="grid gap-x-4 sm:grid-cols-2">
            <Checkbox label="Machine washable" {...register('machineWashable')} />
            <Checkbox label="Safe in a tumble dryer" {...register('dryerSafe')} />
            <Checkbox label="Made in a smoke-free home" {...register('smokeFree')} />
            <Checkbox label="Made in a pet-free home" {...register('petFree')} />
          </div>
        </Section>

        <Section title="Tag and notes">
          <fieldset>
            <legend className="mb-1 font-bold">On its tag and delivery list, call the maker</legend>
            <Checkbox label={`${firstName} (my first name)`} type="radio" value="first-name" {...register('labelName')} />
            <Checkbox label="Anonymous" type="radio" value="anonymous" {...register('labelName')} />
          </fieldset>
          {mode === 'create' && (
            <fieldset>
              <legend className="mb-1 font-bold">Where is it up to?</legend>
              <Checkbox label="Finished and ready to hand in" type="radio" value="finished" {...register('status')} />
              <Checkbox label="Still on the hook" type="radio" value="in_progress" {...register('status')} />
            </fieldset>
          )}
          <Field label="Notes for the organisers" hint="Anything they should know: a yarn you're unsure of, a repair, a story." error={e.notes?.message}>
            {({ id, describedBy, invalid }) => <Textarea id={id} maxLength={2000} aria-describedby={describedBy} aria-invalid={invalid} {...register('notes')} />}
          </Field>
        </Section>

        {mode === 'create' && photoRoom > 0 && (
          <Section title="Photos">
            <PhotoPicker files={photos} onChange={setPhotos} room={photoRoom} error={photoError} />
          </Section>
        )}
      </div>

      <aside className="lg:col-start-3 lg:row-span-2 lg:row-start-1">
        <div className="space-y-4 lg:sticky lg:top-4">
          <Suspense
            fallback={
              <SelfCheckFrame>
                <p className="text-ink-soft">{CHECK_PENDING}</p>
                {cautions.length > 0 && <Cautions cautions={cautions} compact />}
              </SelfCheckFrame>
            }
          >
            <SelfCheckPanel outcome={outcome} cautions={cautions} />
          </Suspense>
        </div>
      </aside>

      <div className="space-y-4 lg:col-span-2">
        {unplaced.map((m) => (
          <Alert key={m} kind="error">
            {m}
          </Alert>
        ))}
        {Object.keys(e).length > 0 && <Alert kind="error">Some answers need another look: see the fields marked above.</Alert>}
        {notice}
        {uploadProgress !== null && <ProgressBar value={uploadProgress} label="Sending photos" />}
        <Button type="submit" size="lg" busy={busy}>
          {submitLabel}
        </Button>
      </div>
    </form>
  );
}
