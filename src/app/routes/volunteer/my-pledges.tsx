import { useQueryClient } from '@tanstack/react-query';
import { HandHeart } from 'lucide-react';
import { PageHeader } from '@/components/ui/page-header';
import { ButtonLink } from '@/components/ui/button';
import { Loading } from '@/components/ui/spinner';
import { QueryError } from '@/components/ui/query-error';
import { EmptyState } from '@/components/ui/empty-state';
import { useMyPledges } from '@/features/pledges/api/get-pledges';
import { PledgeCard } from '@/features/pledges/components/pledge-card';
import { needKeys } from '@/features/needs/api/keys';

/** "My pledges": late ones first, then the open ones by date, then the done and the cancelled. */
export default function MyPledgesPage() {
  const pledges = useMyPledges();
  const qc = useQueryClient();
  const refresh = () => void qc.invalidateQueries({ queryKey: needKeys.all });
  const rank = (p: { late: boolean; status: string }) => (p.late ? 0 : p.status === 'active' ? 1 : p.status === 'fulfilled' ? 2 : 3);
  const list = [...(pledges.data ?? [])].sort((a, b) => rank(a) - rank(b) || a.dueDate.localeCompare(b.dueDate));
  return (
    <div className="space-y-6">
      <PageHeader
        title="My pledges"
        lead="What you have promised, how far along each is, and the blankets you still have to log."
        actions={<ButtonLink to="/needs">See what’s needed</ButtonLink>}
      />
      {pledges.isPending && <Loading />}
      {pledges.error && <QueryError error={pledges.error} />}
      {pledges.data &&
        (list.length === 0 ? (
          <EmptyState icon={HandHeart} title="No pledges yet" action={<ButtonLink to="/needs">See what’s needed</ButtonLink>}>
            Pick a recipient on “What’s needed” and say how many you can make.
          </EmptyState>
        ) : (
          <div className="space-y-4">
            {list.map((p) => (
              <PledgeCard key={p.id} pledge={p} onChanged={refresh} />
            ))}
          </div>
        ))}
    </div>
  );
}
