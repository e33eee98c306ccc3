import { useMemo, useState } from 'react';
import { Globe2 } from 'lucide-react';
import { Card, CardTitle } from '@/components/ui/card';
import { Button } from '@/components/ui/button';
import { Field, Select } from '@/components/ui/field';
import { Alert } from '@/components/ui/alert';
import { serverFieldErrors } from '@/components/ui/form-errors';
import { useDriveClock, useSetDriveZone } from '@/lib/drive-clock';
import { preload, usePreloaded } from '@/lib/lazy-zod-resolver';

const timeZoneSchema = preload(() => import('@shared/schemas/schedule').then((m) => m.TimeZoneSchema));
type TimeZoneCheck = Awaited<ReturnType<typeof timeZoneSchema>>;

/**
 * The IANA zones this browser knows that the server's date library accepts too, grouped by region.
 * Until the check has loaded (a moment after the page paints) the list holds the current zone only.
 */
function zoneGroups(current: string | undefined, zoneCheck: TimeZoneCheck | undefined): Array<[string, string[]]> {
  const known = zoneCheck ? Intl.supportedValuesOf('timeZone').filter((z) => zoneCheck.safeParse(z).success) : [];
  if (current && !known.includes(current)) known.push(current);
  const groups = new Map<string, string[]>();
  for (const z of known.sort()) {
    const region = z.split('/')[0];
    groups.set(region, [...(groups.get(region) ?? []), z]);
  }
  return [...groups.entries()];
}

/** The drive clock's moment (the server's answer) as the wall clock of a zone. */
const nowIn = (zone: string, at: string | undefined) =>
  new Intl.DateTimeFormat('en-GB', { timeZone: zone, weekday: 'short', day: 'numeric', month: 'short', hour: '2-digit', minute: '2-digit' }).format(at ? new Date(at) : new Date());

/**
 * The coordinator sets the drive's clock: opening hours, slots, reminders and every "today" in
 * Kindloop are read in this zone. Bookings keep their moment; only the wall clock shown changes.
 */
export function DriveZoneForm() {
  const clock = useDriveClock();
  const save = useSetDriveZone();
  const [chosen, setChosen] = useState<string | null>(null);
  const current = clock.data?.timeZone;
  const zoneCheck = usePreloaded(timeZoneSchema);
  const groups = useMemo(() => zoneGroups(current, zoneCheck), [current, zoneCheck]);
  const value = chosen ?? current ?? '';
  const fieldError = serverFieldErrors(save.error).timeZone;
  return (
    <Card className="space-y-4">
      <CardTitle>
        <Globe2 className="mr-2 inline size-6 text-heather-800" aria-hidden />
        The drive's time zone
      </CardTitle>
      <p className="text-ink-soft">
        Opening hours, drop-off times, reminders and every “today” in Kindloop follow this clock, wherever the server or a
        visitor's computer is.
      </p>
      <form
        aria-label="The drive's time zone"
        className="flex flex-wrap items-end gap-4"
        onSubmit={(e) => {
          e.preventDefault();
          if (value) save.mutate(value, { onSuccess: () => setChosen(null) });
        }}
      >
        <Field label="Time zone" className="min-w-64 flex-1" error={fieldError} hint={value ? `Now there: ${nowIn(value, clock.data?.now)}` : undefined}>
          {({ id, describedBy, invalid }) => (
            <Select id={id} value={value} aria-describedby={describedBy} aria-invalid={invalid} onChange={(e) => setChosen(e.target.value)}>
              {groups.map(([region, zones]) => (
                <optgroup key={region} label={region}>
                  {zones.map((z) => (
                    <option key={z} value={z}>
                      {z.replaceAll('_', ' ')}
                    </option>
                  ))}
                </optgroup>
              ))}
            </Select>
          )}
        </Field>
        <Button type="submit" busy={save.isPending} disabled={!chosen || chosen === current}>
          Save the time zone
        </Button>
      </form>
      {save.isSuccess && !chosen && <Alert kind="success">The drive now runs on {current} time.</Alert>}
      {save.error && !fieldError && <Alert kind="error">{save.error.message}</Alert>}
    </Card>
  );
}
