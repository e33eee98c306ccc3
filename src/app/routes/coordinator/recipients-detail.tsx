import { useState } from 'react';
import { Link, useParams } from 'react-router-dom';
import { ArrowLeft } from 'lucide-react';
import { PageHeader } from '@/components/ui/page-header';
import { Card, CardTitle } from '@/components/ui/card';
import { Badge } from '@/components/ui/badge';
import { Loading } from '@/components/ui/spinner';
import { QueryError } from '@/components/ui/query-error';
import { Alert } from '@/components/ui/alert';
import { Cautions } from '@/components/ui/cautions';
import { cn } from '@/components/ui/cn';
import { useRecipient } from '@/features/recipients/api/get-recipient';
import { useUpdateRecipient } from '@/features/recipients/api/update-recipient';
import { usePutGuidelines } from '@/features/recipients/api/put-guidelines';
import { RecipientForm } from '@/features/recipients/components/recipient-form';
import { GuidelineEditor } from '@/features/recipients/components/guideline-editor';
import { NeedsEditor } from '@/features/recipients/components/needs-editor';
import { POPULATION_LABELS } from '@shared/schemas/blanket-values';
import { RECIPIENT_KIND_LABELS } from '@shared/schemas/recipient-values';
import { cautionsFor } from '@shared/guidelines/cautions';

const TABS = [
  ['needs', 'Needs'],
  ['guidelines', 'Guidelines'],
  ['details', 'Details and map'],
] as const;
type Tab = (typeof TABS)[number][0];

export default function RecipientDetailPage() {
  const id = Number(useParams().id);
  const { data: r, isPending, error } = useRecipient(id);
  const update = useUpdateRecipient();
  const put = usePutGuidelines();
  const [tab, setTab] = useState<Tab>('needs');

  if (isPending) return <Loading />;
  if (error) return <QueryError error={error} />;

  return (
    <div>
      <Link to="/recipients" className="no-print mb-3 inline-flex items-center gap-1">
        <ArrowLeft className="size-4" aria-hidden /> All recipients
      </Link>
      <PageHeader
        title={r.name}
        lead={
          <span className="flex flex-wrap items-center gap-2">
            <Badge tone="heather">{RECIPIENT_KIND_LABELS[r.kind]}</Badge>
            <Badge>{POPULATION_LABELS[r.population]}</Badge>
            {!r.active && <Badge tone="brick">Archived</Badge>}
            <span>{r.address}</span>
          </span>
        }
      />
      <Cautions cautions={cautionsFor(r.population)} className="mb-6" />
      <div role="tablist" aria-label="Recipient" className="mb-4 flex flex-wrap gap-2 border-b-2 border-oat-200">
        {TABS.map(([key, label]) => (
          <button
            key={key}
            role="tab"
            type="button"
            aria-selected={tab === key}
            aria-controls={`panel-${key}`}
            id={`tab-${key}`}
            onClick={() => setTab(key)}
            className={cn('-mb-0.5 rounded-t-xl border-b-4 px-4 py-2 font-bold', tab === key ? 'border-heather-700 text-heather-800' : 'border-transparent text-ink-soft hover:text-ink')}
          >
            {label}
          </button>
        ))}
      </div>
      <Card role="tabpanel" id={`panel-${tab}`} aria-labelledby={`tab-${tab}`}>
        {tab === 'needs' && (
          <>
            <CardTitle>What {r.name} needs</CardTitle>
            <NeedsEditor recipientId={r.id} needs={r.needs} />
          </>
        )}
        {tab === 'guidelines' && (
          <>
            <CardTitle>Guidelines</CardTitle>
            <GuidelineEditor
              key={r.version}
              guidelines={r.guidelines}
              busy={put.isPending}
              error={put.error}
              saved={put.isSuccess}
              onSave={(guidelines) => put.mutate({ id: r.id, guidelines, version: r.version })}
            />
          </>
        )}
        {tab === 'details' && (
          <>
            <CardTitle>Details</CardTitle>
            {update.isSuccess && <Alert kind="success" className="mb-4">Saved.</Alert>}
            <RecipientForm
              key={r.version}
              initial={r}
              submitLabel="Save the details"
              busy={update.isPending}
              error={update.error}
              onSubmit={(input) => update.mutate({ id: r.id, ...input, version: r.version })}
            />
          </>
        )}
      </Card>
    </div>
  );
}
