import { useState } from 'react';
import { useSearchParams } from 'react-router-dom';
import { ChevronLeft, ChevronRight, HandHeart, Inbox, Sparkles } from 'lucide-react';
import { PageHeader } from '@/components/ui/page-header';
import { Card } from '@/components/ui/card';
import { Button } from '@/components/ui/button';
import { Field, Select } from '@/components/ui/field';
import { Loading } from '@/components/ui/spinner';
import { QueryError } from '@/components/ui/query-error';
import { EmptyState } from '@/components/ui/empty-state';
import { Alert } from '@/components/ui/alert';
import { useBoardChoices } from '@/features/assignments/api/get-board-choices';
import { useBoardNeeds } from '@/features/assignments/api/get-board-needs';
import { useWaitingBlankets } from '@/features/assignments/api/get-waiting-blankets';
import { useAssignBatch } from '@/features/assignments/api/assign-blankets';
import { useSuggestAssignments } from '@/features/assignments/api/suggest-assignments';
import type { BoardFilters } from '@/features/assignments/api/keys';
import { NeedCard } from '@/features/assignments/components/need-card';
import { WaitingBlanketRow } from '@/features/assignments/components/waiting-blanket-row';
import { SuggestionReview } from '@/features/assignments/components/suggestion-review';
import { needLabel, sizeText } from '@/features/assignments/components/words';
import { SIZE_CATEGORIES } from '@shared/schemas/blanket-values';
import type { SizeCategory } from '@shared/schemas/blanket';
import { pageCount } from '@shared/schemas/page';

const num = (v: string | null) => (v ? Number(v) || undefined : undefined);

