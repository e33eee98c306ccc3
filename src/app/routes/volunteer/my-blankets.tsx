import { useMemo, useState } from 'react';
import { Layers, Plus, Printer } from 'lucide-react';
import { PageHeader } from '@/components/ui/page-header';
import { ButtonLink } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { BlanketsTable, type Choosing } from '@/features/blankets/components/blankets-table';
import { MAX_TAGS_PER_SHEET } from '@shared/schemas/intake-values';

/** "My blankets": every blanket I have logged, where each one is up to, and its tag code. */
export default function MyBlanketsPage() {
  const [chosen, setChosen] = useState<ReadonlySet<number>>(new Set());
  const choosing = useMemo<Choosing>(
    () => ({
      chosen,
      purpose: 'to print its tag',
      toggle: (id) =>
        setChosen((prev) => {
          const next = new Set(prev);
          if (next.has(id)) next.delete(id);
          else if (next.size < MAX_TAGS_PER_SHEET) next.add(id);
          return next;
        }),
    }),
    [chosen],
  );
  const n = chosen.size;
  return (
    <div className="space-y-6">
      <PageHeader
        title="My blankets"
        lead="Each blanket with the code on its tag and how far it has come, from your hook to the people it keeps warm."
        actions={
          <ButtonLink to="/blankets/new">
            <Plus className="size-5" aria-hidden /> Log a blanket
          </ButtonLink>
        }
      />
      <div className="flex flex-wrap items-center gap-3 rounded-2xl bg-oat-100 p-4" data-testid="print-tags-bar">
        <p className="flex-1 basis-60">
          {n === 0 ? 'Tick the blankets whose tags you want to print, then print them on one sheet.' : `${n} blanket${n === 1 ? '' : 's'} chosen.`}
        </p>
        {n > 0 ? (
          <ButtonLink to={`/tags?ids=${[...chosen].join(',')}`} variant="secondary">
            <Printer className="size-5" aria-hidden /> {n === 1 ? 'Print its tag' : `Print their ${n} tags`}
          </ButtonLink>
        ) : null}
      </div>
      <BlanketsTable
        mine
        choosing={choosing}
        empty={
          <EmptyState icon={Layers} title="No blankets logged yet" action={<ButtonLink to="/blankets/new">Log a blanket</ButtonLink>}>
            Log a blanket when you start it or when it is finished; you can correct the details until you hand it in.
          </EmptyState>
        }
      />
    </div>
  );
}
