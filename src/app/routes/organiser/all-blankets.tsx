import { useSearchParams } from 'react-router-dom';
import { Layers, ScanLine } from 'lucide-react';
import { PageHeader } from '@/components/ui/page-header';
import { ButtonLink } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { formatDay } from '@/components/ui/format-day';
import { BlanketsTable } from '@/features/blankets/components/blankets-table';
import { sizeLabel } from '@/features/blankets/components/labels';
import { useNeeds } from '@/features/needs/api/get-needs';
import { ListFilterNote, dayParam, idParam, lastDayBefore } from '@/features/progress/components/list-filter-note';
import { GLANCE_STEPS, STEP_LABELS, STEP_MEANS, type GlanceStep } from '@shared/drive/glance';

const asStep = (v: string | null): GlanceStep | undefined => (GLANCE_STEPS as readonly string[]).includes(v ?? '') ? (v as GlanceStep) : undefined;

/**
 * The filters the drive at a glance links here with, read from the address so a figure and its list
 * share a link: `step`, `needId`, and `reached` with `from`/`to`.
 */
function useGlanceFilters() {
  const [params] = useSearchParams();
  const reached = asStep(params.get('reached'));
  const from = dayParam(params.get('from'));
  const to = dayParam(params.get('to'));
  const window = reached && from && to ? { reached, from, to } : {};
  return { step: asStep(params.get('step')), needId: idParam(params.get('needId')), ...window };
}

function FilterNote({ f }: { f: ReturnType<typeof useGlanceFilters> }) {
  const needs = useNeeds();
  const need = f.needId ? needs.data?.find((n) => n.id === f.needId) : undefined;
  const parts: string[] = [];
  if (f.step) parts.push(`${STEP_LABELS[f.step].toLowerCase()} now: ${STEP_MEANS[f.step]}`);
  if (f.reached && f.from && f.to) {
    parts.push(`that reached “${STEP_LABELS[f.reached].toLowerCase()}” from ${formatDay(f.from)} to ${formatDay(lastDayBefore(f.to))}`);
  }
  if (f.needId) parts.push(need ? `for ${need.recipient.name}, ${sizeLabel(need.sizeCategory).toLowerCase()}` : 'for one need');
  return <ListFilterNote noun="blankets" parts={parts} allTo="/all-blankets" />;
}

/** Every blanket of the drive, for the organisers and the coordinator: find one, see where it is up to. */
export default function AllBlanketsPage() {
  const filters = useGlanceFilters();
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
      <FilterNote f={filters} />
      <BlanketsTable
        mine={false}
        showMaker
        fixed={filters}
        empty={
          <EmptyState icon={Layers} title="No blankets logged yet">
            Blankets appear here as soon as makers log them, long before they reach a drop-off point.
          </EmptyState>
        }
      />
    </div>
  );
}
