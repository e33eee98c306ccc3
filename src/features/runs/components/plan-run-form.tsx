import { useState, type FormEvent } from 'react';
import { Truck } from 'lucide-react';
import { Button } from '@/components/ui/button';
import { Checkbox, Field, Input, Select, Textarea } from '@/components/ui/field';
import { Alert } from '@/components/ui/alert';
import { EmptyState } from '@/components/ui/empty-state';
import { isoDayFrom } from '@/components/ui/format-day';
import { useDriveToday } from '@/lib/drive-clock';
import { ApiError } from '@/lib/api-client';
import { POPULATION_LABELS } from '@shared/schemas/blanket-values';
import type { RunCreate, WaitingRecipient } from '@shared/schemas/run';

interface Option {
  id: number;
  name: string;
}

/** Date, driver, start site and which recipients to visit; each stop brings its waiting blankets. */
export function PlanRunForm({
  drivers,
  sites,
  waiting,
  busy,
  error,
  onSubmit,
}: {
  drivers: Option[];
  sites: Option[];
  waiting: WaitingRecipient[];
  busy: boolean;
  error: unknown;
  onSubmit: (input: RunCreate) => void;
}) {
  const today = useDriveToday();
  const [runDate, setRunDate] = useState(isoDayFrom(today, 2));
  const [driverId, setDriverId] = useState<number | ''>('');
  const [startSiteId, setStartSiteId] = useState<number | ''>(sites[0]?.id ?? '');
  const [chosen, setChosen] = useState<number[]>([]);
  const [notes, setNotes] = useState('');
  const issues = error instanceof ApiError ? error.issues : [];
  const issue = (path: string) => issues.find((i) => i.path === path || i.path.startsWith(`${path}.`))?.message;
  const submit = (e: FormEvent) => {
    e.preventDefault();
    onSubmit({ runDate, driverId: Number(driverId), startSiteId: Number(startSiteId), recipientIds: chosen, notes });
  };
  return (
    <form onSubmit={submit} className="space-y-5" aria-label="Plan a delivery run">
      {error instanceof Error && <Alert kind="error" title="The run was not saved">{error.message}</Alert>}
      <div className="grid gap-4 sm:grid-cols-3">
        <Field label="Day of the run" hint="When the boxes go out" error={issue('runDate')}>
          {(f) => <Input type="date" id={f.id} aria-describedby={f.describedBy} aria-invalid={f.invalid} value={runDate} onChange={(e) => setRunDate(e.target.value)} required />}
        </Field>
        <Field label="Driver" hint="Someone who agreed to drive" error={issue('driverId')}>
          {(f) => (
            <Select id={f.id} aria-describedby={f.describedBy} aria-invalid={f.invalid} value={driverId} onChange={(e) => setDriverId(e.target.value === '' ? '' : Number(e.target.value))} required>
              <option value="">Choose a driver</option>
              {drivers.map((d) => (
                <option key={d.id} value={d.id}>
                  {d.name}
                </option>
              ))}
            </Select>
          )}
        </Field>
        <Field label="Starts from" hint="Where the boxes are loaded" error={issue('startSiteId')}>
          {(f) => (
            <Select id={f.id} aria-describedby={f.describedBy} aria-invalid={f.invalid} value={startSiteId} onChange={(e) => setStartSiteId(Number(e.target.value))} required>
              {sites.map((s) => (
                <option key={s.id} value={s.id}>
                  {s.name}
                </option>
              ))}
            </Select>
          )}
        </Field>
      </div>
      <fieldset className="space-y-2">
        <legend className="font-bold">Stops</legend>
        <p className="text-sm text-ink-soft">Recipients with assigned blankets that no run carries yet. Each stop takes all of its waiting blankets.</p>
        {waiting.length === 0 ? (
          <EmptyState icon={Truck} title="Nothing is waiting for a run">
            When organisers assign checked blankets to a recipient, the recipient shows up here.
          </EmptyState>
        ) : (
          <ul className="grid gap-2 sm:grid-cols-2">
            {waiting.map((r) => (
              <li key={r.id} className="rounded-xl border-2 border-oat-200 bg-oat-50 px-3 py-2">
                <Checkbox
                  checked={chosen.includes(r.id)}
                  onChange={(e) => setChosen((c) => (e.target.checked ? [...c, r.id] : c.filter((x) => x !== r.id)))}
                  label={
                    <span>
                      <span className="font-bold">{r.name}</span>
                      <span className="block text-sm text-ink-soft">
                        {r.waiting} blanket{r.waiting === 1 ? '' : 's'} · {POPULATION_LABELS[r.population]}
                      </span>
                    </span>
                  }
                />
              </li>
            ))}
          </ul>
        )}
        {issue('recipientIds') && <p className="text-sm font-bold text-brick-700">{issue('recipientIds')}</p>}
      </fieldset>
      <Field label="Notes for the driver" error={issue('notes')}>
        {(f) => <Textarea id={f.id} aria-describedby={f.describedBy} value={notes} onChange={(e) => setNotes(e.target.value)} maxLength={2000} />}
      </Field>
      <Button type="submit" size="lg" busy={busy}>
        <Truck className="size-5" aria-hidden /> Plan this run
      </Button>
    </form>
  );
}
