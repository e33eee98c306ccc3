import { useState, type FormEvent } from 'react';
import { MapPin as MapPinIcon } from 'lucide-react';
import { Button } from '@/components/ui/button';
import { Checkbox, Field, Input, Select, Textarea } from '@/components/ui/field';
import { Alert } from '@/components/ui/alert';
import { DEMO_TOWN_CENTRE, PinMap } from '@/components/ui/pin-map';
import { POPULATION_LABELS, POPULATIONS } from '@shared/schemas/blanket-values';
import type { Population } from '@shared/schemas/blanket';
import { RECIPIENT_KINDS, RECIPIENT_KIND_LABELS } from '@shared/schemas/recipient-values';
import type { RecipientKind } from '@shared/schemas/recipient';
import { preload } from '@/lib/lazy-zod-resolver';
import type { RecipientInput } from '../api/create-recipient';
import { fieldErrors, zodErrors } from './field-errors';

const recipientSchema = preload(() => import('@shared/schemas/recipient').then((m) => m.RecipientCreateSchema));

const blank: RecipientInput = {
  name: '',
  kind: 'neonatal-unit',
  population: 'preemie',
  address: '',
  lat: null,
  lng: null,
  contactName: '',
  contactEmail: '',
  contactPhone: '',
  deliveryNotes: '',
  active: true,
};

interface Props {
  initial?: Partial<RecipientInput>;
  submitLabel: string;
  busy: boolean;
  error: unknown;
  onSubmit: (input: RecipientInput) => void;
  /** Pins of the other places, so a new pin can be placed among them. */
  otherPins?: Array<{ id: number; lat: number; lng: number; label: string }>;
}

