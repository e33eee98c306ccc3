import { Link, useParams } from 'react-router-dom';
import { ArrowLeft, Printer } from 'lucide-react';
import { Button } from '@/components/ui/button';
import { Loading } from '@/components/ui/spinner';
import { QueryError } from '@/components/ui/query-error';
import { Cautions } from '@/components/ui/cautions';
import { formatDay } from '@/components/ui/format-day';
import { useRun } from '@/features/runs/api/get-run';

/** One printable page per run: each stop's boxes and the codes in them, so the driver can hand over and count. */
export default function PackingSheetPage() {
  const id = Number(useParams().id);
  const run = useRun(id);
  if (run.isPending) return <Loading />;
  if (run.error) return <QueryError error={run.error} />;
  const r = run.data;
  return (
    <div className="space-y-6">
      <div className="no-print flex flex-wrap items-center justify-between gap-3">
        <Link to={`/runs/${r.id}`} className="inline-flex items-center gap-1 font-bold">
          <ArrowLeft className="size-4" aria-hidden /> Back to the run
        </Link>
        <Button onClick={() => window.print()}>
          <Printer className="size-5" aria-hidden /> Print
        </Button>
      </div>
      <h1 className="text-3xl font-bold">Packing sheet: run of {formatDay(r.runDate, true)}</h1>
      <p className="text-lg">
        Driver {r.driver.name}, from {r.startSite.name}. {r.blanketCount} blankets in all.
      </p>
      {r.stops.map((s) => (
        <section key={s.id} className="break-inside-avoid space-y-3 rounded-2xl border-2 border-oat-300 p-5">
          <h2 className="text-2xl font-bold">
            Stop {s.position}: {s.recipient.name}
          </h2>
          <p>{s.recipient.address}</p>
          {s.boxes.map((box) => {
            const inBox = s.blankets.filter((b) => b.box === box);
            return (
              <div key={box}>
                <h3 className="text-lg font-bold">
                  Box {box} · {inBox.length} blanket{inBox.length === 1 ? '' : 's'}
                </h3>
                <ul className="mt-1 grid grid-cols-2 gap-x-6 gap-y-1 sm:grid-cols-3">
                  {inBox.map((b) => (
                    <li key={b.id} className="flex items-center gap-2">
                      <span className="inline-block size-5 rounded border-2 border-ink" aria-hidden />
                      <span className="font-mono">{b.code}</span>
                    </li>
                  ))}
                </ul>
              </div>
            );
          })}
          {s.cautions.some((c) => c.id !== 'facility-policy') && <Cautions cautions={s.cautions} compact />}
          <p className="pt-2">Received by: ______________________ Count: ______</p>
        </section>
      ))}
    </div>
  );
}
