import { useState } from 'react';
import { useNavigate, useSearchParams } from 'react-router-dom';
import { useQueryClient } from '@tanstack/react-query';
import { HandHeart } from 'lucide-react';
import { PageHeader } from '@/components/ui/page-header';
import { ButtonLink } from '@/components/ui/button';
import { Loading } from '@/components/ui/spinner';
import { QueryError } from '@/components/ui/query-error';
import { EmptyState } from '@/components/ui/empty-state';
import { ApiError } from '@/lib/api-client';
import { useMe } from '@/features/auth/api/get-me';
import { useMyPledges } from '@/features/pledges/api/get-pledges';
import { pledgeKeys } from '@/features/pledges/api/keys';
import { useNeeds } from '@/features/needs/api/get-needs';
import { useMyPlans } from '@/features/blankets/api/get-my-plans';
import { useCreateBlanket } from '@/features/blankets/api/create-blanket';
import { uploadPhotos } from '@/features/blankets/api/upload-photos';
import { BlanketForm } from '@/features/blankets/components/blanket-form';
import { toCreatePayload, type BlanketFormValues } from '@/features/blankets/components/blanket-form-values';
import { MAX_PHOTOS_PER_BLANKET } from '@shared/schemas/blanket-log-values';
import type { PledgeView, RecipientBrief } from '@shared/schemas/pledge';
import type { PlanListItem } from '@shared/schemas/plan';

export interface LoggedState {
  logged?: boolean;
  photoError?: string;
}

/** "Log a blanket": the whole log for one blanket under a pledge, photos included. */
export default function LogBlanketPage() {
  const { data: user } = useMe();
  const pledges = useMyPledges();
  const needs = useNeeds();
  const plans = useMyPlans();
  const [params] = useSearchParams();

  if (pledges.isPending || needs.isPending || plans.isPending || !user) return <Loading />;
  if (pledges.error) return <QueryError error={pledges.error} />;

  const open = (pledges.data ?? []).filter((p) => p.status !== 'cancelled' && p.blanketsLogged < p.quantity);
  if (open.length === 0) {
    return (
      <div className="space-y-6">
        <PageHeader title="Log a blanket" />
        <EmptyState icon={HandHeart} title="Pledge first, then log" action={<ButtonLink to="/needs">See what’s needed</ButtonLink>}>
          Every blanket is logged under one of your pledges, and all of yours are full. Make a new pledge, or raise one on My pledges.
        </EmptyState>
      </div>
    );
  }
  const asked = Number(params.get('pledge'));
  const pledgeId = open.some((p) => p.id === asked) ? asked : open[0]!.id;
  const others: RecipientBrief[] = [];
  for (const n of needs.data ?? []) if (!others.some((r) => r.id === n.recipient.id)) others.push(n.recipient);
  return (
    <div className="space-y-6">
      <PageHeader title="Log a blanket" lead="Tell the organisers what you made. The self-check tells you as you go whether it meets the recipient’s guidelines." />
      <LogForm pledges={open} pledgeId={pledgeId} others={others} plans={plans.data ?? []} firstName={user.name.split(' ')[0] ?? user.name} />
    </div>
  );
}

interface LogFormProps {
  pledges: PledgeView[];
  pledgeId: number;
  others: RecipientBrief[];
  plans: PlanListItem[];
  firstName: string;
}

function LogForm({ pledges, pledgeId, others, plans, firstName }: LogFormProps) {
  const navigate = useNavigate();
  const qc = useQueryClient();
  const create = useCreateBlanket();
  const [progress, setProgress] = useState<number | null>(null);

  const defaults: BlanketFormValues = {
    pledgeId,
    unit: 'cm',
    width: Number.NaN,
    length: Number.NaN,
    yarnWeight: 4,
    fibres: [],
    features: [],
    machineWashable: false,
    dryerSafe: false,
    smokeFree: false,
    petFree: false,
    newYarn: true,
    colours: '',
    bodyStitch: 'hdc',
    borderId: '',
    planId: '',
    labelName: 'first-name',
    notes: '',
    status: 'finished',
  };

  const onSubmit = async (values: BlanketFormValues, photos: File[]) => {
    const blanket = await create.mutateAsync(toCreatePayload(values));
    const state: LoggedState = { logged: true };
    if (photos.length > 0) {
      setProgress(0);
      try {
        await uploadPhotos({ blanketId: blanket.id, files: photos, onProgress: setProgress });
      } catch (err) {
        // The blanket is saved; the photos can be added again on its page rather than logging it twice.
        state.photoError = err instanceof ApiError ? err.message : 'The photos did not arrive';
      } finally {
        setProgress(null);
      }
    }
    navigate(`/blankets/${blanket.id}`, { state });
    // Only now: the new blanket fills its pledge, and a refreshed list would pull the pledge out
    // from under the form while the photos were still on their way.
    void qc.invalidateQueries({ queryKey: pledgeKeys.all });
  };

  return (
    <BlanketForm
      mode="create"
      pledges={pledges}
      defaultValues={defaults}
      otherRecipients={others}
      plans={plans}
      firstName={firstName}
      photoRoom={MAX_PHOTOS_PER_BLANKET}
      onSubmit={onSubmit}
      uploadProgress={progress}
      submitLabel="Save this blanket"
    />
  );
}
