import { useState, type FormEvent } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { BookmarkPlus, FolderOpen, Trash2 } from 'lucide-react';
import { Card, CardTitle } from '@/components/ui/card';
import { Field, Input } from '@/components/ui/field';
import { Button } from '@/components/ui/button';
import { Alert } from '@/components/ui/alert';
import { EmptyState } from '@/components/ui/empty-state';
import { Loading } from '@/components/ui/spinner';
import { QueryError } from '@/components/ui/query-error';
import { ApiError } from '@/lib/api-client';
import type { PlanInput, PlanInputDraft, PlanListItem } from '@shared/schemas/plan';
import { usePlans } from '../api/get-plans';
import { planQueryOptions } from '../api/get-plan';
import { useCreatePlan } from '../api/create-plan';
import { useDeletePlan } from '../api/delete-plan';
import { formatDay } from '@/components/ui/format-day';

interface Props {
  input: PlanInputDraft | null;
  suggestedName: string;
  onLoad: (input: PlanInput, name: string) => void;
}

/** Saving the plan on screen, and the maker's saved plans to load or delete. */
export function SignedInPlans({ input, suggestedName, onLoad }: Props) {
  const [name, setName] = useState('');
  const [saved, setSaved] = useState<string | null>(null);
  const [loadError, setLoadError] = useState<string | null>(null);
  const plans = usePlans(true);
  const create = useCreatePlan();
  const remove = useDeletePlan();
  const qc = useQueryClient();
  const nameError = create.error instanceof ApiError ? create.error.issues.find((i) => i.path === 'name')?.message : undefined;

  function submit(e: FormEvent) {
    e.preventDefault();
    if (!input) return;
    const finalName = name.trim() || suggestedName;
    create.mutate(
      { name: finalName, input },
      {
        onSuccess: (plan) => {
          setSaved(plan.name);
          setName('');
        },
      },
    );
  }

  async function load(p: PlanListItem) {
    setLoadError(null);
    try {
      const plan = await qc.fetchQuery(planQueryOptions(p.id));
      onLoad(plan.input, plan.name);
    } catch (err) {
      setLoadError(err instanceof Error ? err.message : 'We could not open that plan');
    }
  }

  function confirmDelete(p: PlanListItem) {
    const linked = p.blankets > 0 ? ` ${p.blankets} logged blanket${p.blankets === 1 ? '' : 's'} will no longer link to it.` : '';
    if (window.confirm(`Delete the plan "${p.name}"?${linked}`)) remove.mutate(p.id);
  }

  return (
    <div className="no-print space-y-6">
      <Card>
        <CardTitle>Save this plan</CardTitle>
        <form onSubmit={submit} className="space-y-4" noValidate>
          <Field label="Name for this plan" hint={`Leave empty to use "${suggestedName}"`} error={nameError}>
            {({ id, describedBy, invalid }) => (
              <Input id={id} value={name} maxLength={120} placeholder={suggestedName} aria-describedby={describedBy} aria-invalid={invalid} onChange={(e) => setName(e.target.value)} />
            )}
          </Field>
          {!input && <Alert kind="warning">Fix the stitches and rows above first: a plan needs both.</Alert>}
          {create.error && !nameError && <Alert kind="error">{create.error.message}</Alert>}
          {saved && !create.isPending && (
            <Alert kind="success" title="Saved">
              "{saved}" is in your plans below. You can attach it to the blanket when you log it.
            </Alert>
          )}
          <Button type="submit" busy={create.isPending} disabled={!input}>
            <BookmarkPlus className="size-5" aria-hidden /> Save plan
          </Button>
        </form>
      </Card>

      <Card>
        <CardTitle>Your saved plans</CardTitle>
        {loadError && <Alert kind="error" className="mb-4">{loadError}</Alert>}
        {remove.error && <Alert kind="error" className="mb-4">{remove.error.message}</Alert>}
        {plans.isPending ? (
          <Loading />
        ) : plans.error ? (
          <QueryError error={plans.error} />
        ) : plans.data.length === 0 ? (
          <EmptyState icon={FolderOpen} title="No saved plans yet">
            Plans you save appear here, ready to load again or to attach to a blanket.
          </EmptyState>
        ) : (
          <ul className="divide-y divide-oat-200" data-testid="saved-plans">
            {plans.data.map((p) => (
              <li key={p.id} className="flex flex-wrap items-center justify-between gap-3 py-3">
                <div className="min-w-0">
                  <p className="font-bold">{p.name}</p>
                  <p className="text-ink-soft">{p.summary.text}</p>
                  <p className="text-sm text-ink-soft">
                    Saved {formatDay(p.updatedAt)}
                    {p.blankets > 0 ? ` · attached to ${p.blankets} blanket${p.blankets === 1 ? '' : 's'}` : ''}
                  </p>
                </div>
                <div className="flex gap-2">
                  <Button size="sm" variant="secondary" onClick={() => void load(p)} aria-label={`Load ${p.name}`}>
                    <FolderOpen className="size-4" aria-hidden /> Load
                  </Button>
                  <Button size="sm" variant="quiet" onClick={() => confirmDelete(p)} aria-label={`Delete ${p.name}`} disabled={remove.isPending}>
                    <Trash2 className="size-4" aria-hidden /> Delete
                  </Button>
                </div>
              </li>
            ))}
          </ul>
        )}
      </Card>
    </div>
  );
}
