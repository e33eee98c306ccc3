import { useState } from 'react';
import { Link, useSearchParams } from 'react-router-dom';
import { CalendarClock, ChevronLeft, ChevronRight, Inbox, Printer, ScanLine } from 'lucide-react';
import { PageHeader } from '@/components/ui/page-header';
import { Card, CardTitle } from '@/components/ui/card';
import { Button, ButtonLink } from '@/components/ui/button';
import { Field, Input, Select } from '@/components/ui/field';
import { Loading } from '@/components/ui/spinner';
import { QueryError } from '@/components/ui/query-error';
import { EmptyState } from '@/components/ui/empty-state';
import { Checkbox } from '@/components/ui/field';
import { useIntakeSites } from '@/features/intake/api/get-intake-sites';
import { useIntakeQueue } from '@/features/intake/api/get-intake-queue';
import { rememberedSiteId } from '@/features/intake/components/receive-panel';
import { categoryText } from '@/features/intake/components/blanket-summary';
import { StatusBadge } from '@/components/ui/status-badge';
import { Badge, type Tone } from '@/components/ui/badge';
import { ZoneNote } from '@/components/ui/zone-note';
import { useDriveClock } from '@/lib/drive-clock';
import { timeIn } from '@/features/drop-off/components/when';
import { formatCm } from '@shared/guidelines/wording';
import type { BookedArrival, IntakeQueueItem } from '@shared/schemas/intake-views';
import { pageCount } from '@shared/schemas/page';

const ARRIVAL: Record<BookedArrival['arrival'], { label: string; tone: Tone }> = {
  expected: { label: 'Expected', tone: 'sky' },
  arrived: { label: 'Arrived', tone: 'moss' },
  not_arrived: { label: 'Slot over, not received', tone: 'marigold' },
  missed: { label: 'Did not come', tone: 'brick' },
};

/** The day's booked visits at the site, in slot order, to stand beside what walked in. */
function BookedArrivals({ items, zone, siteId, date }: { items: BookedArrival[]; zone: string; siteId: number; date: string }) {
  return (
    <Card>
      <CardTitle>
        Booked arrivals <span className="font-normal text-ink-soft">({items.length})</span>
      </CardTitle>
      {items.length === 0 ? (
        <p className="text-ink-soft">Nobody booked a visit here on this day; makers may still walk in.</p>
      ) : (
        <ul className="divide-y divide-oat-200" aria-label="Booked arrivals">
          {items.map((a) => (
            <li key={a.bookingId} className="flex flex-wrap items-center gap-x-3 gap-y-1 py-2" data-testid="booked-arrival">
              <span className="w-28 shrink-0 text-lg font-bold text-heather-800">
                {timeIn(a.start, zone)}–{timeIn(a.end, zone)}
              </span>
              <span className="min-w-0 flex-1">
                <span className="font-bold">{a.makerName}</span>
                <span className="block text-ink-soft">
                  {a.blankets.length} {a.blankets.length === 1 ? 'blanket' : 'blankets'}:{' '}
                  {a.blankets.map((b, i) => (
                    <span key={b.id}>
                      {i > 0 && ', '}
                      <Link to={`/organiser/intake?code=${b.code}`} className="font-mono font-bold tracking-wider">
                        {b.code}
                      </Link>
                    </span>
                  ))}
                </span>
              </span>
              <Badge tone={ARRIVAL[a.arrival].tone}>{ARRIVAL[a.arrival].label}</Badge>
            </li>
          ))}
        </ul>
      )}
      <p className="mt-3">
        <Link to={`/organiser/drop-offs?siteId=${siteId}&day=${date}`} className="font-bold text-heather-800 underline">
          <CalendarClock className="mr-1 inline size-5" aria-hidden />
          The site's drop-off day
        </Link>{' '}
        <span className="text-ink-soft">marks who did not come.</span>
      </p>
    </Card>
  );
}

interface Paging {
  total: number;
  page: number;
  pageSize: number;
  onPage: (page: number) => void;
}

function List({ title, items, empty, selected, onSelect, paging, zone }: { title: string; items: IntakeQueueItem[]; empty: string; selected: Set<number>; onSelect: (id: number, on: boolean) => void; paging?: Paging; zone: string }) {
  const pages = paging ? pageCount(paging) : 1;
  return (
    <Card>
      <CardTitle>
        {title} <span className="font-normal text-ink-soft">({paging ? paging.total : items.length})</span>
      </CardTitle>
      {items.length === 0 ? (
        <p className="text-ink-soft">{empty}</p>
      ) : (
        <ul className="divide-y divide-oat-200">
          {items.map((i) => (
            <li key={i.id} className="flex flex-wrap items-center gap-3 py-2">
              <Checkbox label={<span className="sr-only">Print a tag for {i.code}</span>} checked={selected.has(i.id)} onChange={(e) => onSelect(i.id, e.target.checked)} />
              <Link to={`/organiser/intake?code=${i.code}`} className="font-mono text-lg font-bold tracking-wider">
                {i.code}
              </Link>
              <StatusBadge status={i.status} />
              <span>
                {i.makerLabel} · {formatCm(i.widthCm)} × {formatCm(i.lengthCm)} cm, {categoryText(i.sizeCategory)}
                {i.recipientName && ` · for ${i.recipientName}`}
              </span>
              {i.arrivedAs && <Badge tone={i.arrivedAs === 'booked' ? 'heather' : 'neutral'}>{i.arrivedAs === 'booked' ? 'Booked' : 'Walk-in'}</Badge>}
              {i.at && <span className="ml-auto text-sm text-ink-soft">{timeIn(i.at, zone)}</span>}
            </li>
          ))}
        </ul>
      )}
      {paging && pages > 1 && (
        <nav aria-label={`Pages of ${title.toLowerCase()}`} className="mt-3 flex flex-wrap items-center justify-between gap-3">
          <Button size="sm" variant="secondary" onClick={() => paging.onPage(paging.page - 1)} disabled={paging.page <= 1}>
            <ChevronLeft className="size-4" aria-hidden /> Previous
          </Button>
          <span>
            Page {paging.page} of {pages}
          </span>
          <Button size="sm" variant="secondary" onClick={() => paging.onPage(paging.page + 1)} disabled={paging.page >= pages}>
            Next <ChevronRight className="size-4" aria-hidden />
          </Button>
        </nav>
      )}
    </Card>
  );
}

