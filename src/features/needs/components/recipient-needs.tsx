import type { ReactNode } from 'react';
import { CalendarDays, ListChecks } from 'lucide-react';
import { Card } from '@/components/ui/card';
import { Badge } from '@/components/ui/badge';
import { ProgressBar } from '@/components/ui/progress-bar';
import { Cautions } from '@/components/ui/cautions';
import { daysUntil, formatDay } from '@/components/ui/format-day';
import { useDriveToday } from '@/lib/drive-clock';
import { POPULATION_LABELS } from '@shared/schemas/blanket-values';
import type { OpenNeed, RecipientBrief } from '@shared/schemas/pledge';
import { sizeCategoryRow } from '@shared/guidelines/size-categories';
import { capitalise } from '@shared/guidelines/wording';

function NeedRow({ need, action }: { need: OpenNeed; action?: ReactNode }) {
  const days = daysUntil(need.deadline, useDriveToday());
  const filled = need.quantity > 0 ? need.pledged / need.quantity : 0;
  return (
    <li className="space-y-3 rounded-xl border border-oat-200 bg-oat-50 p-4" data-testid={`need-${need.id}`}>
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h4 className="text-lg font-bold">
          {need.quantity} {sizeCategoryRow(need.sizeCategory).label}s
        </h4>
        <p className="flex items-center gap-1 text-ink-soft">
          <CalendarDays className="size-4" aria-hidden />
          by {formatDay(need.deadline)} · {days === 0 ? 'today' : `${days} day${days === 1 ? '' : 's'} left`}
        </p>
      </div>
      <ProgressBar value={filled} label={`Pledged ${need.pledged} of ${need.quantity}`} tone={need.overPledged > 0 ? 'marigold' : 'moss'} />
      <p className="flex flex-wrap items-center gap-2">
        {need.stillWanted > 0 ? (
          <span className="font-bold">{need.stillWanted} still wanted</span>
        ) : need.overPledged > 0 ? (
          <Badge tone="marigold">{need.overPledged} more pledged than wanted</Badge>
        ) : (
          <Badge tone="moss">Fully pledged</Badge>
        )}
        {need.myPledged > 0 && <Badge tone="heather">You pledged {need.myPledged}</Badge>}
      </p>
      {need.preferences && <p className="text-ink-soft">“{need.preferences}”</p>}
      {action}
    </li>
  );
}

/** One recipient's open needs with its guidelines in plain words and the cautions for who it serves. */
export function RecipientNeeds({ recipient, needs, action }: { recipient: RecipientBrief; needs: OpenNeed[]; action?: (need: OpenNeed) => ReactNode }) {
  const headingId = `recipient-${recipient.id}`;
  return (
    <Card role="region" aria-labelledby={headingId} className="space-y-4">
      <div className="flex flex-wrap items-start justify-between gap-2">
        <h3 id={headingId} className="text-2xl font-bold">
          {recipient.name}
        </h3>
        <Badge tone="sky">{POPULATION_LABELS[recipient.population] ?? capitalise(recipient.population)}</Badge>
      </div>
      <div className="grid gap-4 lg:grid-cols-2">
        <div className="space-y-4">
          <div className="rounded-xl border border-oat-200 p-4">
            <h4 className="flex items-center gap-2 font-bold">
              <ListChecks className="size-5 text-heather-700" aria-hidden /> What they take
            </h4>
            <ul className="mt-2 list-disc space-y-1 pl-6" data-testid="guideline-summary">
              {recipient.guidelineSummary.map((line) => (
                <li key={line}>{line}</li>
              ))}
            </ul>
          </div>
          <Cautions cautions={recipient.cautions} compact />
        </div>
        <ul className="space-y-3" aria-label={`What ${recipient.name} needs`}>
          {needs.map((n) => (
            <NeedRow key={n.id} need={n} action={action?.(n)} />
          ))}
        </ul>
      </div>
    </Card>
  );
}
