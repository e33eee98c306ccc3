import { useEffect } from 'react';
import { useForm } from 'react-hook-form';
import { Button } from '@/components/ui/button';
import { Field, Input, Select } from '@/components/ui/field';
import { Alert } from '@/components/ui/alert';
import { applyServerErrors } from '@/components/ui/form-errors';
import { formatDay, isoDayFrom } from '@/components/ui/format-day';
import { useDriveToday } from '@/lib/drive-clock';
import { SIZE_CATEGORIES } from '@shared/schemas/blanket-values';
import type { SizeCategory } from '@shared/schemas/blanket';
import { MAX_PLEDGE_QUANTITY } from '@shared/schemas/pledge-values';
import type { PledgeCreate, PledgeView } from '@shared/schemas/pledge';
import { lazyZodResolver } from '@/lib/lazy-zod-resolver';
import { sizeCategoryRow } from '@shared/guidelines/size-categories';
import { capitalise } from '@shared/guidelines/wording';
import { useCreatePledge } from '../api/create-pledge';

export interface PledgeTarget {
  needId: number;
  sizeCategory: SizeCategory;
  deadline: string;
  recipientName: string;
  stillWanted: number;
}

interface Props {
  /** The need pledged against; null for "wherever it's needed most". */
  target: PledgeTarget | null;
  onDone?: (pledge: PledgeView) => void;
  /** Called after any change, so the page can refresh what a pledge affects. */
  onChanged?: () => void;
  onCancel?: () => void;
}

const FIELDS = ['needId', 'quantity', 'sizeCategory', 'dueDate'] as const;

const resolver = lazyZodResolver<PledgeCreate>(() => import('@shared/schemas/pledge').then((m) => m.PledgeCreateSchema));

/** "I'll make N by this day": quantity and date, and the size when no need is chosen. */
export function PledgeForm({ target, onDone, onChanged, onCancel }: Props) {
  const create = useCreatePledge(onChanged);
  const today = useDriveToday();
  const fourWeeks = isoDayFrom(today, 28);
  const { register, handleSubmit, formState, setError, setFocus } = useForm<PledgeCreate>({
    resolver,
    defaultValues: {
      needId: target?.needId ?? null,
      quantity: 1,
      sizeCategory: target?.sizeCategory ?? 'lap',
      dueDate: target && target.deadline < fourWeeks ? target.deadline : fourWeeks,
    },
  });
  // Opened from a card's button, the form takes the focus: otherwise a keyboard or screen-reader
  // user is left on the page body, far from what just appeared.
  useEffect(() => setFocus('quantity'), [setFocus]);
  const onSubmit = handleSubmit((values) =>
    create.mutate(values, {
      onSuccess: (p) => onDone?.(p),
      onError: (err) => applyServerErrors(err, setError, FIELDS),
    }),
  );
  const e = formState.errors;
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4" aria-label={target ? `Pledge for ${target.recipientName}` : 'Pledge wherever it is needed most'}>
      {create.error && !Object.keys(e).length && <Alert kind="error">{create.error.message}</Alert>}
      {target && (
        <p>
          <span className="font-bold">Size:</span> {capitalise(sizeCategoryRow(target.sizeCategory).label)}, as this need asks
        </p>
      )}
      <div className="grid gap-4 sm:grid-cols-2">
        <Field label="How many" hint={target ? `${target.stillWanted} still wanted` : `Up to ${MAX_PLEDGE_QUANTITY}`} error={e.quantity?.message}>
          {({ id, describedBy, invalid }) => (
            <Input id={id} type="number" inputMode="numeric" min={1} max={MAX_PLEDGE_QUANTITY} aria-describedby={describedBy} aria-invalid={invalid} {...register('quantity', { valueAsNumber: true })} />
          )}
        </Field>
        {!target && (
          <Field label="Size" hint="Any recipient that takes this size" error={e.sizeCategory?.message}>
            {({ id, describedBy, invalid }) => (
              <Select id={id} aria-describedby={describedBy} aria-invalid={invalid} {...register('sizeCategory')}>
                {SIZE_CATEGORIES.map((c) => (
                  <option key={c} value={c}>
                    {capitalise(sizeCategoryRow(c).label)}
                  </option>
                ))}
              </Select>
            )}
          </Field>
        )}
        <Field label="I'll finish by" hint={target ? `Needed by ${formatDay(target.deadline)}` : 'A day you can keep to'} error={e.dueDate?.message}>
          {({ id, describedBy, invalid }) => (
            <Input id={id} type="date" min={today} max={target?.deadline} aria-describedby={describedBy} aria-invalid={invalid} {...register('dueDate')} />
          )}
        </Field>
      </div>
      {e.needId && <Alert kind="error">{e.needId.message}</Alert>}
      <div className="flex flex-wrap gap-2">
        <Button type="submit" busy={create.isPending}>
          Pledge
        </Button>
        {onCancel && (
          <Button variant="quiet" onClick={onCancel}>
            Never mind
          </Button>
        )}
      </div>
    </form>
  );
}
