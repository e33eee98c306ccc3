import { Layers, ScanLine } from 'lucide-react';
import { PageHeader } from '@/components/ui/page-header';
import { ButtonLink } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { BlanketsTable } from '@/features/blankets/components/blankets-table';

/** Every blanket of the drive, for the organisers and the coordinator: find one, see where it is up to. */
export default function AllBlanketsPage() {
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
      <BlanketsTable
        mine={false}
        showMaker
        empty={
          <EmptyState icon={Layers} title="No blankets logged yet">
            Blankets appear here as soon as makers log them, long before they reach a drop-off point.
          </EmptyState>
        }
      />
    </div>
  );
}
