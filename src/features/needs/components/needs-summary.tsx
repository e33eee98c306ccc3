import { Badge } from '@/components/ui/badge';
import { formatDay } from '@/components/ui/format-day';
import type { OpenNeed } from '@shared/schemas/pledge';
import { sizeCategoryRow } from '@shared/guidelines/size-categories';
import { capitalise } from '@shared/guidelines/wording';

/** Pledged against wanted for every open need in one table, gaps and over-pledging marked. */
export function NeedsSummary({ needs }: { needs: OpenNeed[] }) {
  const totals = needs.reduce((t, n) => ({ wanted: t.wanted + n.quantity, pledged: t.pledged + n.pledged }), { wanted: 0, pledged: 0 });
  return (
    <div className="overflow-x-auto rounded-2xl border border-oat-200 bg-white">
      <table className="w-full text-left" aria-label="Pledged against wanted">
        <thead className="border-b border-oat-200 bg-oat-50">
          <tr>
            <th scope="col" className="px-4 py-3">Recipient</th>
            <th scope="col" className="px-4 py-3">Size</th>
            <th scope="col" className="px-4 py-3">Deadline</th>
            <th scope="col" className="px-4 py-3 text-right">Wanted</th>
            <th scope="col" className="px-4 py-3 text-right">Pledged</th>
            <th scope="col" className="px-4 py-3">Gap</th>
          </tr>
        </thead>
        <tbody>
          {needs.map((n) => (
            <tr key={n.id} className="border-b border-oat-100 last:border-0" data-testid={`summary-need-${n.id}`}>
              <td className="px-4 py-2">{n.recipient.name}</td>
              <td className="px-4 py-2">{capitalise(sizeCategoryRow(n.sizeCategory).label)}</td>
              <td className="whitespace-nowrap px-4 py-2">{formatDay(n.deadline)}</td>
              <td className="px-4 py-2 text-right">{n.quantity}</td>
              <td className="px-4 py-2 text-right font-bold">{n.pledged}</td>
              <td className="px-4 py-2">
                {n.overPledged > 0 ? (
                  <Badge tone="marigold">{n.overPledged} over</Badge>
                ) : n.stillWanted > 0 ? (
                  <span>{n.stillWanted} to find</span>
                ) : (
                  <Badge tone="moss">Covered</Badge>
                )}
              </td>
            </tr>
          ))}
        </tbody>
        <tfoot className="border-t-2 border-oat-200 font-bold">
          <tr>
            <td className="px-4 py-2" colSpan={3}>
              All open needs
            </td>
            <td className="px-4 py-2 text-right">{totals.wanted}</td>
            <td className="px-4 py-2 text-right">{totals.pledged}</td>
            <td className="px-4 py-2" />
          </tr>
        </tfoot>
      </table>
    </div>
  );
}
