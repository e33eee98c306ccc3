import { Link, useParams } from 'react-router-dom';
import { ArrowLeft, Printer, Route as RouteIcon, Truck } from 'lucide-react';
import { PageHeader } from '@/components/ui/page-header';
import { Card, CardTitle } from '@/components/ui/card';
import { Button, buttonClass } from '@/components/ui/button';
import { Loading } from '@/components/ui/spinner';
import { QueryError } from '@/components/ui/query-error';
import { Alert } from '@/components/ui/alert';
import { EmptyState } from '@/components/ui/empty-state';
import { PinMap, type MapPin } from '@/components/ui/pin-map';
import { formatDay } from '@/components/ui/format-day';
import { useMe } from '@/features/auth/api/get-me';
import { useRun } from '@/features/runs/api/get-run';
import { useChangeRun } from '@/features/runs/api/change-run';
import { ManifestDownload } from '@/features/runs/components/manifest-download';
import { StopCard } from '@/features/runs/components/stop-card';
import { km, RunStateBadge } from '@/features/runs/components/run-state-badge';
import type { RunView } from '@shared/schemas/run';

/** Stops first, so the map's numbers are the stop numbers; the start site comes last. */
function pinsOf(run: RunView): MapPin[] {
  const pins: MapPin[] = [];
  const allPinned = run.unpinned.length === 0;
  for (const stop of run.stops) {
    const r = stop.recipient;
    if (r.lat !== null && r.lng !== null) pins.push({ id: stop.id, lat: r.lat, lng: r.lng, label: allPinned ? r.name : `Stop ${stop.position}: ${r.name}`, kind: 'recipient' });
  }
  const s = run.startSite;
  if (s.lat !== null && s.lng !== null) pins.push({ id: 'start', lat: s.lat, lng: s.lng, label: `Start and finish: ${s.name}`, kind: 'site' });
  return pins;
}

export default function RunDetailPage() {
  const id = Number(useParams().id);
  const me = useMe();
  const run = useRun(id);
  const change = useChangeRun(id);
  const isCoordinator = me.data?.role === 'coordinator';
  if (run.isPending) return <Loading />;
  if (run.error) return <QueryError error={run.error} />;
  const r = run.data;
  const canPlan = isCoordinator && r.state !== 'delivered';
  // The server lets a coordinator, or the organiser driving this run, record what was handed over.
  const canDeliver = isCoordinator || (me.data?.id !== undefined && me.data.id === r.driver.id);
  const move = (from: number, to: number) => {
    const order = r.stops.map((s) => s.id);
    const [item] = order.splice(from, 1);
    order.splice(to, 0, item!);
    change.mutate({ kind: 'order', stopOrder: order, version: r.version });
  };
  return (
    <div className="space-y-6">
      <Link to="/runs" className="no-print inline-flex items-center gap-1 font-bold">
        <ArrowLeft className="size-4" aria-hidden /> All runs
      </Link>
      <PageHeader
        title={`Run of ${formatDay(r.runDate, true)}`}
        lead={
          <>
            {r.driver.name} drives from {r.startSite.name}. {r.stopCount} stop{r.stopCount === 1 ? '' : 's'}, {r.blanketCount} blanket{r.blanketCount === 1 ? '' : 's'}.
          </>
        }
        actions={
          <>
            <RunStateBadge state={r.state} />
            <Link to={`/runs/${r.id}/packing-sheet`} className={buttonClass('secondary')}>
              <Printer className="size-5" aria-hidden /> Packing sheet
            </Link>
          </>
        }
      />
      {r.notes && <Alert kind="info" title="Notes for the driver">{r.notes}</Alert>}
      {change.error && <Alert kind="error" title="That did not work">{change.error.message}</Alert>}
      <div className="grid gap-6 lg:grid-cols-[3fr_2fr]">
        <Card>
          <CardTitle>Route</CardTitle>
          <PinMap label={`Map of the stops of the run of ${formatDay(r.runDate)}`} fallbackCentre={{ lat: r.startSite.lat ?? 0, lng: r.startSite.lng ?? 0 }} pins={pinsOf(r)} />
          <p className="mt-3 text-lg">
            Round trip <span className="font-bold">{km(r.totalKm)}</span> as the crow flies
            {r.returnKm !== null && <span className="text-ink-soft"> (back to the start {km(r.returnKm)})</span>}
          </p>
          {r.unpinned.length > 0 && <p className="text-sm text-marigold-700">No map pin yet for {r.unpinned.join(', ')}: they go last and their legs are not counted.</p>}
          {canPlan && r.stops.length > 1 && (
            <Button className="no-print mt-3" variant="secondary" busy={change.isPending} onClick={() => change.mutate({ kind: 'route' })}>
              <RouteIcon className="size-5" aria-hidden /> Suggest a stop order
            </Button>
          )}
        </Card>
        <Card>
          <CardTitle>Delivery list</CardTitle>
          <p className="mb-4 text-ink-soft">One row per blanket, stop by stop and box by box, for the driver and for each recipient's records.</p>
          <ManifestDownload url={`/api/runs/${r.id}/manifest.csv`} />
        </Card>
      </div>
      <section aria-labelledby="stops-heading" className="space-y-4">
        <h2 id="stops-heading" className="text-2xl font-bold">
          Stops in driving order
        </h2>
        {r.stops.length === 0 ? (
          <EmptyState icon={Truck} title="No stops on this run">
            Plan a new run from the recipients with blankets waiting.
          </EmptyState>
        ) : (
          <ol className="space-y-4">
            {r.stops.map((s, i) => (
              <li key={s.id}>
                <StopCard stop={s} index={i} count={r.stops.length} canPlan={canPlan} canDeliver={canDeliver} busy={change.isPending} onChange={(c) => change.mutate(c)} onMove={move} />
              </li>
            ))}
          </ol>
        )}
      </section>
    </div>
  );
}
