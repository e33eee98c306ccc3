import { useSearchParams } from 'react-router-dom';
import { Printer, Tag } from 'lucide-react';
import { PageHeader } from '@/components/ui/page-header';
import { Button } from '@/components/ui/button';
import { Loading } from '@/components/ui/spinner';
import { QueryError } from '@/components/ui/query-error';
import { EmptyState } from '@/components/ui/empty-state';
import { ApiError } from '@/lib/api-client';
import { useTags } from '@/features/intake/api/get-tags';
import { categoryText } from '@/features/intake/components/blanket-summary';
import { formatCm, formatIn, isInfantPopulation } from '@shared/guidelines/wording';

/** The field's own words where the server gave them, rather than the field name in front of them. */
const wordedError = (e: Error) => (e instanceof ApiError && e.issues[0] ? new Error(e.issues[0].message) : e);

const svgSrc = (svg: string) => `data:image/svg+xml;charset=utf-8,${encodeURIComponent(svg)}`;

/** A sheet of tags to print and pin to blankets: the code, the maker's name as they chose it, the size, a QR code. */
export default function TagSheetPage() {
  const [params] = useSearchParams();
  const ids = (params.get('ids') ?? '')
    .split(',')
    .map(Number)
    .filter((n) => Number.isInteger(n) && n > 0);
  const tags = useTags(ids);
  return (
    <div>
      <div className="no-print">
      <PageHeader
        title="Blanket tags"
        lead="Print on plain paper or label sheets, cut along the dashed lines and pin one tag to each blanket."
        actions={
          <Button onClick={() => window.print()} disabled={!tags.data?.length}>
            <Printer className="size-5" aria-hidden /> Print
          </Button>
        }
      />
      </div>
      {ids.length === 0 ? (
        <EmptyState icon={Tag} title="No blankets chosen">
          Choose blankets on My blankets or in the intake queue, or print a tag from a blanket's own page.
        </EmptyState>
      ) : tags.isPending ? (
        <Loading />
      ) : tags.error ? (
        <QueryError error={wordedError(tags.error)} title="We could not print these tags" />
      ) : (
        <ul className="tag-sheet grid grid-cols-1 gap-4 sm:grid-cols-2 lg:grid-cols-3 print:grid-cols-3 print:gap-0" aria-label="Tags">
          {tags.data.map((t) => (
            <li key={t.id} className="flex break-inside-avoid items-center gap-3 rounded-xl border-2 border-dashed border-oat-300 bg-white p-3 print:rounded-none print:border print:border-ink/40" data-testid="tag">
              <img src={svgSrc(t.qrSvg)} alt={`QR code for ${t.code}`} className="size-28 shrink-0" />
              <div className="min-w-0 leading-tight">
                <p className="font-mono text-2xl font-bold tracking-widest">{t.code}</p>
                <p className="mt-1 font-bold">Made by {t.makerLabel}</p>
                <p className="text-sm">
                  {formatCm(t.widthCm)} × {formatCm(t.lengthCm)} cm ({formatIn(t.widthCm)} × {formatIn(t.lengthCm)} in)
                </p>
                <p className="text-sm">{categoryText(t.sizeCategory)}</p>
                {t.recipientName && <p className="text-sm">For {t.recipientName}</p>}
                {t.recipientPopulation && isInfantPopulation(t.recipientPopulation) && (
                  <p className="mt-1 text-xs font-bold" data-testid="tag-infant-caution">
                    For supervised cuddles only, never loose in a baby's sleep space. The unit's own policy comes first.
                  </p>
                )}
              </div>
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
