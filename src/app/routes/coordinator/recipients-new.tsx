import { useNavigate } from 'react-router-dom';
import { PageHeader } from '@/components/ui/page-header';
import { Card } from '@/components/ui/card';
import { useCreateRecipient } from '@/features/recipients/api/create-recipient';
import { useRecipients } from '@/features/recipients/api/get-recipients';
import { RecipientForm } from '@/features/recipients/components/recipient-form';

export default function NewRecipientPage() {
  const create = useCreateRecipient();
  const navigate = useNavigate();
  const { data } = useRecipients('all');
  return (
    <div>
      <PageHeader title="Add a recipient" lead="It starts with our default guidelines for the people it serves; edit them on the next page." />
      <Card>
        <RecipientForm
          submitLabel="Add the recipient"
          busy={create.isPending}
          error={create.error}
          otherPins={(data ?? []).filter((r) => r.lat !== null && r.lng !== null).map((r) => ({ id: r.id, lat: r.lat!, lng: r.lng!, label: r.name }))}
          onSubmit={(input) => create.mutate(input, { onSuccess: (r) => navigate(`/recipients/${r.id}`) })}
        />
      </Card>
    </div>
  );
}
