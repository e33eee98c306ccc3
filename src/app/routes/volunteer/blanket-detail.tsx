import { Link, useLocation, useParams } from 'react-router-dom';
import { useQueryClient } from '@tanstack/react-query';
import { CalendarClock, Pencil, Printer, Tag } from 'lucide-react';
import { PageHeader } from '@/components/ui/page-header';
import { Card, CardTitle } from '@/components/ui/card';
import { Alert } from '@/components/ui/alert';
import { ButtonLink } from '@/components/ui/button';
import { Loading } from '@/components/ui/spinner';
import { QueryError } from '@/components/ui/query-error';
import { formatDay } from '@/components/ui/format-day';
import { useMe } from '@/features/auth/api/get-me';
import { pledgeKeys } from '@/features/pledges/api/keys';
import { useSites } from '@/features/sites/api/get-sites';
import { useBlanket } from '@/features/blankets/api/get-blanket';
import { StatusTimeline } from '@/features/blankets/components/status-timeline';
import { StatusBadge } from '@/components/ui/status-badge';
import { StatusActions } from '@/features/blankets/components/status-actions';
import { SelfCheckPanel } from '@/features/blankets/components/self-check-panel';
import { PhotoGallery } from '@/features/blankets/components/photo-gallery';
import { BlanketHistory } from '@/components/ui/blanket-history';
import { InspectionFindings } from '@/features/blankets/components/inspection-findings';
import { BODY_STITCH_LABELS, NO_LIBRARY_BORDER, sizeLabel, yarnWeightLabel } from '@/features/blankets/components/labels';
import type { SelfCheck } from '@/features/blankets/hooks/use-self-check';
import type { BlanketDetail } from '@shared/schemas/blanket-log';
import { borderById } from '@shared/border/library';
import { capitalise, featureLabel, fibreLabel, formatCm, formatIn, joinWords } from '@shared/guidelines/wording';
import type { LoggedState } from './log-blanket';

function outcomeOf(b: BlanketDetail): SelfCheck {
  if (b.recipient && b.selfCheck) return { state: 'checked', recipient: b.recipient, result: b.selfCheck };
  return { state: 'anywhere', fits: b.fitsRecipients, nearly: [] };
}

/** What the self-check on this page read, where that differs from what the maker logged or found. */
function selfCheckNotes(b: BlanketDetail): string[] {
  const notes: string[] = [];
  if (b.measured) notes.push(`Checked with the size measured at the drop-off table: ${formatCm(b.measured.widthCm)} × ${formatCm(b.measured.lengthCm)} cm.`);
  if (b.inspection?.outcome === 'needs_fix') notes.push('The guidelines are only part of it: what the organisers found on the table is under “What to put right”.');
  return notes;
}

const yes = (v: boolean) => (v ? 'Yes' : 'No');

function Details({ b, isMaker }: { b: BlanketDetail; isMaker: boolean }) {
  const rows: Array<[string, string]> = [
    [b.measured ? 'Size as logged' : 'Size', `${formatCm(b.widthCm)} × ${formatCm(b.lengthCm)} cm (about ${formatIn(b.widthCm)} × ${formatIn(b.lengthCm)} in)`],
    ...(b.measured
      ? ([['Measured at the table', `${formatCm(b.measured.widthCm)} × ${formatCm(b.measured.lengthCm)} cm (about ${formatIn(b.measured.widthCm)} × ${formatIn(b.measured.lengthCm)} in)`]] as Array<[string, string]>)
      : []),
    ['Pledged as', sizeLabel(b.sizeCategory)],
    ['Yarn weight', yarnWeightLabel(b.yarnWeight)],
    ['Fibres', capitalise(joinWords(b.fibres.map(fibreLabel)))],
    ['New yarn', yes(b.newYarn)],
    ['Colours', b.colours || '—'],
    ['Body stitch', BODY_STITCH_LABELS[b.bodyStitch] ?? b.bodyStitch],
    ['Border', b.borderId ? (borderById(b.borderId)?.name ?? b.borderId) : NO_LIBRARY_BORDER],
    ['Trims', b.features.length ? capitalise(joinWords(b.features.map(featureLabel))) : 'None'],
    ['Machine washable', yes(b.machineWashable)],
    ['Dryer safe', yes(b.dryerSafe)],
    ['Smoke-free home', yes(b.smokeFree)],
    ['Pet-free home', yes(b.petFree)],
    ['Tag says', b.labelName === 'anonymous' ? 'Anonymous' : `${b.makerName.split(' ')[0]} (first name)`],
    ['Logged', formatDay(b.createdAt)],
  ];
  return (
    <dl className="grid gap-x-6 gap-y-2 sm:grid-cols-[max-content_1fr]">
      {rows.map(([k, v]) => (
        <div key={k} className="contents">
          <dt className="font-bold">{k}</dt>
          <dd className="mb-2 sm:mb-0">{v}</dd>
        </div>
      ))}
      {b.planId !== null && isMaker && (
        <div className="contents">
          <dt className="font-bold">Plan</dt>
          {/* Saved plans are the maker's own, so only the maker gets the link. */}
          <dd className="mb-2 sm:mb-0">
            <Link to={`/planner?plan=${b.planId}`}>Open the saved plan in the planner</Link>
          </dd>
        </div>
      )}
      {b.notes && (
        <div className="contents">
          <dt className="font-bold">Notes</dt>
          <dd className="whitespace-pre-line">{b.notes}</dd>
        </div>
      )}
    </dl>
  );
}

