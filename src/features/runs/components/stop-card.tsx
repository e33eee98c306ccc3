import { useState, type FormEvent } from 'react';
import { ArrowDown, ArrowUp, CheckCircle2, PackageCheck, Undo2 } from 'lucide-react';
import { Card } from '@/components/ui/card';
import { Button } from '@/components/ui/button';
import { Field, Input } from '@/components/ui/field';
import { Cautions } from '@/components/ui/cautions';
import { POPULATION_LABELS } from '@shared/schemas/blanket-values';
import type { RunStopView } from '@shared/schemas/run';
import { km, StopStateBadge } from './run-state-badge';
import type { RunChange } from '../api/change-run';

interface Props {
  stop: RunStopView;
  index: number;
  count: number;
  canPlan: boolean;
  canDeliver: boolean;
  busy: boolean;
  onChange: (c: RunChange) => void;
  onMove: (from: number, to: number) => void;
}

function DeliverForm({ stop, busy, onChange }: Pick<Props, 'stop' | 'busy' | 'onChange'>) {
  const [count, setCount] = useState(String(stop.blankets.length));
  const [signedBy, setSignedBy] = useState('');
  const submit = (e: FormEvent) => {
    e.preventDefault();
    onChange({ kind: 'deliver', stopId: stop.id, body: { receivedCount: Number(count), signedBy } });
  };
  const short = Number(count) !== stop.blankets.length;
  return (
    <form onSubmit={submit} className="mt-4 grid gap-3 rounded-xl bg-moss-100/60 p-4 sm:grid-cols-[8rem_1fr_auto] sm:items-end" aria-label={`Mark ${stop.recipient.name} delivered`}>
      <Field label="Received" hint="Blankets handed over">
        {(f) => <Input id={f.id} aria-describedby={f.describedBy} type="number" min={0} inputMode="numeric" value={count} onChange={(e) => setCount(e.target.value)} required />}
      </Field>
      <Field label="Signed for by" hint="A role is enough, e.g. “ward clerk”">
        {(f) => <Input id={f.id} aria-describedby={f.describedBy} value={signedBy} onChange={(e) => setSignedBy(e.target.value)} maxLength={120} required />}
      </Field>
      <Button type="submit" busy={busy}>
        <CheckCircle2 className="size-5" aria-hidden /> Mark delivered
      </Button>
      {short && <p className="text-sm font-bold text-marigold-700 sm:col-span-3">That is not the {stop.blankets.length} packed for this stop: say what happened in the run notes.</p>}
    </form>
  );
}

export function StopCard({ stop, index, count, canPlan, canDeliver, busy, onChange, onMove }: Props) {
  const [undo, setUndo] = useState<'unpack' | 'undeliver' | null>(null);
  const [reason, setReason] = useState('');
  const population = stop.recipient.population;
  const vulnerable = stop.cautions.some((c) => c.id !== 'facility-policy');
  return (
    <Card className="space-y-3" data-testid="run-stop">
      <div className="flex flex-wrap items-start gap-3">
        <span className="flex size-10 shrink-0 items-center justify-center rounded-full bg-heather-700 text-lg font-bold text-white" aria-hidden>
          {stop.position}
        </span>
        <div className="min-w-0 flex-1">
          <div className="flex flex-wrap items-start justify-between gap-x-3 gap-y-1">
            <h3 className="text-xl font-bold">
              <span className="sr-only">Stop {stop.position}: </span>
              {stop.recipient.name}
            </h3>
            <StopStateBadge state={stop.state} />
          </div>
          <p className="text-ink-soft">{stop.recipient.address}</p>
          <p className="text-sm text-ink-soft">
            {POPULATION_LABELS[population]} · leg {km(stop.legKm)}
          </p>
        </div>
      </div>
      {stop.recipient.deliveryNotes && <p className="rounded-xl bg-oat-50 p-3">{stop.recipient.deliveryNotes}</p>}
      {vulnerable && <Cautions cautions={stop.cautions} compact />}
      <table className="w-full text-left">
        <caption className="sr-only">Blankets for {stop.recipient.name}</caption>
        <thead className="text-sm text-ink-soft">
          <tr>
            <th className="py-1 pr-3 font-bold">Box</th>
            <th className="py-1 pr-3 font-bold">Code</th>
            <th className="hidden py-1 pr-3 font-bold sm:table-cell">Size</th>
            <th className="py-1 font-bold">Colours</th>
          </tr>
        </thead>
        <tbody>
          {stop.blankets.map((b) => (
            <tr key={b.id} className="border-t border-oat-200">
              <td className="py-1.5 pr-3">{b.box}</td>
              <td className="py-1.5 pr-3 font-mono">{b.code}</td>
              <td className="hidden py-1.5 pr-3 sm:table-cell">{b.sizeCategory ?? '–'}</td>
              <td className="py-1.5">{b.colours || '–'}</td>
            </tr>
          ))}
        </tbody>
      </table>
      {stop.state === 'delivered' && (
        <p className="font-bold text-moss-700">
          {stop.receivedCount} received, signed for by {stop.signedBy}
        </p>
      )}
      <div className="no-print flex flex-wrap gap-2">
        {canPlan && stop.state !== 'delivered' && (
          <>
            <Button size="sm" variant="quiet" disabled={index === 0 || busy} onClick={() => onMove(index, index - 1)} aria-label={`Move ${stop.recipient.name} earlier`}>
              <ArrowUp className="size-4" aria-hidden /> Earlier
            </Button>
            <Button size="sm" variant="quiet" disabled={index === count - 1 || busy} onClick={() => onMove(index, index + 1)} aria-label={`Move ${stop.recipient.name} later`}>
              <ArrowDown className="size-4" aria-hidden /> Later
            </Button>
          </>
        )}
        {stop.state === 'planned' && (
          <Button size="sm" busy={busy} onClick={() => onChange({ kind: 'pack', stopId: stop.id })}>
            <PackageCheck className="size-4" aria-hidden /> Mark packed
          </Button>
        )}
        {stop.state === 'packed' && (
          <Button size="sm" variant="secondary" onClick={() => setUndo('unpack')}>
            <Undo2 className="size-4" aria-hidden /> Unpack
          </Button>
        )}
        {stop.state === 'delivered' && canDeliver && (
          <Button size="sm" variant="secondary" onClick={() => setUndo('undeliver')}>
            <Undo2 className="size-4" aria-hidden /> Not delivered after all
          </Button>
        )}
      </div>
      {stop.state === 'packed' && canDeliver && <DeliverForm stop={stop} busy={busy} onChange={onChange} />}
      {undo && (
        <form
          className="no-print grid gap-3 rounded-xl bg-oat-50 p-4 sm:grid-cols-[1fr_auto_auto] sm:items-end"
          onSubmit={(e) => {
            e.preventDefault();
            onChange({ kind: undo, stopId: stop.id, reason });
            setUndo(null);
            setReason('');
          }}
        >
          <Field label="Why?" hint="The blankets' history keeps the reason">
            {(f) => <Input id={f.id} aria-describedby={f.describedBy} value={reason} onChange={(e) => setReason(e.target.value)} required maxLength={500} />}
          </Field>
          <Button type="submit" variant="danger" busy={busy}>
            {undo === 'unpack' ? 'Unpack' : 'Undo the delivery'}
          </Button>
          <Button variant="quiet" onClick={() => setUndo(null)}>
            Keep it
          </Button>
        </form>
      )}
    </Card>
  );
}
