import { useState } from 'react';
import { Clock, MapPin, Pencil, Plus } from 'lucide-react';
import { PageHeader } from '@/components/ui/page-header';
import { Card, CardTitle } from '@/components/ui/card';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { Loading } from '@/components/ui/spinner';
import { QueryError } from '@/components/ui/query-error';
import { EmptyState } from '@/components/ui/empty-state';
import { DEMO_TOWN_CENTRE, PinMap } from '@/components/ui/pin-map';
import { useSites } from '@/features/sites/api/get-sites';
import { useSaveSite } from '@/features/sites/api/save-site';
import { SiteForm } from '@/features/sites/components/site-form';
import { ScheduleForm, hoursSummary } from '@/features/sites/components/schedule-form';
import { DriveZoneForm } from '@/features/sites/components/drive-zone-form';

export default function SitesPage() {
  const { data, isPending, error } = useSites('all');
  const save = useSaveSite();
  const [editing, setEditing] = useState<number | 'new' | null>(null);
  const [hoursOf, setHoursOf] = useState<number | null>(null);
  const done = () => {
    setEditing(null);
    save.reset();
  };
  return (
    <div>
      <PageHeader
        title="Drop-off sites"
        lead="Where makers bring finished blankets and organisers check them in."
        actions={
          editing === null && (
            <Button onClick={() => setEditing('new')}>
              <Plus className="size-5" aria-hidden /> Add a site
            </Button>
          )
        }
      />
      {isPending ? (
        <Loading />
      ) : error ? (
        <QueryError error={error} />
      ) : (
        <div className="space-y-6">
          <DriveZoneForm />
          {editing === 'new' && (
            <Card>
              <CardTitle>New drop-off site</CardTitle>
              <SiteForm others={data} busy={save.isPending} error={save.error} onCancel={done} onSubmit={(input) => save.mutate(input, { onSuccess: done })} />
            </Card>
          )}
          {data.length === 0 && editing !== 'new' ? (
            <EmptyState icon={MapPin} title="No drop-off sites yet" action={<Button onClick={() => setEditing('new')}>Add a site</Button>}>
              A library desk, a community hall or a yarn shop counter: somewhere makers can hand blankets in.
            </EmptyState>
          ) : (
            <>
              <PinMap label="Map of the drop-off sites" fallbackCentre={DEMO_TOWN_CENTRE} pins={data.filter((s) => s.lat !== null && s.lng !== null).map((s) => ({ id: s.id, lat: s.lat!, lng: s.lng!, label: s.name, kind: 'site' as const }))} />
              <ul className="grid gap-4 md:grid-cols-2">
                {data.map((s) => (
                  <li key={s.id}>
                    <Card className="h-full">
                      {hoursOf === s.id ? (
                        <ScheduleForm site={s} onDone={() => setHoursOf(null)} />
                      ) : editing === s.id ? (
                        <SiteForm site={s} others={data} busy={save.isPending} error={save.error} onCancel={done} onSubmit={(input) => save.mutate({ id: s.id, ...input }, { onSuccess: done })} />
                      ) : (
                        <>
                          <div className="flex items-start justify-between gap-2">
                            <h2 className="text-xl font-bold">{s.name}</h2>
                            {s.active ? <Badge tone="moss">Open</Badge> : <Badge tone="brick">Closed</Badge>}
                          </div>
                          <p className="text-ink-soft">{s.address}</p>
                          {s.notes && <p className="mt-2">{s.notes}</p>}
                          <p className="mt-2 text-sm" data-testid="site-hours">
                            <Clock className="mr-1 inline size-4" aria-hidden />
                            {hoursSummary(s.openingHours)} · {s.slotMinutes}-minute slots, {s.slotCapacity} {s.slotCapacity === 1 ? 'visit' : 'visits'} each
                            {s.closures.length > 0 && ` · ${s.closures.length} ${s.closures.length === 1 ? 'closure' : 'closures'}`}
                          </p>
                          <div className="mt-3 flex flex-wrap gap-2">
                            <Button size="sm" variant="quiet" onClick={() => setEditing(s.id)} aria-label={`Change ${s.name}`}>
                              <Pencil className="size-4" aria-hidden /> Change
                            </Button>
                            <Button size="sm" variant="secondary" onClick={() => setHoursOf(s.id)} aria-label={`Opening hours of ${s.name}`}>
                              <Clock className="size-4" aria-hidden /> Opening hours
                            </Button>
                          </div>
                        </>
                      )}
                    </Card>
                  </li>
                ))}
              </ul>
            </>
          )}
        </div>
      )}
    </div>
  );
}
