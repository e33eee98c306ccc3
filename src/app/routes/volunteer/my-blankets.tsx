import { Layers, Plus } from 'lucide-react';
import { PageHeader } from '@/components/ui/page-header';
import { ButtonLink } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { BlanketsTable } from '@/features/blankets/components/blankets-table';

/** "My blankets": every blanket I have logged, where each one is up to, and its tag code. */
export default function MyBlanketsPage() {
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
      <BlanketsTable
        mine
        empty={
          <EmptyState icon={Layers} title="No blankets logged yet" action={<ButtonLink to="/blankets/new">Log a blanket</ButtonLink>}>
            Log a blanket when you start it or when it is finished; you can correct the details until you hand it in.
          </EmptyState>
        }
      />
    </div>
  );
}
