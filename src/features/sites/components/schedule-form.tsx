import { useState } from 'react';
import { Plus, Trash2 } from 'lucide-react';
import { Button } from '@/components/ui/button';
import { Field, Input, Select } from '@/components/ui/field';
import { Alert } from '@/components/ui/alert';
import type { SiteView } from '@shared/schemas/site';
import { EMPTY_HOURS, WEEKDAYS, WEEKDAY_LABELS, type Weekday } from '@shared/schemas/schedule-values';
import type { Closure, OpeningHours } from '@shared/schemas/schedule';
import { useSaveSiteSchedule } from '../api/save-site-schedule';

const SLOT_LENGTHS = [15, 20, 30, 45, 60];

/** One line for the site card: "Tue–Fri 10:00–12:30, 14:00–17:00 · Sat 10:00–13:00". */
export function hoursSummary(hours: OpeningHours | null): string {
  if (!hours || WEEKDAYS.every((d) => hours[d].length === 0)) return 'No opening hours yet: makers cannot book here';
  return WEEKDAYS.filter((d) => hours[d].length > 0)
    .map((d) => `${WEEKDAY_LABELS[d].slice(0, 3)} ${hours[d].map((s) => `${s.from}–${s.to}`).join(', ')}`)
    .join(' · ');
}

/** The coordinator's editor for a site's opening hours, slot length, visits per slot and closures. */
export function ScheduleForm({ site, onDone }: { site: SiteView; onDone: () => void }) {
  const save = useSaveSiteSchedule();
  const [hours, setHours] = useState<OpeningHours>(site.openingHours ?? EMPTY_HOURS);
  const [slotMinutes, setSlotMinutes] = useState(site.slotMinutes);
  const [slotCapacity, setSlotCapacity] = useState(String(site.slotCapacity));
  const [closures, setClosures] = useState<Closure[]>(site.closures);
  const setDay = (d: Weekday, spans: OpeningHours[Weekday]) => setHours({ ...hours, [d]: spans });
  return (
    <form
      className="space-y-5"
      aria-label={`Opening hours of ${site.name}`}
      onSubmit={(e) => {
        e.preventDefault();
        save.mutate({ id: site.id, openingHours: hours, slotMinutes, slotCapacity: Number(slotCapacity), closures }, { onSuccess: onDone });
      }}
    >
      <fieldset className="space-y-3">
        <legend className="mb-2 text-lg font-bold">Opening hours for drop-offs</legend>
        {WEEKDAYS.map((d) => (
          <div key={d} className="grid gap-2 sm:grid-cols-[7rem_1fr]" role="group" aria-label={WEEKDAY_LABELS[d]}>
            <p className="pt-2 font-bold">{WEEKDAY_LABELS[d]}</p>
            <div className="space-y-2">
              {hours[d].length === 0 && <p className="pt-2 text-ink-soft">Closed</p>}
              {hours[d].map((span, i) => (
                <div key={i} className="flex flex-wrap items-center gap-2">
                  <Input type="time" className="w-32" aria-label={`${WEEKDAY_LABELS[d]} span ${i + 1} opens`} value={span.from} onChange={(e) => setDay(d, hours[d].map((s, j) => (j === i ? { ...s, from: e.target.value } : s)))} required />
                  <span aria-hidden>to</span>
                  <Input type="time" className="w-32" aria-label={`${WEEKDAY_LABELS[d]} span ${i + 1} closes`} value={span.to} onChange={(e) => setDay(d, hours[d].map((s, j) => (j === i ? { ...s, to: e.target.value } : s)))} required />
                  <Button size="sm" variant="quiet" aria-label={`Remove ${WEEKDAY_LABELS[d]} span ${i + 1}`} onClick={() => setDay(d, hours[d].filter((_, j) => j !== i))}>
                    <Trash2 className="size-4" aria-hidden />
                  </Button>
                </div>
              ))}
              <Button size="sm" variant="secondary" onClick={() => setDay(d, [...hours[d], { from: '10:00', to: '12:00' }])}>
                <Plus className="size-4" aria-hidden /> Add hours on {WEEKDAY_LABELS[d]}
              </Button>
            </div>
          </div>
        ))}
      </fieldset>
      <div className="grid gap-4 sm:grid-cols-2">
        <Field label="Length of a visit slot">
          {({ id }) => (
            <Select id={id} value={slotMinutes} onChange={(e) => setSlotMinutes(Number(e.target.value))}>
              {SLOT_LENGTHS.map((m) => (
                <option key={m} value={m}>{m} minutes</option>
              ))}
            </Select>
          )}
        </Field>
        <Field label="Visits per slot" hint="How many makers the desk can welcome at once.">
          {({ id, describedBy }) => <Input id={id} type="number" min={1} max={50} value={slotCapacity} aria-describedby={describedBy} onChange={(e) => setSlotCapacity(e.target.value)} required />}
        </Field>
      </div>
      <fieldset className="space-y-3">
        <legend className="mb-2 text-lg font-bold">Closures and holidays</legend>
        {closures.length === 0 && <p className="text-ink-soft">No closures planned.</p>}
        {closures.map((c, i) => (
          <div key={i} className="grid gap-2 sm:grid-cols-[auto_auto_1fr_auto] sm:items-end" role="group" aria-label={`Closure ${i + 1}`}>
            <Field label="From">{({ id }) => <Input id={id} type="date" value={c.from} onChange={(e) => setClosures(closures.map((x, j) => (j === i ? { ...x, from: e.target.value } : x)))} required />}</Field>
            <Field label="To">{({ id }) => <Input id={id} type="date" value={c.to} onChange={(e) => setClosures(closures.map((x, j) => (j === i ? { ...x, to: e.target.value } : x)))} required />}</Field>
            <Field label="Note for makers">{({ id }) => <Input id={id} value={c.note} maxLength={200} onChange={(e) => setClosures(closures.map((x, j) => (j === i ? { ...x, note: e.target.value } : x)))} />}</Field>
            <Button size="sm" variant="quiet" aria-label={`Remove closure ${i + 1}`} onClick={() => setClosures(closures.filter((_, j) => j !== i))}>
              <Trash2 className="size-4" aria-hidden />
            </Button>
          </div>
        ))}
        <Button size="sm" variant="secondary" onClick={() => setClosures([...closures, { from: '', to: '', note: '' }])}>
          <Plus className="size-4" aria-hidden /> Add a closure
        </Button>
      </fieldset>
      <p className="text-sm text-ink-soft">Bookings already made keep their times when the hours change.</p>
      {save.error && <Alert kind="error" title="Not saved">{save.error.message}</Alert>}
      <div className="flex gap-2">
        <Button type="submit" busy={save.isPending}>Save the hours</Button>
        <Button variant="quiet" onClick={onDone}>Never mind</Button>
      </div>
    </form>
  );
}
