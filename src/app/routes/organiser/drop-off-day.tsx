import { useSearchParams } from 'react-router-dom';
import { useState } from 'react';
import { CalendarClock, ChevronLeft, ChevronRight, UserX } from 'lucide-react';
import type { BookingView } from '@shared/schemas/booking';
import { PageHeader } from '@/components/ui/page-header';
import { Card } from '@/components/ui/card';
import { Alert } from '@/components/ui/alert';
import { Badge, type Tone } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { Field, Input, Select } from '@/components/ui/field';
import { Loading } from '@/components/ui/spinner';
import { QueryError } from '@/components/ui/query-error';
import { EmptyState } from '@/components/ui/empty-state';
import { useSites } from '@/features/sites/api/get-sites';
import { useSiteDay } from '@/features/drop-off/api/get-bookings';
import { useDriveClock } from '@/lib/drive-clock';
import { useMarkMissed } from '@/features/drop-off/api/book';
import { dayIn, plusDays, timeIn } from '@/features/drop-off/components/when';

const ARRIVAL: Record<BookingView['arrival'], { label: string; tone: Tone }> = {
  expected: { label: 'Expected', tone: 'sky' },
  arrived: { label: 'Arrived', tone: 'moss' },
  not_arrived: { label: 'Slot over, not received', tone: 'marigold' },
  missed: { label: 'Did not come', tone: 'brick' },
  cancelled: { label: 'Cancelled', tone: 'neutral' },
};

/** Who is coming to a site on a day, when, with which blankets, and who did not come. */
export default function DropOffDayPage() {
  const [params, setParams] = useSearchParams();
  const clock = useDriveClock();
  const sites = useSites('true');
  const siteId = Number(params.get('siteId')) || sites.data?.[0]?.id || null;
  const day = params.get('day') ?? clock.data?.today ?? null;
  const bookings = useSiteDay(siteId, day ?? '');
  const mark = useMarkMissed();
  const [done, setDone] = useState<string | null>(null);
  const zone = bookings.data?.timeZone ?? clock.data?.timeZone ?? 'UTC';
  const go = (next: { siteId?: number | null; day?: string | null }) =>
    setParams({ siteId: String(next.siteId ?? siteId ?? ''), day: next.day ?? day ?? '' });

  if (clock.isPending || sites.isPending) return <Loading />;
  if (clock.error || sites.error) return <QueryError error={clock.error ?? sites.error} />;
  const live = bookings.data?.bookings.filter((b) => b.status === 'booked') ?? [];
  const missed = bookings.data?.bookings.filter((b) => b.status === 'missed') ?? [];
  const blanketCount = live.reduce((n, b) => n + b.blankets.length, 0);
  const bySlot = new Map<string, BookingView[]>();
  for (const b of bookings.data?.bookings ?? []) bySlot.set(b.start, [...(bySlot.get(b.start) ?? []), b]);

  return (
    <div className="space-y-6">
      <PageHeader title="Drop-off day" lead={<>Who is booked to bring blankets to a site on a day, who has come and who did not. Times are <strong>{zone}</strong> time.</>} />
      <Card className="flex flex-wrap items-end gap-4">
        <Field label="Site" className="min-w-56 flex-1">
          {({ id }) => (
            <Select id={id} value={siteId ?? ''} onChange={(e) => go({ siteId: Number(e.target.value) })}>
              {sites.data.map((s) => (
                <option key={s.id} value={s.id}>{s.name}</option>
              ))}
            </Select>
          )}
        </Field>
        <Field label="Day">
          {({ id }) => <Input id={id} type="date" value={day ?? ''} onChange={(e) => e.target.value && go({ day: e.target.value })} />}
        </Field>
        <div className="flex gap-2">
          <Button variant="secondary" aria-label="Previous day" onClick={() => day && go({ day: plusDays(day, -1) })}><ChevronLeft className="size-5" aria-hidden /></Button>
          <Button variant="secondary" onClick={() => go({ day: clock.data.today })}>Today</Button>
          <Button variant="secondary" aria-label="Next day" onClick={() => day && go({ day: plusDays(day, 1) })}><ChevronRight className="size-5" aria-hidden /></Button>
        </div>
      </Card>
      {siteId === null ? (
        <EmptyState icon={CalendarClock} title="No drop-off sites yet">A coordinator adds drop-off sites and their opening hours first.</EmptyState>
      ) : bookings.isPending ? (
        <Loading />
      ) : bookings.error ? (
        <QueryError error={bookings.error} />
      ) : (
        <section aria-labelledby="day-heading" className="space-y-4">
          <h2 id="day-heading" className="text-2xl font-bold">
            {day && dayIn(`${day}T12:00:00Z`, 'UTC', { year: true })}: {live.length} {live.length === 1 ? 'visit' : 'visits'}, {blanketCount} {blanketCount === 1 ? 'blanket' : 'blankets'}
          </h2>
          {missed.length > 0 && (
            <p data-testid="day-missed" className="text-lg">
              <UserX className="mr-2 inline size-5 text-brick-700" aria-hidden />
              <strong>Did not come:</strong> {missed.map((b) => `${b.maker.name} (${timeIn(b.start, zone)})`).join(', ')}
            </p>
          )}
          {done && <Alert kind="success" title="Marked">{done}</Alert>}
          {mark.error && <Alert kind="error" title="That did not work">{mark.error.message}</Alert>}
          {bySlot.size === 0 ? (
            <EmptyState icon={CalendarClock} title="Nobody booked for this day">
              Makers may still walk in with finished blankets; the intake page receives them either way.
            </EmptyState>
          ) : (
            <ol className="space-y-3" aria-label="Booked visits by time">
              {[...bySlot.entries()].map(([start, list]) => (
                <li key={start}>
                  <Card className="grid gap-3 sm:grid-cols-[7rem_1fr]">
                    <p className="text-2xl font-bold text-heather-800">{timeIn(start, zone)}</p>
                    <ul className="space-y-3">
                      {list.map((b) => (
                        <li key={b.id} className="flex flex-wrap items-center justify-between gap-2" data-testid="day-booking">
                          <div>
                            <p className="font-bold">{b.maker.name}</p>
                            <p className="text-ink-soft">
                              {b.blankets.length} {b.blankets.length === 1 ? 'blanket' : 'blankets'}: {b.blankets.map((x) => x.code).join(', ')}
                            </p>
                          </div>
                          <div className="flex flex-wrap items-center gap-2">
                            <Badge tone={ARRIVAL[b.arrival].tone}>{ARRIVAL[b.arrival].label}</Badge>
                            {b.missed && (
                              <span className="text-sm text-ink-soft">
                                marked {timeIn(b.missed.at, zone)}{b.missed.by ? ` by ${b.missed.by}` : ''}
                              </span>
                            )}
                            {b.arrival === 'not_arrived' && (
                              <Button
                                size="sm"
                                variant="secondary"
                                busy={mark.isPending && mark.variables === b.id}
                                onClick={() => {
                                  setDone(null);
                                  mark.mutate(b.id, {
                                    onSuccess: () => setDone(`${b.maker.name} did not come. Their blankets are finished again, so they can book another visit.`),
                                  });
                                }}
                              >
                                <UserX className="size-4" aria-hidden /> Did not come
                              </Button>
                            )}
                          </div>
                        </li>
                      ))}
                    </ul>
                  </Card>
                </li>
              ))}
            </ol>
          )}
        </section>
      )}
    </div>
  );
}