export default function AssignBoardPage() {
  const [params, setParams] = useSearchParams();
  const filters: BoardFilters = {
    siteId: num(params.get('siteId')),
    recipientId: num(params.get('recipientId')),
    sizeCategory: (SIZE_CATEGORIES as readonly string[]).includes(params.get('size') ?? '') ? (params.get('size') as SizeCategory) : undefined,
  };
  const page = num(params.get('page')) ?? 1;
  const setFilter = (key: string, value: string) => {
    const next = new URLSearchParams(params);
    if (value) next.set(key, value);
    else next.delete(key);
    next.delete('page');
    setParams(next);
  };
  const setPage = (p: number) => {
    const next = new URLSearchParams(params);
    next.set('page', String(p));
    setParams(next);
  };

  const choices = useBoardChoices();
  const needs = useBoardNeeds(filters);
  const waiting = useWaitingBlankets(filters, page);
  const suggest = useSuggestAssignments();
  const batch = useAssignBatch();
  const [selected, setSelected] = useState<Set<number>>(new Set());
  const [batchNeed, setBatchNeed] = useState('');

  const allNeeds = needs.data ?? [];
  const openNeeds = allNeeds.filter((n) => n.open > 0);
  const select = (id: number, on: boolean) =>
    setSelected((s) => {
      const next = new Set(s);
      if (on) next.add(id);
      else next.delete(id);
      return next;
    });
  const assignSelected = () =>
    batch.mutate(
      { source: 'board', pairs: [...selected].map((blanketId) => ({ blanketId, needId: Number(batchNeed) })) },
      { onSuccess: (r) => setSelected(new Set(r.outcomes.filter((o) => !o.ok).map((o) => o.blanketId))) },
    );

  return (
    <div className="space-y-6">
      <PageHeader
        title="Assignment board"
        lead="Choose where each checked blanket goes: open needs on one side, blankets waiting on the other. Or ask for a suggestion for the whole drive and review it before anything changes."
        actions={
          <Button
            size="lg"
            busy={suggest.isPending}
            onClick={() => suggest.mutate({ siteId: filters.siteId, recipientId: filters.recipientId })}
          >
            <Sparkles className="size-5" aria-hidden /> Suggest assignments
          </Button>
        }
      />

      <Card>
        <div className="grid gap-4 sm:grid-cols-3">
          <Field label="Drop-off site">
            {(f) => (
              <Select id={f.id} value={filters.siteId ?? ''} onChange={(e) => setFilter('siteId', e.target.value)}>
                <option value="">All sites</option>
                {(choices.data?.sites ?? []).map((s) => (
                  <option key={s.id} value={s.id}>
                    {s.name}
                  </option>
                ))}
              </Select>
            )}
          </Field>
          <Field label="Recipient">
            {(f) => (
              <Select id={f.id} value={filters.recipientId ?? ''} onChange={(e) => setFilter('recipientId', e.target.value)}>
                <option value="">All recipients</option>
                {(choices.data?.recipients ?? []).map((r) => (
                  <option key={r.id} value={r.id}>
                    {r.name}
                  </option>
                ))}
              </Select>
            )}
          </Field>
          <Field label="Size">
            {(f) => (
              <Select id={f.id} value={filters.sizeCategory ?? ''} onChange={(e) => setFilter('size', e.target.value)}>
                <option value="">All sizes</option>
                {SIZE_CATEGORIES.map((c) => (
                  <option key={c} value={c}>
                    {sizeText(c)}
                  </option>
                ))}
              </Select>
            )}
          </Field>
        </div>
      </Card>

      <nav aria-label="On this page" className="flex flex-wrap gap-4 lg:hidden">
        <a href="#needs-title">Open needs</a>
        <a href="#waiting-title">Checked and waiting{waiting.data ? ` (${waiting.data.total})` : ''}</a>
      </nav>

      {suggest.error && <Alert kind="error">{suggest.error.message}</Alert>}
      {suggest.data && <SuggestionReview key={JSON.stringify(suggest.data.pairs.map((p) => p.blanketId))} suggestion={suggest.data} onClose={() => suggest.reset()} />}

      <div className="grid items-start gap-6 lg:grid-cols-2">
        <section aria-labelledby="needs-title" className="space-y-4">
          <h2 id="needs-title" className="scroll-mt-4 text-2xl font-bold">
            Open needs <span className="font-normal text-ink-soft">({openNeeds.length} of {allNeeds.length} still open)</span>
          </h2>
          {needs.isPending ? (
            <Loading />
          ) : needs.isError ? (
            <QueryError error={needs.error} />
          ) : allNeeds.length === 0 ? (
            <EmptyState icon={HandHeart} title="No needs here">
              No active recipient has a need that matches these filters. Add needs on the recipients page.
            </EmptyState>
          ) : (
            allNeeds.map((n) => <NeedCard key={n.needId} need={n} needs={allNeeds} />)
          )}
        </section>

        <section aria-labelledby="waiting-title" className="space-y-4">
          <h2 id="waiting-title" className="scroll-mt-4 text-2xl font-bold">
            Checked and waiting <span className="font-normal text-ink-soft">({waiting.data?.total ?? 0})</span>
          </h2>
          {waiting.isPending ? (
            <Loading />
          ) : waiting.isError ? (
            <QueryError error={waiting.error} />
          ) : waiting.data.total === 0 ? (
            <EmptyState icon={Inbox} title="No blankets waiting">
              Every checked blanket that matches these filters has a recipient. New ones appear here once they pass the check at intake.
            </EmptyState>
          ) : (
            <Card>
              {selected.size > 0 && (
                <div className="mb-3 flex flex-wrap items-end gap-2 rounded-xl bg-heather-50 p-3">
                  <Field label={`Assign the ${selected.size} selected to`} className="min-w-0 flex-1 basis-64">
                    {(f) => (
                      <Select id={f.id} value={batchNeed} onChange={(e) => setBatchNeed(e.target.value)}>
                        <option value="">Choose a need…</option>
                        {openNeeds.map((n) => (
                          <option key={n.needId} value={n.needId}>
                            {needLabel(n)} ({n.open} open)
                          </option>
                        ))}
                      </Select>
                    )}
                  </Field>
                  <Button disabled={!batchNeed} busy={batch.isPending} onClick={assignSelected}>
                    Assign selected
                  </Button>
                </div>
              )}
              {batch.data && batch.data.conflicts > 0 && (
                <Alert kind="warning" title={`${batch.data.applied} assigned, ${batch.data.conflicts} not`} className="mb-3">
                  <ul className="list-disc pl-5">
                    {batch.data.outcomes
                      .filter((o) => !o.ok)
                      .map((o) => (
                        <li key={o.blanketId}>{o.message}</li>
                      ))}
                  </ul>
                </Alert>
              )}
              <ul className="divide-y divide-oat-200">
                {waiting.data.items.map((b) => (
                  <WaitingBlanketRow key={b.id} b={b} needs={allNeeds} selected={selected.has(b.id)} onSelect={(on) => select(b.id, on)} />
                ))}
              </ul>
              {pageCount(waiting.data) > 1 && (
                <nav aria-label="Pages of waiting blankets" className="mt-3 flex flex-wrap items-center justify-between gap-3">
                  <Button size="sm" variant="secondary" onClick={() => setPage(page - 1)} disabled={page <= 1}>
                    <ChevronLeft className="size-4" aria-hidden /> Previous
                  </Button>
                  <span>
                    Page {page} of {pageCount(waiting.data)}
                  </span>
                  <Button size="sm" variant="secondary" onClick={() => setPage(page + 1)} disabled={page >= pageCount(waiting.data)}>
                    Next <ChevronRight className="size-4" aria-hidden />
                  </Button>
                </nav>
              )}
            </Card>
          )}
        </section>
      </div>
    </div>
  );
}
