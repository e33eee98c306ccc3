import { useState } from 'react';
import { Link, useNavigate } from 'react-router-dom';
import { ChevronLeft, ChevronRight, FileDown, Plus, Truck } from 'lucide-react';
import { PageHeader } from '@/components/ui/page-header';
import { Card, CardTitle } from '@/components/ui/card';
import { Button, buttonClass } from '@/components/ui/button';
import { Loading } from '@/components/ui/spinner';
import { QueryError } from '@/components/ui/query-error';
import { EmptyState } from '@/components/ui/empty-state';
import { formatDay } from '@/components/ui/format-day';
import { cn } from '@/components/ui/cn';
import { useMe } from '@/features/auth/api/get-me';
import { usePeople } from '@/features/people/api/get-people';
import { useSites } from '@/features/sites/api/get-sites';
import { useRuns, type RunsWhen } from '@/features/runs/api/get-runs';
import { useWaiting } from '@/features/runs/api/get-waiting';
import { useCreateRun } from '@/features/runs/api/create-run';
import { PlanRunForm } from '@/features/runs/components/plan-run-form';
import { RunStateBadge } from '@/features/runs/components/run-state-badge';
import { pageCount } from '@shared/schemas/page';

function PlanRun({ onDone }: { onDone: () => void }) {
  const people = usePeople();
  const sites = useSites('true');
  const waiting = useWaiting();
  const create = useCreateRun();
  const navigate = useNavigate();
  if (people.isPending || sites.isPending || waiting.isPending) return <Loading />;
  if (people.error || sites.error || waiting.error) return <QueryError error={people.error ?? sites.error ?? waiting.error} />;
  return (
    <Card>
      <CardTitle>Plan a delivery run</CardTitle>
      <PlanRunForm
        drivers={people.data.filter((p) => p.active)}
        sites={sites.data}
        waiting={waiting.data}
        busy={create.isPending}
        error={create.error}
        onSubmit={(input) =>
          create.mutate(input, {
            onSuccess: (run) => {
              onDone();
              navigate(`/runs/${run.id}`);
            },
          })
        }
      />
    </Card>
  );
}

export default function RunsPage() {
  const me = useMe();
  const isCoordinator = me.data?.role === 'coordinator';
  const [when, setWhen] = useState<RunsWhen>('upcoming');
  const [page, setPage] = useState(1);
  const [planning, setPlanning] = useState(false);
  const runs = useRuns(when, page);
  return (
    <div className="space-y-6">
      <PageHeader
        title="Delivery runs"
        lead="The last mile: a day, a driver and the stops, with each recipient's blankets packed in numbered boxes."
        actions={
          <>
            <Link to="/exports" className={buttonClass('secondary')}>
              <FileDown className="size-5" aria-hidden /> Exports
            </Link>
            {isCoordinator && !planning && (
              <Button onClick={() => setPlanning(true)}>
                <Plus className="size-5" aria-hidden /> Plan a run
              </Button>
            )}
          </>
        }
      />
      {planning && <PlanRun onDone={() => setPlanning(false)} />}
      <div role="tablist" aria-label="Which runs" className="flex gap-2">
        {(['upcoming', 'past'] as const).map((w) => (
          <button
            key={w}
            role="tab"
            aria-selected={when === w}
            className={cn(buttonClass(when === w ? 'primary' : 'secondary', 'sm'))}
            onClick={() => {
              setWhen(w);
              setPage(1);
            }}
          >
            {w === 'upcoming' ? 'Today and later' : 'Earlier runs'}
          </button>
        ))}
      </div>
      {runs.isPending ? (
        <Loading />
      ) : runs.error ? (
        <QueryError error={runs.error} />
      ) : runs.data.items.length === 0 ? (
        <EmptyState icon={Truck} title={when === 'upcoming' ? 'No runs planned yet' : 'No earlier runs'} action={isCoordinator && when === 'upcoming' ? <Button onClick={() => setPlanning(true)}>Plan a run</Button> : undefined}>
          A run takes assigned blankets from a drop-off site to the recipients, a stop at a time.
        </EmptyState>
      ) : (
        <>
          <ul className="grid gap-4 md:grid-cols-2">
            {runs.data.items.map((r) => (
              <li key={r.id}>
                <Link to={`/runs/${r.id}`} className="block rounded-2xl border border-oat-200 bg-white p-5 no-underline shadow-sm hover:border-heather-300 focus-visible:border-heather-500">
                  <div className="flex flex-wrap items-start justify-between gap-2">
                    <h2 className="text-xl font-bold text-ink">{formatDay(r.runDate, true)}</h2>
                    <RunStateBadge state={r.state} />
                  </div>
                  <p className="mt-1 text-ink-soft">
                    {r.driver.name} drives from {r.startSite.name}
                  </p>
                  <p className="mt-2 text-ink">
                    {r.stopCount} stop{r.stopCount === 1 ? '' : 's'} · {r.blanketCount} blanket{r.blanketCount === 1 ? '' : 's'}
                    {r.deliveredCount > 0 && ` · ${r.deliveredCount} delivered`}
                  </p>
                </Link>
              </li>
            ))}
          </ul>
          {runs.data.total > runs.data.pageSize && (
            <nav aria-label="Pages of runs" className="flex items-center gap-3">
              <Button variant="secondary" size="sm" disabled={page <= 1} onClick={() => setPage((p) => p - 1)}>
                <ChevronLeft className="size-4" aria-hidden /> Newer
              </Button>
              <span>
                Page {page} of {pageCount(runs.data)}
              </span>
              <Button variant="secondary" size="sm" disabled={page >= pageCount(runs.data)} onClick={() => setPage((p) => p + 1)}>
                Older <ChevronRight className="size-4" aria-hidden />
              </Button>
            </nav>
          )}
        </>
      )}
    </div>
  );
}
