import { useState } from 'react';
import { Link, useSearchParams } from 'react-router-dom';
import { ChevronLeft, ChevronRight, ClipboardList } from 'lucide-react';
import { PageHeader } from '@/components/ui/page-header';
import { Button } from '@/components/ui/button';
import { Badge } from '@/components/ui/badge';
import { EmptyState } from '@/components/ui/empty-state';
import { Loading } from '@/components/ui/spinner';
import { QueryError } from '@/components/ui/query-error';
import { formatDay } from '@/components/ui/format-day';
import { usePledges } from '@/features/pledges/api/get-pledges';
import { sizeLabel } from '@/features/blankets/components/labels';
import { ListFilterNote, dayParam, idParam, lastDayBefore } from '@/features/progress/components/list-filter-note';
import { pageCount } from '@shared/schemas/page';
import type { PledgeStatus } from '@shared/schemas/pledge';

const STATUS_WORDS: Record<PledgeStatus, string> = { active: 'Active', fulfilled: 'Made', cancelled: 'Cancelled' };
const PAGE_SIZE = 25;

/**
 * Everyone's pledges, for the organisers and the coordinator: the list behind the pledged figures of
 * the drive at a glance, filtered from the address (`needId`, `promising`, `from`/`to`).
 */
export default function AllPledgesPage() {
  const [params] = useSearchParams();
  const from = dayParam(params.get('from'));
  const to = dayParam(params.get('to'));
  const filters = {
    needId: idParam(params.get('needId')),
    promising: params.get('promising') === 'true' ? true : undefined,
    ...(from && to ? { from, to } : {}),
  };
  const [page, setPage] = useState(1);
  const pledges = usePledges({ ...filters, sort: 'createdAt', dir: 'desc', page, pageSize: PAGE_SIZE });
  const first = pledges.data?.items[0];
  const parts: string[] = [];
  if (filters.promising) parts.push('still standing (active or made)');
  if (filters.from && filters.to) {
    parts.push(`made from ${formatDay(filters.from)} to ${formatDay(lastDayBefore(filters.to))}`);
  }
  if (filters.needId) parts.push(first?.need ? `for ${first.need.recipient.name}, ${sizeLabel(first.need.sizeCategory).toLowerCase()}` : 'for one need');
  return (
    <div className="space-y-6">
      <PageHeader title="All pledges" lead="What the makers have promised, newest first: who, for which need, how many and by when." />
      <ListFilterNote noun="pledges" parts={parts} allTo="/all-pledges" />
      {pledges.isPending ? (
        <Loading />
      ) : pledges.error ? (
        <QueryError error={pledges.error} />
      ) : pledges.data.total === 0 ? (
        <EmptyState icon={ClipboardList} title={parts.length ? 'No pledges match' : 'No pledges yet'}>
          {parts.length ? 'Nothing was pledged with these filters.' : 'Pledges appear here as soon as makers promise blankets.'}
        </EmptyState>
      ) : (
        <>
          <p className="text-lg font-bold" data-testid="pledge-total">
            {pledges.data.total} {pledges.data.total === 1 ? 'pledge' : 'pledges'} promising {pledges.data.blankets} {pledges.data.blankets === 1 ? 'blanket' : 'blankets'}
          </p>
          <div role="region" aria-label="Pledges, scrolls sideways" tabIndex={0} className="overflow-x-auto rounded-2xl border border-oat-200 bg-white shadow-sm">
            <table className="w-full min-w-[40rem] text-left">
              <caption className="sr-only">Pledges</caption>
              <thead className="bg-oat-50 text-sm">
                <tr>
                  <th scope="col" className="p-3 font-bold">Maker</th>
                  <th scope="col" className="p-3 font-bold">For</th>
                  <th scope="col" className="p-3 font-bold">Blankets</th>
                  <th scope="col" className="p-3 font-bold">Due</th>
                  <th scope="col" className="p-3 font-bold">Made on</th>
                  <th scope="col" className="p-3 font-bold">Status</th>
                </tr>
              </thead>
              <tbody>
                {pledges.data.items.map((p) => (
                  <tr key={p.id} className="border-t border-oat-200">
                    <td className="p-3 font-bold">{p.makerName ?? '–'}</td>
                    <td className="p-3">
                      {p.need ? (
                        <Link to={`/recipients/${p.need.recipient.id}`}>{p.need.recipient.name}</Link>
                      ) : (
                        'Wherever it’s needed most'
                      )}
                      <span className="block text-sm text-ink-soft">{sizeLabel(p.sizeCategory)}</span>
                    </td>
                    <td className="p-3 tabular-nums">
                      {p.quantity}
                      <span className="block text-sm text-ink-soft">{p.blanketsFinished} finished</span>
                    </td>
                    <td className="whitespace-nowrap p-3">{formatDay(p.dueDate)}</td>
                    <td className="whitespace-nowrap p-3">{formatDay(p.createdAt)}</td>
                    <td className="p-3">
                      <Badge tone={p.status === 'cancelled' ? 'neutral' : p.late ? 'brick' : p.status === 'fulfilled' ? 'moss' : 'heather'}>
                        {p.late && p.status === 'active' ? 'Late' : STATUS_WORDS[p.status]}
                      </Badge>
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
          {pledges.data.total > pledges.data.pageSize && (
            <nav aria-label="Pages of pledges" className="flex items-center gap-3">
              <Button variant="secondary" size="sm" disabled={page <= 1} onClick={() => setPage((x) => x - 1)}>
                <ChevronLeft className="size-4" aria-hidden /> Newer
              </Button>
              <span>
                Page {page} of {pageCount(pledges.data)}
              </span>
              <Button variant="secondary" size="sm" disabled={page >= pageCount(pledges.data)} onClick={() => setPage((x) => x + 1)}>
                Older <ChevronRight className="size-4" aria-hidden />
              </Button>
            </nav>
          )}
        </>
      )}
    </div>
  );
}
