import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { AlarmClock, CalendarClock, Pencil, Plus, XCircle } from 'lucide-react';
import { Card } from '@/components/ui/card';
import { Badge } from '@/components/ui/badge';
import { Button, ButtonLink } from '@/components/ui/button';
import { Field, Input } from '@/components/ui/field';
import { Alert } from '@/components/ui/alert';
import { ProgressBar } from '@/components/ui/progress-bar';
import { applyServerErrors } from '@/components/ui/form-errors';
import { daysUntil, formatDay, isoDayFrom } from '@/components/ui/format-day';
import { useDriveToday } from '@/lib/drive-clock';
import { MAX_PLEDGE_QUANTITY } from '@shared/schemas/pledge-values';
import type { PledgeView } from '@shared/schemas/pledge';
import { lazyZodResolver } from '@/lib/lazy-zod-resolver';
import { sizeCategoryRow } from '@shared/guidelines/size-categories';
import { useUpdatePledge } from '../api/update-pledge';
import { useCancelPledge } from '../api/cancel-pledge';

/** How far a late pledge moves with one press: two weeks, or to the need's deadline if sooner. */
export const PUSH_BACK_DAYS = 14;

export function pushBackDate(p: PledgeView, today: string): string {
  const twoWeeks = isoDayFrom(today, PUSH_BACK_DAYS);
  const deadline = p.need?.deadline;
  // Past the deadline the need is closing anyway; two weeks is still the honest new date.
  return deadline && deadline >= isoDayFrom(today, 1) && deadline < twoWeeks ? deadline : twoWeeks;
}

interface EditValues {
  quantity: number;
  dueDate: string;
}

const editResolver = lazyZodResolver<EditValues>(() =>
  import('@shared/schemas/pledge').then((m) => m.PledgeCreateSchema.pick({ quantity: true, dueDate: true })),
);

function EditPledge({ pledge, onClose, onChanged }: { pledge: PledgeView; onClose: () => void; onChanged?: () => void }) {
  const update = useUpdatePledge(onChanged);
  const today = useDriveToday();
  const { register, handleSubmit, formState, setError } = useForm<EditValues>({
    resolver: editResolver,
    defaultValues: { quantity: pledge.quantity, dueDate: pledge.dueDate },
  });
  const onSubmit = handleSubmit((v) =>
    update.mutate(
      { id: pledge.id, version: pledge.version, ...v },
      { onSuccess: onClose, onError: (err) => applyServerErrors(err, setError, ['quantity', 'dueDate']) },
    ),
  );
  const e = formState.errors;
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-3 rounded-xl border border-oat-200 bg-oat-50 p-4" aria-label="Change this pledge">
      {update.error && !Object.keys(e).length && <Alert kind="error">{update.error.message}</Alert>}
      <div className="grid gap-4 sm:grid-cols-2">
        <Field label="How many" hint={pledge.blanketsLogged > 0 ? `At least ${pledge.blanketsLogged}: that many are logged` : undefined} error={e.quantity?.message}>
          {({ id, describedBy, invalid }) => (
            <Input id={id} type="number" min={Math.max(1, pledge.blanketsLogged)} max={MAX_PLEDGE_QUANTITY} aria-describedby={describedBy} aria-invalid={invalid} {...register('quantity', { valueAsNumber: true })} />
          )}
        </Field>
        <Field label="I'll finish by" error={e.dueDate?.message}>
          {({ id, describedBy, invalid }) => <Input id={id} type="date" min={today} aria-describedby={describedBy} aria-invalid={invalid} {...register('dueDate')} />}
        </Field>
      </div>
      <div className="flex flex-wrap gap-2">
        <Button type="submit" busy={update.isPending}>
          Save changes
        </Button>
        <Button variant="quiet" onClick={onClose}>
          Never mind
        </Button>
      </div>
    </form>
  );
}

