import { useNavigate, useParams } from 'react-router-dom';
import { useQueryClient } from '@tanstack/react-query';
import { PageHeader } from '@/components/ui/page-header';
import { Alert } from '@/components/ui/alert';
import { ButtonLink } from '@/components/ui/button';
import { Loading } from '@/components/ui/spinner';
import { QueryError } from '@/components/ui/query-error';
import { useMe } from '@/features/auth/api/get-me';
import { useMyPledges } from '@/features/pledges/api/get-pledges';
import { pledgeKeys } from '@/features/pledges/api/keys';
import { useNeeds } from '@/features/needs/api/get-needs';
import { useBlanket } from '@/features/blankets/api/get-blanket';
import { useMyPlans } from '@/features/blankets/api/get-my-plans';
import { useUpdateBlanket } from '@/features/blankets/api/update-blanket';
import { BlanketForm } from '@/features/blankets/components/blanket-form';
import { toUpdatePayload, type BlanketFormValues } from '@/features/blankets/components/blanket-form-values';
import type { RecipientBrief } from '@shared/schemas/pledge';
import { pickBlanketFields } from '@shared/schemas/blanket-values';

/** Correcting the log while the blanket is still with its maker; the self-check runs again as they change it. */
export default function EditBlanketPage() {
  const id = Number(useParams().id);
  const { data: user } = useMe();
  const blanket = useBlanket(id);
  const pledges = useMyPledges();
  const needs = useNeeds();
  const plans = useMyPlans();
  const navigate = useNavigate();
  const qc = useQueryClient();
  const update = useUpdateBlanket(() => void qc.invalidateQueries({ queryKey: pledgeKeys.all }));

  if (blanket.isPending || pledges.isPending || needs.isPending || plans.isPending || !user) return <Loading />;
  if (blanket.error) return <QueryError error={blanket.error} title="We could not find that blanket" />;
  const b = blanket.data;
  if (!b.editable) {
    return (
      <div className="space-y-6">
        <PageHeader title={`Blanket ${b.code}`} />
        <Alert kind="info" title="This log can no longer be changed here">
          Once the organisers have a blanket, they correct its log at intake. Ask them if something is wrong.
        </Alert>
        <ButtonLink to={`/blankets/${b.id}`}>Back to the blanket</ButtonLink>
      </div>
    );
  }
  const own = (pledges.data ?? []).filter((p) => p.id === b.pledgeId);
  const others: RecipientBrief[] = [];
  for (const n of needs.data ?? []) if (!others.some((r) => r.id === n.recipient.id)) others.push(n.recipient);
  const { widthCm, lengthCm, ...checked } = pickBlanketFields(b);
  const defaults: BlanketFormValues = {
    pledgeId: b.pledgeId ?? 0,
    unit: 'cm',
    width: widthCm,
    length: lengthCm,
    ...checked,
    colours: b.colours,
    bodyStitch: b.bodyStitch,
    borderId: b.borderId ?? '',
    planId: b.planId ? String(b.planId) : '',
    labelName: b.labelName,
    notes: b.notes,
    status: 'finished',
  };
  const onSubmit = async (values: BlanketFormValues) => {
    await update.mutateAsync({ id: b.id, version: b.version, ...toUpdatePayload(values) });
    navigate(`/blankets/${b.id}`);
  };
  return (
    <div className="space-y-6">
      <PageHeader title={`Correct the log for ${b.code}`} lead="Change what needs changing; the self-check runs again as you go." />
      <BlanketForm
        mode="edit"
        pledges={own}
        defaultValues={defaults}
        otherRecipients={others}
        plans={plans.data ?? []}
        firstName={user.name.split(' ')[0] ?? user.name}
        onSubmit={onSubmit}
        uploadProgress={null}
        submitLabel="Save the changes"
      />
    </div>
  );
}
