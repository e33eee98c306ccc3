import { useState } from 'react';
import { Pencil, Plus, Trash2 } from 'lucide-react';
import { Button } from '@/components/ui/button';
import { Field, Input, Select } from '@/components/ui/field';
import { Alert } from '@/components/ui/alert';
import { ProgressBar } from '@/components/ui/progress-bar';
import { EmptyState } from '@/components/ui/empty-state';
import { sizeCategoryRow } from '@shared/guidelines/size-categories';
import { formatCm, formatIn } from '@shared/guidelines/wording';
import { SIZE_CATEGORIES } from '@shared/schemas/blanket-values';
import type { SizeCategory } from '@shared/schemas/blanket';
import type { NeedView } from '@shared/schemas/recipient';
import { preload } from '@/lib/lazy-zod-resolver';
import { useSaveNeed } from '../api/save-need';
import { useDeleteNeed } from '../api/delete-need';
import { fieldErrors, zodErrors } from './field-errors';
import { formatDay } from '@/components/ui/format-day';

const needSchema = preload(() => import('@shared/schemas/recipient').then((m) => m.NeedCreateSchema));

function sizeWords(c: SizeCategory) {
  const row = sizeCategoryRow(c);
  const n = row.nominalCm;
  return `${row.label}, about ${formatCm(Math.round(n.width))} × ${formatCm(Math.round(n.length))} cm (${formatIn(n.width)} × ${formatIn(n.length)} in)`;
}

interface Draft {
  sizeCategory: SizeCategory;
  quantity: string;
  deadline: string;
  preferences: string;
}

function NeedForm({ recipientId, need, onDone }: { recipientId: number; need?: NeedView; onDone: () => void }) {
  const save = useSaveNeed();
  const [d, setD] = useState<Draft>({
    sizeCategory: need?.sizeCategory ?? 'baby',
    quantity: need ? String(need.quantity) : '10',
    deadline: need?.deadline ?? '',
    preferences: need?.preferences ?? '',
  });
  const [local, setLocal] = useState<Record<string, string>>({});
  const errors = { ...fieldErrors(save.error), ...local };
  return (
    <form
      noValidate
      className="grid gap-3 rounded-xl border-2 border-heather-300 bg-heather-50 p-4 sm:grid-cols-4"
      onSubmit={async (e) => {
        e.preventDefault();
        const body = { sizeCategory: d.sizeCategory, quantity: Number(d.quantity), deadline: d.deadline, preferences: d.preferences };
        const parsed = (await needSchema()).safeParse(body);
        if (!parsed.success) return setLocal(zodErrors(parsed.error.issues));
        setLocal({});
        save.mutate({ recipientId, needId: need?.id, need: parsed.data, version: need?.version }, { onSuccess: onDone });
      }}
    >
      {save.error && <Alert kind="error" className="sm:col-span-4">{save.error.message}</Alert>}
      <Field label="Size" error={errors.sizeCategory}>
        {(a) => (
          <Select id={a.id} value={d.sizeCategory} onChange={(e) => setD({ ...d, sizeCategory: e.target.value as SizeCategory })}>
            {SIZE_CATEGORIES.map((c) => (
              <option key={c} value={c}>
                {sizeCategoryRow(c).label}
              </option>
            ))}
          </Select>
        )}
      </Field>
      <Field label="How many" error={errors.quantity}>
        {(a) => <Input id={a.id} inputMode="numeric" aria-invalid={a.invalid} aria-describedby={a.describedBy} value={d.quantity} onChange={(e) => setD({ ...d, quantity: e.target.value })} />}
      </Field>
      <Field label="Wanted by" error={errors.deadline}>
        {(a) => <Input id={a.id} type="date" aria-invalid={a.invalid} aria-describedby={a.describedBy} value={d.deadline} onChange={(e) => setD({ ...d, deadline: e.target.value })} />}
      </Field>
      <Field label="Colours or style" error={errors.preferences}>
        {(a) => <Input id={a.id} aria-invalid={a.invalid} aria-describedby={a.describedBy} value={d.preferences} onChange={(e) => setD({ ...d, preferences: e.target.value })} />}
      </Field>
      <div className="flex gap-2 sm:col-span-4">
        <Button type="submit" busy={save.isPending}>
          {need ? 'Save the need' : 'Add the need'}
        </Button>
        <Button variant="quiet" onClick={onDone}>
          Cancel
        </Button>
      </div>
    </form>
  );
}

/** A recipient's wish list: what size, how many, by when, with how many are pledged so far. */
export function NeedsEditor({ recipientId, needs }: { recipientId: number; needs: NeedView[] }) {
  const [editing, setEditing] = useState<number | 'new' | null>(null);
  const remove = useDeleteNeed();
  return (
    <div className="space-y-4">
      {remove.error && <Alert kind="error">{remove.error.message}</Alert>}
      {needs.length === 0 && editing !== 'new' && (
        <EmptyState icon={Plus} title="No needs yet">
          Add what this recipient asked for, so makers can pledge against it.
        </EmptyState>
      )}
      <ul className="space-y-3">
        {needs.map((n) =>
          editing === n.id ? (
            <li key={n.id}>
              <NeedForm recipientId={recipientId} need={n} onDone={() => setEditing(null)} />
            </li>
          ) : (
            <li key={n.id} className="rounded-xl border border-oat-200 bg-white p-4">
              <div className="flex flex-wrap items-start justify-between gap-3">
                <div>
                  <p className="text-lg font-bold">
                    {n.quantity} × {sizeCategoryRow(n.sizeCategory).label} by {formatDay(n.deadline)}
                  </p>
                  <p className="text-sm text-ink-soft">{sizeWords(n.sizeCategory)}</p>
                  {n.preferences && <p className="mt-1">{n.preferences}</p>}
                </div>
                <div className="flex gap-1">
                  <Button size="sm" variant="quiet" onClick={() => setEditing(n.id)} aria-label={`Change the need for ${sizeCategoryRow(n.sizeCategory).label}s`}>
                    <Pencil className="size-4" aria-hidden /> Change
                  </Button>
                  <Button
                    size="sm"
                    variant="quiet"
                    busy={remove.isPending && remove.variables?.needId === n.id}
                    onClick={() => remove.mutate({ recipientId, needId: n.id })}
                    aria-label={`Remove the need for ${sizeCategoryRow(n.sizeCategory).label}s`}
                  >
                    <Trash2 className="size-4" aria-hidden /> Remove
                  </Button>
                </div>
              </div>
              <ProgressBar className="mt-3" value={n.quantity === 0 ? 0 : n.pledged / n.quantity} label={`Pledged ${n.pledged} of ${n.quantity}`} tone={n.pledged >= n.quantity ? 'moss' : 'heather'} />
              <p className="mt-1 text-sm text-ink-soft" data-testid="need-figures">
                {n.finished ?? 0} finished · {n.inHand ?? 0} with the organisers · {n.assigned ?? 0} assigned
              </p>
            </li>
          ),
        )}
      </ul>
      {editing === 'new' ? (
        <NeedForm recipientId={recipientId} onDone={() => setEditing(null)} />
      ) : (
        <Button variant="secondary" onClick={() => setEditing('new')}>
          <Plus className="size-4" aria-hidden /> Add a need
        </Button>
      )}
    </div>
  );
}