/** One of my pledges: where it goes, how far along, and what I can do with it. */
export function PledgeCard({ pledge, onChanged }: { pledge: PledgeView; onChanged?: () => void }) {
  const [editing, setEditing] = useState(false);
  const [confirming, setConfirming] = useState(false);
  const update = useUpdatePledge(onChanged);
  const cancel = useCancelPledge(onChanged);
  const where = pledge.need?.recipient.name ?? 'Wherever it’s needed most';
  const today = useDriveToday();
  const days = daysUntil(pledge.dueDate, today);
  const open = pledge.status !== 'cancelled';
  const room = pledge.quantity - pledge.blanketsLogged;
  const headingId = `pledge-${pledge.id}`;
  return (
    <Card role="region" aria-labelledby={headingId} className="space-y-4" data-testid={`pledge-${pledge.id}`}>
      <div className="flex flex-wrap items-start justify-between gap-2">
        <div>
          <h3 id={headingId} className="text-xl font-bold">
            {pledge.quantity} × {sizeCategoryRow(pledge.sizeCategory).label} · {where}
          </h3>
          <p className="flex items-center gap-1 text-ink-soft">
            <CalendarClock className="size-4" aria-hidden />
            Finish by {formatDay(pledge.dueDate)}
            {open && pledge.status === 'active' && (days >= 0 ? ` · ${days} day${days === 1 ? '' : 's'} to go` : ` · ${-days} day${days === -1 ? '' : 's'} ago`)}
          </p>
        </div>
        <div className="flex flex-wrap gap-2">
          {pledge.late && (
            <Badge tone="brick">
              <AlarmClock className="size-4" aria-hidden /> Late
            </Badge>
          )}
          {pledge.afterDeadline && open && <Badge tone="marigold">After the need’s deadline</Badge>}
          {pledge.status === 'fulfilled' && <Badge tone="moss">All made</Badge>}
          {pledge.status === 'cancelled' && <Badge>Cancelled</Badge>}
        </div>
      </div>
      {open && (
        <ProgressBar value={pledge.quantity ? pledge.blanketsFinished / pledge.quantity : 0} label={`${pledge.blanketsFinished} of ${pledge.quantity} finished · ${pledge.blanketsLogged} logged${pledge.blanketsDeclined > 0 ? ` · ${pledge.blanketsDeclined} declined at intake (not counted)` : ''}`} tone="moss" />
      )}
      {pledge.late && (
        <Alert kind="warning" title="This pledge is past its date">
          Life happens. Push it back and the organisers will know when to expect the rest.
          <div className="mt-3">
            <Button
              variant="secondary"
              busy={update.isPending}
              onClick={() => update.mutate({ id: pledge.id, version: pledge.version, dueDate: pushBackDate(pledge, today) })}
            >
              Push back to {formatDay(pushBackDate(pledge, today))}
            </Button>
          </div>
        </Alert>
      )}
      {update.error && !editing && <Alert kind="error">{update.error.message}</Alert>}
      {cancel.error && <Alert kind="error">{cancel.error.message}</Alert>}
      {editing && <EditPledge pledge={pledge} onClose={() => setEditing(false)} onChanged={onChanged} />}
      {open && !editing && (
        <div className="flex flex-wrap gap-2">
          {room > 0 && (
            <ButtonLink to={`/blankets/new?pledge=${pledge.id}`}>
              <Plus className="size-5" aria-hidden /> Log a blanket
            </ButtonLink>
          )}
          <Button variant="secondary" onClick={() => setEditing(true)}>
            <Pencil className="size-5" aria-hidden /> Change or reduce
          </Button>
          {pledge.blanketsLogged === 0 &&
            (confirming ? (
              <span className="flex flex-wrap items-center gap-2">
                <span className="font-bold">Cancel this pledge?</span>
                <Button variant="danger" busy={cancel.isPending} onClick={() => cancel.mutate(pledge.id, { onSettled: () => setConfirming(false) })}>
                  Yes, cancel it
                </Button>
                <Button variant="quiet" onClick={() => setConfirming(false)}>
                  Keep it
                </Button>
              </span>
            ) : (
              <Button variant="quiet" onClick={() => setConfirming(true)}>
                <XCircle className="size-5" aria-hidden /> Cancel pledge
              </Button>
            ))}
        </div>
      )}
    </Card>
  );
}