export default function IntakeQueuePage() {
  const [params, setParams] = useSearchParams();
  const sites = useIntakeSites();
  const siteId = Number(params.get('siteId')) || rememberedSiteId() || sites.data?.[0]?.id || null;
  const clock = useDriveClock();
  // The queue's day is the drive's today unless another day was chosen.
  const date = params.get('date') ?? clock.data?.today ?? null;
  const [pages, setPages] = useState({ waitingPage: 1, expectedPage: 1, key: '' });
  // Another site or day starts both lists from their first page again.
  const here = `${siteId}:${date}`;
  const current = pages.key === here ? pages : { waitingPage: 1, expectedPage: 1, key: here };
  const queue = useIntakeQueue(date ? siteId : null, date ?? '', { waitingPage: current.waitingPage, expectedPage: current.expectedPage });
  const [selected, setSelected] = useState<Set<number>>(new Set());
  const onSelect = (id: number, on: boolean) =>
    setSelected((s) => {
      const next = new Set(s);
      if (on) next.add(id);
      else next.delete(id);
      return next;
    });

  return (
    <div>
      <PageHeader
        title="Intake queue"
        lead="What came in at a drop-off site on a day, booked or walked in, what is still waiting to be inspected, and what is booked to come."
        actions={
          <>
            <ButtonLink to="/organiser/intake" variant="secondary">
              <ScanLine className="size-5" aria-hidden /> Find a blanket
            </ButtonLink>
            <ButtonLink to={`/tags?ids=${[...selected].join(',')}`} aria-disabled={selected.size === 0} className={selected.size === 0 ? 'pointer-events-none opacity-60' : ''}>
              <Printer className="size-5" aria-hidden /> Print {selected.size || ''} tag{selected.size === 1 ? '' : 's'}
            </ButtonLink>
          </>
        }
      />
      <div className="mb-6 flex flex-wrap gap-4">
        <Field label="Drop-off site" className="w-72">
          {(a) => (
            <Select id={a.id} value={siteId ?? ''} onChange={(e) => setParams(date ? { siteId: e.target.value, date } : { siteId: e.target.value })}>
              {(sites.data ?? []).map((s) => (
                <option key={s.id} value={s.id}>
                  {s.name}
                </option>
              ))}
            </Select>
          )}
        </Field>
        <Field label="Day" className="w-56">
          {(a) => <Input id={a.id} type="date" value={date ?? ''} onChange={(e) => e.target.value && setParams({ siteId: String(siteId ?? ''), date: e.target.value })} />}
        </Field>
      </div>
      <ZoneNote zone={queue.data?.timeZone ?? clock.data?.timeZone} className="mb-6" />
      {sites.isPending || clock.isPending || (siteId !== null && queue.isPending) ? (
        <Loading />
      ) : sites.error ? (
        <QueryError error={sites.error} />
      ) : queue.error ? (
        <QueryError error={queue.error} />
      ) : !queue.data ? (
        <EmptyState icon={Inbox} title="No drop-off sites yet">
          A coordinator adds drop-off sites first.
        </EmptyState>
      ) : (
        <div className="grid gap-6 lg:grid-cols-2">
          <BookedArrivals items={queue.data.bookedArrivals} zone={queue.data.timeZone} siteId={queue.data.site.id} date={queue.data.date} />
          <List title="Arrived this day" items={queue.data.arrived} empty="Nothing received here on this day yet." selected={selected} onSelect={onSelect} zone={queue.data.timeZone} />
          <List
            title="Waiting for inspection"
            items={queue.data.waiting}
            empty="Nothing waiting. Well done."
            selected={selected}
            onSelect={onSelect}
            zone={queue.data.timeZone}
            paging={{ total: queue.data.waitingTotal, page: queue.data.waitingPage, pageSize: queue.data.pageSize, onPage: (p) => setPages({ ...current, waitingPage: p }) }}
          />
          <List title="Inspected this day" items={queue.data.inspected} empty="Nothing inspected here on this day yet." selected={selected} onSelect={onSelect} zone={queue.data.timeZone} />
          <List
            title="Booked to come here"
            items={queue.data.expected}
            empty="No drop-offs booked for this site."
            selected={selected}
            onSelect={onSelect}
            zone={queue.data.timeZone}
            paging={{ total: queue.data.expectedTotal, page: queue.data.expectedPage, pageSize: queue.data.pageSize, onPage: (p) => setPages({ ...current, expectedPage: p }) }}
          />
        </div>
      )}
    </div>
  );
}
