import { useState } from 'react';
import { PackageCheck } from 'lucide-react';
import { Button } from '@/components/ui/button';
import { Field, Input, Select } from '@/components/ui/field';
import { Alert } from '@/components/ui/alert';
import { ApiError } from '@/lib/api-client';
import { preload } from '@/lib/lazy-zod-resolver';
import type { IntakeBlanketView } from '@shared/schemas/intake-views';
import { useIntakeSites } from '../api/get-intake-sites';
import { useReceiveBlanket } from '../api/receive-blanket';

const SITE_KEY = 'kindloop.intake.siteId';

const intakeBodySchema = preload(() => import('@shared/schemas/intake').then((m) => m.IntakeBodySchema));

export function rememberedSiteId(): number | null {
  const v = Number(localStorage.getItem(SITE_KEY));
  return Number.isInteger(v) && v > 0 ? v : null;
}

/** Receive at a drop-off site and measure it again on the table. */
export function ReceivePanel({ blanket }: { blanket: IntakeBlanketView }) {
  const sites = useIntakeSites();
  const receive = useReceiveBlanket();
  const [siteId, setSiteId] = useState<number | null>(rememberedSiteId);
  const [width, setWidth] = useState(String(blanket.widthCm));
  const [length, setLength] = useState(String(blanket.lengthCm));
  const [note, setNote] = useState('');
  const [local, setLocal] = useState<Record<string, string>>({});
  const server: Record<string, string> = {};
  if (receive.error instanceof ApiError) for (const i of receive.error.issues) server[i.path] ??= i.message;
  const errors = { ...server, ...local };
  const chosen = siteId ?? sites.data?.[0]?.id ?? null;

  return (
    <form
      noValidate
      className="space-y-4"
      onSubmit={async (e) => {
        e.preventDefault();
        const body = { siteId: chosen ?? 0, widthCm: Number(width), lengthCm: Number(length), note: note || undefined, version: blanket.version };
        const parsed = (await intakeBodySchema()).safeParse(body);
        if (!parsed.success) {
          const out: Record<string, string> = {};
          for (const i of parsed.error.issues) out[i.path.join('.')] ??= i.message;
          return setLocal(out);
        }
        setLocal({});
        localStorage.setItem(SITE_KEY, String(parsed.data.siteId));
        receive.mutate({ id: blanket.id, ...parsed.data });
      }}
    >
      {receive.error && <Alert kind="error">{receive.error.message}</Alert>}
      {blanket.status === 'finished' && <p className="text-ink-soft">No drop-off was booked for this one; that's fine, receive it as it comes.</p>}
      <div className="grid gap-4 sm:grid-cols-3">
        <Field label="Drop-off site" error={errors.siteId}>
          {(a) => (
            <Select id={a.id} aria-invalid={a.invalid} aria-describedby={a.describedBy} value={chosen ?? ''} onChange={(e) => setSiteId(Number(e.target.value))}>
              {(sites.data ?? []).map((s) => (
                <option key={s.id} value={s.id}>
                  {s.name}
                </option>
              ))}
            </Select>
          )}
        </Field>
        <Field label="Measured width (cm)" hint={`Logged: ${blanket.widthCm} cm`} error={errors.widthCm}>
          {(a) => <Input id={a.id} inputMode="decimal" aria-invalid={a.invalid} aria-describedby={a.describedBy} value={width} onChange={(e) => setWidth(e.target.value)} />}
        </Field>
        <Field label="Measured length (cm)" hint={`Logged: ${blanket.lengthCm} cm`} error={errors.lengthCm}>
          {(a) => <Input id={a.id} inputMode="decimal" aria-invalid={a.invalid} aria-describedby={a.describedBy} value={length} onChange={(e) => setLength(e.target.value)} />}
        </Field>
      </div>
      <Field label="Note (optional)" error={errors.note}>
        {(a) => <Input id={a.id} aria-invalid={a.invalid} aria-describedby={a.describedBy} value={note} onChange={(e) => setNote(e.target.value)} />}
      </Field>
      <Button type="submit" size="lg" busy={receive.isPending}>
        <PackageCheck className="size-5" aria-hidden /> Receive it here
      </Button>
    </form>
  );
}
