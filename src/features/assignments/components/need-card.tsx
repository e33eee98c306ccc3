import { useState } from 'react';
import { ChevronDown, ChevronUp, Undo2, ArrowRightLeft } from 'lucide-react';
import { Card } from '@/components/ui/card';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { Field, Input, Select } from '@/components/ui/field';
import { ProgressBar } from '@/components/ui/progress-bar';
import { Cautions } from '@/components/ui/cautions';
import { Loading } from '@/components/ui/spinner';
import { Alert } from '@/components/ui/alert';
import type { AssignmentView, BoardNeed } from '@shared/schemas/assignment';
import { useNeedAssignments } from '../api/get-need-assignments';
import { useReassign, useUnassign } from '../api/assign-blankets';
import { URGENCY, needLabel, sizeText } from './words';
import { formatDay } from '@/components/ui/format-day';

function AssignedRow({ a, needs }: { a: AssignmentView; needs: BoardNeed[] }) {
  const [reason, setReason] = useState('');
  const [moveTo, setMoveTo] = useState('');
  const unassign = useUnassign();
  const reassign = useReassign();
  const error = unassign.error ?? reassign.error;
  const movable = a.blanketStatus === 'assigned';
  const others = needs.filter((n) => n.needId !== a.needId && n.open > 0);
  return (
    <li className="space-y-2 py-3">
      <p>
        <span className="font-mono font-bold tracking-wider">{a.blanketCode}</span>
        <span className="text-ink-soft">
          {' '}
          · assigned {formatDay(a.assignedAt)}
          {a.assignedBy ? ` by ${a.assignedBy.name}` : ''}
          {a.source === 'suggestion' ? ' from the suggestion' : ''}
        </span>
      </p>
      {!movable ? (
        <p className="text-sm text-ink-soft">It is {a.blanketStatus} now; unpack it on its delivery run to change where it goes.</p>
      ) : (
        <div className="grid gap-2 sm:grid-cols-2">
          <div className="flex items-end gap-2">
            <Field label={<span className="text-sm">Move {a.blanketCode} to</span>} className="min-w-0 flex-1">
              {(f) => (
                <Select id={f.id} value={moveTo} onChange={(e) => setMoveTo(e.target.value)}>
                  <option value="">Choose a need…</option>
                  {others.map((n) => (
                    <option key={n.needId} value={n.needId}>
                      {needLabel(n)} ({n.open} open)
                    </option>
                  ))}
                </Select>
              )}
            </Field>
            <Button size="sm" variant="secondary" disabled={!moveTo} busy={reassign.isPending} onClick={() => reassign.mutate({ id: a.id, needId: Number(moveTo) })}>
              <ArrowRightLeft className="size-4" aria-hidden /> Move
            </Button>
          </div>
          <div className="flex items-end gap-2">
            <Field label={<span className="text-sm">Why unassign {a.blanketCode}?</span>} className="min-w-0 flex-1">
              {(f) => <Input id={f.id} value={reason} maxLength={500} onChange={(e) => setReason(e.target.value)} placeholder="e.g. the unit asked for fewer" />}
            </Field>
            <Button size="sm" variant="quiet" disabled={reason.trim() === ''} busy={unassign.isPending} onClick={() => unassign.mutate({ id: a.id, reason: reason.trim() })}>
              <Undo2 className="size-4" aria-hidden /> Unassign
            </Button>
          </div>
        </div>
      )}
      {error && <Alert kind="error">{error.message}</Alert>}
    </li>
  );
}

/** One open need: how full it is, how soon it is due, what the unit asked for, and what is assigned to it. */
export function NeedCard({ need, needs }: { need: BoardNeed; needs: BoardNeed[] }) {
  const [open, setOpen] = useState(false);
  const list = useNeedAssignments(need.needId, open);
  const u = URGENCY[need.urgency];
  const guarded = need.population === 'preemie' || need.population === 'infant' || need.population === 'elder';
  return (
    <Card className="space-y-3" data-testid={`need-${need.needId}`}>
      <div className="flex flex-wrap items-start justify-between gap-2">
        <h3 className="text-lg font-bold">
          {need.recipientName}
          <span className="block font-normal text-ink-soft">{sizeText(need.sizeCategory)}</span>
        </h3>
        <Badge tone={u.tone}>{u.text(need.daysLeft)}</Badge>
      </div>
      <ProgressBar value={need.wanted ? need.assigned / need.wanted : 0} label={`${need.assigned} of ${need.wanted} assigned`} tone={need.open === 0 ? 'moss' : 'heather'} showPercent={false} />
      <p className="font-bold" data-testid="open-count">
        {need.open === 0 ? 'Full: nothing more needed' : `${need.open} still open`}
      </p>
      {need.preferences && <p className="text-ink-soft">They asked: “{need.preferences}”</p>}
      {guarded && (
        <details>
          <summary className="cursor-pointer font-bold text-marigold-700">Cautions for this unit</summary>
          <Cautions cautions={need.cautions} compact className="mt-2" />
        </details>
      )}
      {need.assigned > 0 && (
        <div>
          <Button size="sm" variant="quiet" aria-expanded={open} onClick={() => setOpen((o) => !o)}>
            {open ? <ChevronUp className="size-4" aria-hidden /> : <ChevronDown className="size-4" aria-hidden />}
            {open ? 'Hide' : 'Show'} the {need.assigned} assigned
          </Button>
          {open &&
            (list.isPending ? (
              <Loading />
            ) : (
              <ul className="divide-y divide-oat-200" aria-label={`Assigned to ${needLabel(need)}`}>
                {(list.data?.items ?? []).map((a) => (
                  <AssignedRow key={a.id} a={a} needs={needs} />
                ))}
              </ul>
            ))}
        </div>
      )}
    </Card>
  );
}
