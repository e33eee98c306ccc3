import { useState } from 'react';
import { Link } from 'react-router-dom';
import { HeartHandshake, Plus } from 'lucide-react';
import { PageHeader } from '@/components/ui/page-header';
import { Card } from '@/components/ui/card';
import { Badge } from '@/components/ui/badge';
import { ButtonLink } from '@/components/ui/button';
import { Select } from '@/components/ui/field';
import { Loading } from '@/components/ui/spinner';
import { QueryError } from '@/components/ui/query-error';
import { EmptyState } from '@/components/ui/empty-state';
import { DEMO_TOWN_CENTRE, PinMap } from '@/components/ui/pin-map';
import { useRecipients } from '@/features/recipients/api/get-recipients';
import { POPULATION_LABELS } from '@shared/schemas/blanket-values';
import { RECIPIENT_KIND_LABELS } from '@shared/schemas/recipient-values';
import { cautionsFor } from '@shared/guidelines/cautions';

export default function RecipientsPage() {
  const [active, setActive] = useState<'true' | 'false' | 'all'>('true');
  const { data, isPending, error } = useRecipients(active);
  const policy = cautionsFor('adult').find((c) => c.id === 'facility-policy')!;
  return (
    <div>
      <PageHeader
        title="Recipients"
        lead="The places the drive collects for, what each one needs, and the guidelines every blanket is checked against."
        actions={
          <ButtonLink to="/recipients/new">
            <Plus className="size-5" aria-hidden /> Add a recipient
          </ButtonLink>
        }
      />
      <div className="mb-4 flex flex-wrap items-center gap-3">
        <label htmlFor="recipient-filter" className="font-bold">
          Show
        </label>
        <div className="w-64">
        <Select id="recipient-filter" value={active} onChange={(e) => setActive(e.target.value as typeof active)}>
          <option value="true">Collecting now</option>
          <option value="false">Archived</option>
          <option value="all">All recipients</option>
        </Select>
        </div>
      </div>
      {isPending ? (
        <Loading />
      ) : error ? (
        <QueryError error={error} />
      ) : data.length === 0 ? (
        <EmptyState icon={HeartHandshake} title="No recipients here" action={<ButtonLink to="/recipients/new">Add a recipient</ButtonLink>}>
          Add the first place the drive collects for: a newborn unit, a shelter, a care home.
        </EmptyState>
      ) : (
        <div className="space-y-6">
          <PinMap
            label="Map of the recipients"
            fallbackCentre={DEMO_TOWN_CENTRE}
            pins={data.filter((r) => r.lat !== null && r.lng !== null).map((r) => ({ id: r.id, lat: r.lat!, lng: r.lng!, label: r.name }))}
          />
          <ul className="grid gap-4 md:grid-cols-2">
            {data.map((r) => {
              const wanted = r.needs.reduce((s, n) => s + n.quantity, 0);
              const pledged = r.needs.reduce((s, n) => s + n.pledged, 0);
              return (
                <li key={r.id}>
                  <Card className="h-full">
                    <div className="mb-2 flex flex-wrap items-center gap-2">
                      <Badge tone="heather">{RECIPIENT_KIND_LABELS[r.kind]}</Badge>
                      <Badge>{POPULATION_LABELS[r.population]}</Badge>
                      {!r.active && <Badge tone="brick">Archived</Badge>}
                    </div>
                    <h2 className="text-xl font-bold">
                      <Link to={`/recipients/${r.id}`}>{r.name}</Link>
                    </h2>
                    <p className="text-ink-soft">{r.address}</p>
                    <p className="mt-2">
                      <strong>{wanted}</strong> blankets wanted across {r.needs.length} need{r.needs.length === 1 ? '' : 's'}, <strong>{pledged}</strong> pledged
                    </p>
                    <ul className="mt-2 list-disc pl-5 text-sm text-ink-soft">
                      {r.guidelineSummary.slice(0, 3).map((line) => (
                        <li key={line}>{line}</li>
                      ))}
                    </ul>
                  </Card>
                </li>
              );
            })}
          </ul>
          <p className="text-ink-soft">{policy.text}</p>
        </div>
      )}
    </div>
  );
}
