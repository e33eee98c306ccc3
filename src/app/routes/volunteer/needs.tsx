import { useState } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { Link } from 'react-router-dom';
import { HandHeart, Sparkles } from 'lucide-react';
import { PageHeader } from '@/components/ui/page-header';
import { Card } from '@/components/ui/card';
import { Button } from '@/components/ui/button';
import { Alert } from '@/components/ui/alert';
import { Loading } from '@/components/ui/spinner';
import { QueryError } from '@/components/ui/query-error';
import { EmptyState } from '@/components/ui/empty-state';
import { useMe } from '@/features/auth/api/get-me';
import { useNeeds } from '@/features/needs/api/get-needs';
import { needKeys } from '@/features/needs/api/keys';
import { RecipientNeeds } from '@/features/needs/components/recipient-needs';
import { NeedsSummary } from '@/features/needs/components/needs-summary';
import { PledgeForm } from '@/features/pledges/components/pledge-form';
import type { OpenNeed, PledgeView, RecipientBrief } from '@shared/schemas/pledge';

/** "What's needed": every open need by recipient, what is promised so far, and a pledge form on each. */
export default function NeedsPage() {
  const { data: user } = useMe();
  const needs = useNeeds();
  const qc = useQueryClient();
  const [open, setOpen] = useState<number | 'anywhere' | null>(null);
  const [done, setDone] = useState<PledgeView | null>(null);
  const refresh = () => void qc.invalidateQueries({ queryKey: needKeys.all });
  const onDone = (p: PledgeView) => {
    setDone(p);
    setOpen(null);
  };

  const groups: Array<{ recipient: RecipientBrief; needs: OpenNeed[] }> = [];
  for (const n of needs.data ?? []) {
    const g = groups.find((x) => x.recipient.id === n.recipient.id);
    if (g) g.needs.push(n);
    else groups.push({ recipient: n.recipient, needs: [n] });
  }
  const wanted = (needs.data ?? []).reduce((s, n) => s + n.stillWanted, 0);
  const staff = user?.role !== 'volunteer';

  return (
    <div className="space-y-6">
      <PageHeader
        title="What’s needed"
        lead={
          staff
            ? 'Every open need with what has been promised against it, so gaps and over-pledging show at a glance.'
            : 'Choose a recipient and say how many you can make. Each one lists what they take, so your blanket is right first time.'
        }
      />
      {done && (
        <Alert kind="success" title="Thank you for your pledge">
          {done.quantity} {done.quantity === 1 ? 'blanket' : 'blankets'} for {done.need?.recipient.name ?? 'wherever it’s needed most'}. It is on <Link to="/pledges">My pledges</Link>, where you can log each blanket as you make it.
        </Alert>
      )}
      {needs.isPending && <Loading />}
      {needs.error && <QueryError error={needs.error} />}
      {needs.data && (
        <>
          <p className="text-lg">
            <strong>{wanted}</strong> blankets still wanted across {groups.length} recipients.
          </p>
          {staff && needs.data.length > 0 && (
            <section aria-labelledby="summary-title" className="space-y-3">
              <h2 id="summary-title" className="text-2xl font-bold">
                Pledged against wanted
              </h2>
              <NeedsSummary needs={needs.data} />
            </section>
          )}
          <Card className="space-y-3">
            <h2 className="flex items-center gap-2 text-2xl font-bold">
              <Sparkles className="size-6 text-marigold-700" aria-hidden /> Wherever it’s needed most
            </h2>
            <p>Not sure who it is for? Pledge a size and the organisers will match it to a recipient when it comes in.</p>
            {open === 'anywhere' ? (
              <PledgeForm target={null} onDone={onDone} onChanged={refresh} onCancel={() => setOpen(null)} />
            ) : (
              <Button variant="secondary" onClick={() => setOpen('anywhere')}>
                Pledge without choosing
              </Button>
            )}
          </Card>
          {groups.length === 0 ? (
            <EmptyState icon={HandHeart} title="No open needs right now">
              The recipients have everything they asked for. Check back soon, or pledge wherever it’s needed most.
            </EmptyState>
          ) : (
            <div className="space-y-6">
              {groups.map((g) => (
                <RecipientNeeds
                  key={g.recipient.id}
                  recipient={g.recipient}
                  needs={g.needs}
                  action={(n) =>
                    open === n.id ? (
                      <PledgeForm
                        target={{ needId: n.id, sizeCategory: n.sizeCategory, deadline: n.deadline, recipientName: g.recipient.name, stillWanted: n.stillWanted }}
                        onDone={onDone}
                        onChanged={refresh}
                        onCancel={() => setOpen(null)}
                      />
                    ) : (
                      <Button onClick={() => setOpen(n.id)} aria-label={`Pledge for ${g.recipient.name}: ${n.sizeCategory}`}>
                        <HandHeart className="size-5" aria-hidden /> I’ll make some
                      </Button>
                    )
                  }
                />
              ))}
            </div>
          )}
        </>
      )}
    </div>
  );
}