/** Name, kind, population, address with a map pin, the delivery contact and notes. */
export function RecipientForm({ initial, submitLabel, busy, error, onSubmit, otherPins = [] }: Props) {
  const [draft, setDraft] = useState<RecipientInput>(() => {
    const start = { ...blank };
    for (const key of Object.keys(blank) as Array<keyof RecipientInput>) {
      if (initial?.[key] !== undefined) (start as Record<string, unknown>)[key] = initial[key] ?? (typeof blank[key] === 'string' ? '' : null);
    }
    return start;
  });
  const [local, setLocal] = useState<Record<string, string>>({});
  const errors = { ...fieldErrors(error), ...local };
  const set = <K extends keyof RecipientInput>(key: K, value: RecipientInput[K]) => setDraft((d) => ({ ...d, [key]: value }));
  const num = (s: string) => (s.trim() === '' ? null : Number(s));

  const submit = async (e: FormEvent) => {
    e.preventDefault();
    const parsed = (await recipientSchema()).safeParse(draft);
    if (!parsed.success) {
      setLocal(zodErrors(parsed.error.issues));
      return;
    }
    setLocal({});
    onSubmit(draft);
  };

  const pins = [
    ...otherPins.map((p) => ({ ...p, kind: 'recipient' as const })),
    ...(draft.lat !== null && draft.lng !== null ? [{ id: 'this', lat: draft.lat, lng: draft.lng, label: draft.name || 'This recipient', selected: true }] : []),
  ];

  return (
    <form onSubmit={submit} className="space-y-5" noValidate>
      {error instanceof Error && <Alert kind="error">{error.message}</Alert>}
      <div className="grid gap-4 sm:grid-cols-2">
        <Field label="Name" error={errors.name} className="sm:col-span-2">
          {(a) => <Input id={a.id} aria-describedby={a.describedBy} aria-invalid={a.invalid} value={draft.name} onChange={(e) => set('name', e.target.value)} />}
        </Field>
        <Field label="Kind of place" error={errors.kind}>
          {(a) => (
            <Select id={a.id} aria-describedby={a.describedBy} aria-invalid={a.invalid} value={draft.kind} onChange={(e) => set('kind', e.target.value as RecipientKind)}>
              {RECIPIENT_KINDS.map((k) => (
                <option key={k} value={k}>
                  {RECIPIENT_KIND_LABELS[k]}
                </option>
              ))}
            </Select>
          )}
        </Field>
        <Field label="Who the blankets are for" hint="Sets the starting guidelines and the safety cautions." error={errors.population}>
          {(a) => (
            <Select id={a.id} aria-describedby={a.describedBy} aria-invalid={a.invalid} value={draft.population} onChange={(e) => set('population', e.target.value as Population)}>
              {POPULATIONS.map((p) => (
                <option key={p} value={p}>
                  {POPULATION_LABELS[p]}
                </option>
              ))}
            </Select>
          )}
        </Field>
        <Field label="Delivery address" error={errors.address} className="sm:col-span-2">
          {(a) => <Input id={a.id} aria-describedby={a.describedBy} aria-invalid={a.invalid} value={draft.address} onChange={(e) => set('address', e.target.value)} />}
        </Field>
      </div>

      <fieldset className="space-y-3">
        <legend className="flex items-center gap-2 font-bold">
          <MapPinIcon className="size-5" aria-hidden /> Map pin
        </legend>
        <p className="text-sm text-ink-soft">Click the map to place the pin, or type the coordinates.</p>
        <PinMap
          label="Map: click to place this recipient's pin"
          pins={pins}
          fallbackCentre={DEMO_TOWN_CENTRE}
          onPick={(lat, lng) => setDraft((d) => ({ ...d, lat, lng }))}
        />
        <div className="grid gap-4 sm:grid-cols-3">
          <Field label="Latitude" error={errors.lat}>
            {(a) => <Input id={a.id} inputMode="decimal" aria-describedby={a.describedBy} aria-invalid={a.invalid} value={draft.lat ?? ''} onChange={(e) => set('lat', num(e.target.value))} />}
          </Field>
          <Field label="Longitude" error={errors.lng}>
            {(a) => <Input id={a.id} inputMode="decimal" aria-describedby={a.describedBy} aria-invalid={a.invalid} value={draft.lng ?? ''} onChange={(e) => set('lng', num(e.target.value))} />}
          </Field>
          <div className="flex items-end">
            <Button variant="quiet" onClick={() => setDraft((d) => ({ ...d, lat: null, lng: null }))}>
              Clear the pin
            </Button>
          </div>
        </div>
      </fieldset>

      <fieldset className="grid gap-4 sm:grid-cols-3">
        <legend className="mb-2 font-bold">Delivery contact</legend>
        <Field label="Contact name" error={errors.contactName}>
          {(a) => <Input id={a.id} aria-describedby={a.describedBy} aria-invalid={a.invalid} value={draft.contactName ?? ''} onChange={(e) => set('contactName', e.target.value)} />}
        </Field>
        <Field label="Contact e-mail" error={errors.contactEmail}>
          {(a) => <Input id={a.id} type="email" aria-describedby={a.describedBy} aria-invalid={a.invalid} value={draft.contactEmail ?? ''} onChange={(e) => set('contactEmail', e.target.value)} />}
        </Field>
        <Field label="Contact phone" error={errors.contactPhone}>
          {(a) => <Input id={a.id} type="tel" aria-describedby={a.describedBy} aria-invalid={a.invalid} value={draft.contactPhone ?? ''} onChange={(e) => set('contactPhone', e.target.value)} />}
        </Field>
      </fieldset>
      <Field label="Delivery notes" hint="Where to go, when, and anything the driver should know." error={errors.deliveryNotes}>
        {(a) => <Textarea id={a.id} aria-describedby={a.describedBy} aria-invalid={a.invalid} value={draft.deliveryNotes ?? ''} onChange={(e) => set('deliveryNotes', e.target.value)} />}
      </Field>
      <Checkbox label="Collecting for this recipient now (untick to archive it)" checked={draft.active} onChange={(e) => set('active', e.target.checked)} />
      <Button type="submit" size="lg" busy={busy}>
        {submitLabel}
      </Button>
    </form>
  );
}
