import { Layers, Plus } from 'lucide-react';
import { PageHeader } from '@/components/ui/page-header';
import { ButtonLink } from '@/components/ui/button';
import { Loading } from '@/components/ui/spinner';
import { QueryError } from '@/components/ui/query-error';
import { EmptyState } from '@/components/ui/empty-state';
import { useMyBlankets } from '@/features/blankets/api/get-blankets';
import { BlanketsTable } from '@/features/blankets/components/blankets-table';

/** "My blankets": every blanket I have logged, where each one is up to, and its tag code. */
export default function MyBlanketsPage() {
  const blankets = useMyBlankets();
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
      {blankets.isPending && <Loading />}
      {blankets.error && <QueryError error={blankets.error} />}
      {blankets.data &&
        (blankets.data.length === 0 ? (
          <EmptyState icon={Layers} title="No blankets logged yet" action={<ButtonLink to="/blankets/new">Log a blanket</ButtonLink>}>
            Log a blanket when you start it or when it is finished; you can correct the details until you hand it in.
          </EmptyState>
        ) : (
          <BlanketsTable blankets={blankets.data} />
        ))}
    </div>
  );
}
