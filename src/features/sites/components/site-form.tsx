import { useState, type FormEvent } from 'react';
import { Button } from '@/components/ui/button';
import { Checkbox, Field, Input, Textarea } from '@/components/ui/field';
import { Alert } from '@/components/ui/alert';
import { DEMO_TOWN_CENTRE, PinMap } from '@/components/ui/pin-map';
import { ApiError } from '@/lib/api-client';
import type { SiteView } from '@shared/schemas/site';
import { preload } from '@/lib/lazy-zod-resolver';
import type { SiteInput } from '../api/save-site';

const siteSchema = preload(() => import('@shared/schemas/site').then((m) => m.SiteCreateSchema));

function errorsOf(err: unknown, issues: ReadonlyArray<{ path: PropertyKey[]; message: string }>): Record<string, string> {
  const out: Record<string, string> = {};
  for (const i of issues) out[i.path.map(String).join('.')] ??= i.message;
  if (err instanceof ApiError) for (const i of err.issues) out[i.path] ??= i.message;
  return out;
}

interface Props {
  site?: SiteView;
  others: SiteView[];
  busy: boolean;
  error: unknown;
  onSubmit: (input: SiteInput) => void;
  onCancel?: () => void;
}

/** Name, address, map pin, notes, open or closed. Opening hours and slots come with drop-off booking. */
export function SiteForm({ site, others, busy, error, onSubmit, onCancel }: Props) {
  const [d, setD] = useState<SiteInput>({
    name: site?.name ?? '',
    address: site?.address ?? '',
    lat: site?.lat ?? null,
    lng: site?.lng ?? null,
    notes: site?.notes ?? '',
    active: site?.active ?? true,
  });
  const [issues, setIssues] = useState<ReadonlyArray<{ path: PropertyKey[]; message: string }>>([]);
  const errors = errorsOf(error, issues);
  const num = (s: string) => (s.trim() === '' ? null : Number(s));
  const submit = async (e: FormEvent) => {
    e.preventDefault();
    const parsed = (await siteSchema()).safeParse(d);
    if (!parsed.success) return setIssues(parsed.error.issues);
    setIssues([]);
    onSubmit(d);
  };
  const pins = [
    ...others.filter((o) => o.id !== site?.id && o.lat !== null && o.lng !== null).map((o) => ({ id: o.id, lat: o.lat!, lng: o.lng!, label: o.name, kind: 'site' as const })),
    ...(d.lat !== null && d.lng !== null ? [{ id: 'this', lat: d.lat, lng: d.lng, label: d.name || 'This site', selected: true }] : []),
  ];
  return (
    <form onSubmit={submit} noValidate className="space-y-4">
      {error instanceof Error && <Alert kind="error">{error.message}</Alert>}
      <div className="grid gap-4 sm:grid-cols-2">
        <Field label="Name" error={errors.name}>
          {(a) => <Input id={a.id} aria-invalid={a.invalid} aria-describedby={a.describedBy} value={d.name} onChange={(e) => setD({ ...d, name: e.target.value })} />}
        </Field>
        <Field label="Address" error={errors.address}>
          {(a) => <Input id={a.id} aria-invalid={a.invalid} aria-describedby={a.describedBy} value={d.address} onChange={(e) => setD({ ...d, address: e.target.value })} />}
        </Field>
      </div>
      <PinMap label="Map: click to place the site's pin" pins={pins} fallbackCentre={DEMO_TOWN_CENTRE} onPick={(lat, lng) => setD((x) => ({ ...x, lat, lng }))} />
      <div className="grid gap-4 sm:grid-cols-2">
        <Field label="Latitude" error={errors.lat}>
          {(a) => <Input id={a.id} inputMode="decimal" aria-invalid={a.invalid} aria-describedby={a.describedBy} value={d.lat ?? ''} onChange={(e) => setD({ ...d, lat: num(e.target.value) })} />}
        </Field>
        <Field label="Longitude" error={errors.lng}>
          {(a) => <Input id={a.id} inputMode="decimal" aria-invalid={a.invalid} aria-describedby={a.describedBy} value={d.lng ?? ''} onChange={(e) => setD({ ...d, lng: num(e.target.value) })} />}
        </Field>
      </div>
      <Field label="Notes for makers" hint="Where to hand blankets in, and who to ask." error={errors.notes}>
        {(a) => <Textarea id={a.id} aria-invalid={a.invalid} aria-describedby={a.describedBy} value={d.notes ?? ''} onChange={(e) => setD({ ...d, notes: e.target.value })} />}
      </Field>
      <Checkbox label="Taking blankets now" checked={d.active} onChange={(e) => setD({ ...d, active: e.target.checked })} />
      <div className="flex gap-2">
        <Button type="submit" busy={busy}>
          {site ? 'Save the site' : 'Add the site'}
        </Button>
        {onCancel && (
          <Button variant="quiet" onClick={onCancel}>
            Cancel
          </Button>
        )}
      </div>
    </form>
  );
}
