import { Layers, ScanLine } from 'lucide-react';
import { PageHeader } from '@/components/ui/page-header';
import { ButtonLink } from '@/components/ui/button';
import { Loading } from '@/components/ui/spinner';
import { QueryError } from '@/components/ui/query-error';
import { EmptyState } from '@/components/ui/empty-state';
import { useAllBlankets } from '@/features/blankets/api/get-all-blankets';
import { BlanketsTable } from '@/features/blankets/components/blankets-table';

/** Every blanket of the drive, for the organisers and the coordinator: find one, see where it is up to. */
export default function AllBlanketsPage() {
  const blankets = useAllBlankets();
  return (
    <div className="space-y-6">
      <PageHeader
        title="All blankets"
        lead="Every blanket the makers have logged, with where each one is up to. Filter by status to see what is on its way in or waiting to be packed."
        actions={
          <ButtonLink to="/organiser/intake" variant="secondary">
            <ScanLine className="size-5" aria-hidden /> Intake
          </ButtonLink>
        }
      />
      {blankets.isPending && <Loading />}
      {blankets.error && <QueryError error={blankets.error} />}
      {blankets.data &&
        (blankets.data.length === 0 ? (
          <EmptyState icon={Layers} title="No blankets logged yet">
            Blankets appear here as soon as makers log them, long before they reach a drop-off point.
          </EmptyState>
        ) : (
          <BlanketsTable blankets={blankets.data} showMaker />
        ))}
    </div>
  );
}