/** One blanket: its code, where it is up to, the self-check, photos, every detail and its history. */
export default function BlanketDetailPage() {
  const id = Number(useParams().id);
  const { data: user } = useMe();
  const blanket = useBlanket(id);
  const sites = useSites('true');
  const location = useLocation();
  const qc = useQueryClient();
  const state = (location.state ?? {}) as LoggedState;
  if (blanket.isPending || !user) return <Loading />;
  if (blanket.error) return <QueryError error={blanket.error} title="We could not find that blanket" />;
  const b = blanket.data;
  const isMaker = b.userId === user.id;
  return (
    <div className="space-y-6">
      <PageHeader
        title={`Blanket ${b.code}`}
        lead={
          <>
            {b.recipientName ? `For ${b.recipientName}` : 'Wherever it’s needed most'} · made by {isMaker ? 'you' : b.makerName}
          </>
        }
        actions={
          <>
            {b.editable && (
              <ButtonLink to={`/blankets/${b.id}/edit`} variant="secondary">
                <Pencil className="size-5" aria-hidden /> Correct the log
              </ButtonLink>
            )}
            {isMaker && (
              <ButtonLink to={`/tags?ids=${b.id}`} variant="secondary">
                <Printer className="size-5" aria-hidden /> Print its tag
              </ButtonLink>
            )}
            {isMaker && (
              <ButtonLink to="/blankets" variant="quiet">
                All my blankets
              </ButtonLink>
            )}
          </>
        }
      />
      {state.logged && (
        <Alert kind="success" title="Saved. Thank you!">
          {/* Plain flowing text: as flex items the words, code and link became narrow columns on a phone. */}
          <p>
            <Tag className="mr-1 inline size-5 align-text-bottom" aria-hidden /> Write <strong className="font-mono text-lg" data-testid="new-code">{b.code}</strong> on its tag (or use <Link to={`/tags?ids=${b.id}`}>Print its tag</Link>), so the organisers can find it in the log.
          </p>
        </Alert>
      )}
      {state.photoError && (
        <Alert kind="warning" title="The blanket is saved, but the photos did not arrive">
          {state.photoError} You can add them again below.
        </Alert>
      )}

      <InspectionFindings blanket={b} isMaker={isMaker} />

      <Card className="space-y-4">
        <div className="flex flex-wrap items-center gap-3">
          <CardTitle as="h2" className="mb-0">
            Where it’s up to
          </CardTitle>
          <StatusBadge status={b.status} />
        </div>
        <StatusTimeline status={b.status} />
        <StatusActions blanket={b} sites={sites.data ?? []} onChanged={() => void qc.invalidateQueries({ queryKey: pledgeKeys.all })} />
        {b.siteId && b.status === 'booked' && (
          <p className="text-ink-soft">Drop-off: {sites.data?.find((s) => s.id === b.siteId)?.name ?? 'booked'}</p>
        )}
        {/* Booking records the site and the time with the move, on its own page. */}
        {isMaker && (b.status === 'finished' || b.status === 'booked') && (
          <ButtonLink to={b.status === 'finished' ? `/drop-off?blanket=${b.id}` : '/drop-off'} variant={b.status === 'finished' ? 'primary' : 'secondary'}>
            <CalendarClock className="size-5" aria-hidden />
            {b.status === 'finished' ? 'Book a drop-off' : 'Move or cancel the drop-off'}
          </ButtonLink>
        )}
      </Card>

      <div className="grid gap-6 lg:grid-cols-3">
        <div className="space-y-6 lg:col-span-2">
          <Card>
            <CardTitle>Photos</CardTitle>
            <PhotoGallery blanket={b} isMaker={isMaker} />
          </Card>
          <Card>
            <CardTitle>Details</CardTitle>
            <Details b={b} isMaker={isMaker} />
          </Card>
        </div>
        <div className="space-y-6">
          <SelfCheckPanel outcome={outcomeOf(b)} cautions={b.cautions} notes={selfCheckNotes(b)} viewer={isMaker ? 'maker' : 'staff'} />
          <Card>
            <CardTitle>History</CardTitle>
            <BlanketHistory events={b.events} />
          </Card>
        </div>
      </div>
    </div>
  );
}
