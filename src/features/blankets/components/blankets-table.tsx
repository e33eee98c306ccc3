import { useEffect, useMemo, useState, type ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { createColumnHelper, flexRender, getCoreRowModel, useReactTable, type PaginationState, type SortingState } from '@tanstack/react-table';
import { ArrowDown, ArrowUp, ArrowUpDown, ChevronLeft, ChevronRight, ImageIcon, Search } from 'lucide-react';
import { Button } from '@/components/ui/button';
import { Field, Input, Select } from '@/components/ui/field';
import { formatDay } from '@/components/ui/format-day';
import { cn } from '@/components/ui/cn';
import type { BlanketStatus } from '@shared/schemas/blanket';
import type { BlanketSort, BlanketSummary } from '@shared/schemas/blanket-log';
import { pageCount } from '@shared/schemas/page';
import { Loading } from '@/components/ui/spinner';
import { QueryError } from '@/components/ui/query-error';
import { useBlankets, type BlanketListParams } from '../api/get-blankets';
import { STATUS_LABELS } from '@shared/blankets/status';
import { formatCm } from '@shared/guidelines/wording';
import { StatusBadge } from '@/components/ui/status-badge';
import { StatusTimeline } from './status-timeline';

const col = createColumnHelper<BlanketSummary>();
const size = (b: BlanketSummary) => `${formatCm(b.widthCm)} × ${formatCm(b.lengthCm)} cm`;

const makerColumn = col.accessor('makerName', { header: 'Maker', cell: (c) => c.getValue() || '—' });

const columns = [
  col.accessor('code', {
    header: 'Code',
    cell: (c) => (
      <Link to={`/blankets/${c.row.original.id}`} className="whitespace-nowrap font-mono font-bold">
        {c.getValue()}
      </Link>
    ),
  }),
  col.accessor('status', {
    header: 'Status',
    cell: (c) => (
      <div className="space-y-1">
        <StatusBadge status={c.getValue()} />
        <StatusTimeline status={c.getValue()} compact />
      </div>
    ),
  }),
  col.accessor((b) => b.recipientName ?? 'Wherever it’s needed most', { id: 'recipient', header: 'Going to' }),
  col.accessor((b) => b.widthCm * b.lengthCm, { id: 'size', header: 'Size', cell: (c) => <span className="whitespace-nowrap">{size(c.row.original)}</span> }),
  col.accessor('colours', { header: 'Colours', cell: (c) => c.getValue() || '—' }),
  col.accessor('createdAt', { header: 'Logged', cell: (c) => <span className="whitespace-nowrap">{formatDay(c.getValue())}</span> }),
  col.accessor('photoCount', {
    header: 'Photos',
    enableSorting: false,
    cell: (c) =>
      c.row.original.coverPhoto ? (
        <img src={c.row.original.coverPhoto.thumbUrl} alt="" className="size-12 rounded-lg object-cover" loading="lazy" />
      ) : (
        <span className="text-ink-soft">None</span>
      ),
  }),
];

/** Blankets picked on the list for something done to several at once (printing their tags). */
export interface Choosing {
  chosen: ReadonlySet<number>;
  toggle: (id: number) => void;
  /** What choosing is for, in the checkbox's label: "Choose KL-7Q4M to print its tag". */
  purpose: string;
}

function ChooseBox({ b, choosing }: { b: BlanketSummary; choosing: Choosing }) {
  return (
    <input
      type="checkbox"
      className="size-6 shrink-0 accent-heather-700"
      checked={choosing.chosen.has(b.id)}
      onChange={() => choosing.toggle(b.id)}
      aria-label={`Choose ${b.code} ${choosing.purpose}`}
    />
  );
}

function BlanketCard({ b, choosing }: { b: BlanketSummary; choosing?: Choosing }) {
  return (
    <li className="rounded-2xl border border-oat-200 bg-white p-4 shadow-sm" data-testid="blanket-card">
      <div className="flex items-start gap-3">
        {choosing && <ChooseBox b={b} choosing={choosing} />}
        {b.coverPhoto ? (
          <img src={b.coverPhoto.thumbUrl} alt="" className="size-20 shrink-0 rounded-xl object-cover" loading="lazy" />
        ) : (
          <span className="flex size-20 shrink-0 items-center justify-center rounded-xl bg-oat-100 text-ink-soft">
            <ImageIcon className="size-8" aria-hidden />
          </span>
        )}
        <div className="min-w-0 flex-1">
          <Link to={`/blankets/${b.id}`} className="whitespace-nowrap font-mono text-lg font-bold">
            {b.code}
          </Link>
          <p className="leading-snug">{b.recipientName ?? 'Wherever it’s needed most'}</p>
          <p className="text-sm text-ink-soft">
            {size(b)}
            {b.colours ? ` · ${b.colours}` : ''}
          </p>
        </div>
      </div>
      <div className="mt-3 flex flex-wrap items-center gap-3">
        <StatusBadge status={b.status} />
        <StatusTimeline status={b.status} compact />
      </div>
    </li>
  );
}

const PAGE_SIZES = [10, 25, 50];

/** The column ids the server knows how to sort by. */
const SORTABLE: Record<string, BlanketSort> = {
  code: 'code',
  status: 'status',
  recipient: 'recipient',
  size: 'size',
  colours: 'colours',
  createdAt: 'createdAt',
  makerName: 'maker',
};

/** A value that follows `value` once it has stood still for `ms`, so typing doesn't fire a request per key. */
function useSettled<T>(value: T, ms = 300): T {
  const [settled, setSettled] = useState(value);
  useEffect(() => {
    const t = setTimeout(() => setSettled(value), ms);
    return () => clearTimeout(t);
  }, [value, ms]);
  return settled;
}

/**
 * A list of blankets, sorted, filtered, searched and paged by the server (TanStack Table in manual
 * mode): a maker's own (`mine`) or, for staff, the whole drive's. A table on wide screens, cards on
 * phones, both drawn from the same page of rows.
 */
export function BlanketsTable({
  mine,
  showMaker = false,
  empty,
  choosing,
  fixed,
}: {
  mine: boolean;
  showMaker?: boolean;
  empty: ReactNode;
  choosing?: Choosing;
  /** Filters the page holds (from its address), applied under the search and status. */
  fixed?: Pick<BlanketListParams, 'step' | 'needId' | 'reached' | 'from' | 'to'>;
}) {
  // Staff see everyone's blankets, so who made each one is a column of its own.
  const visibleColumns = useMemo(() => {
    const base = showMaker ? [columns[0]!, makerColumn, ...columns.slice(1)] : columns;
    if (!choosing) return base;
    const choose = col.display({ id: 'choose', header: () => <span className="sr-only">Choose</span>, cell: (c) => <ChooseBox b={c.row.original} choosing={choosing} /> });
    return [choose, ...base];
  }, [showMaker, choosing]);
  const [sorting, setSorting] = useState<SortingState>([{ id: 'createdAt', desc: true }]);
  const [search, setSearch] = useState('');
  const [status, setStatus] = useState<BlanketStatus | ''>('');
  const [pagination, setPagination] = useState<PaginationState>({ pageIndex: 0, pageSize: 10 });
  const q = useSettled(search.trim());
  const sort = sorting[0];
  const query = useBlankets({
    mine: mine || undefined,
    status: status || undefined,
    ...fixed,
    q: q || undefined,
    sort: sort ? SORTABLE[sort.id] : undefined,
    dir: sort ? (sort.desc ? 'desc' : 'asc') : undefined,
    page: pagination.pageIndex + 1,
    pageSize: pagination.pageSize,
  });
  const page = query.data;
  const total = page?.total ?? 0;
  const table = useReactTable({
    data: page?.items ?? [],
    columns: visibleColumns,
    state: { sorting, pagination },
    manualSorting: true,
    manualFiltering: true,
    manualPagination: true,
    rowCount: total,
    onSortingChange: (u) => {
      setSorting(u);
      setPagination((p) => ({ ...p, pageIndex: 0 }));
    },
    onPaginationChange: setPagination,
    getCoreRowModel: getCoreRowModel(),
  });
  // A new search or filter starts again from the first page.
  const fixedKey = JSON.stringify(fixed ?? {});
  useEffect(() => setPagination((p) => ({ ...p, pageIndex: 0 })), [q, status, fixedKey]);

  if (query.isPending) return <Loading />;
  if (query.error && !page) return <QueryError error={query.error} />;
  const filtered = q !== '' || status !== '' || Object.values(fixed ?? {}).some((v) => v !== undefined);
  if (!filtered && total === 0) return <>{empty}</>;
  const rows = table.getRowModel().rows;

  return (
    <div className="space-y-4">
      <div className="grid gap-4 sm:grid-cols-3">
        <Field label="Search" className="sm:col-span-2">
          {({ id }) => (
            <div className="relative">
              <Search className="pointer-events-none absolute left-3 top-1/2 size-5 -translate-y-1/2 text-ink-soft" aria-hidden />
              <Input id={id} type="search" placeholder={showMaker ? 'Code, recipient, colour or maker' : 'Code, recipient or colour'} value={search} onChange={(e) => setSearch(e.target.value)} className="pl-10" />
            </div>
          )}
        </Field>
        <Field label="Status">
          {({ id }) => (
            <Select id={id} value={status} onChange={(e) => setStatus(e.target.value as BlanketStatus | '')}>
              <option value="">All</option>
              {(Object.keys(STATUS_LABELS) as BlanketStatus[]).map((s) => (
                <option key={s} value={s}>
                  {STATUS_LABELS[s]}
                </option>
              ))}
            </Select>
          )}
        </Field>
      </div>
      <p className="text-ink-soft" aria-live="polite">
        {filtered ? `${total} matching blanket${total === 1 ? '' : 's'}` : `${total} blanket${total === 1 ? '' : 's'}`}
        {query.isFetching && <span className="sr-only"> (updating)</span>}
      </p>

      <div className={cn('hidden overflow-x-auto rounded-2xl border border-oat-200 bg-white md:block', query.isPlaceholderData && 'opacity-70')}>
        <table className="w-full text-left">
          <thead className="border-b border-oat-200 bg-oat-50">
            {table.getHeaderGroups().map((hg) => (
              <tr key={hg.id}>
                {hg.headers.map((h) => {
                  const sorted = h.column.getIsSorted();
                  const Icon = sorted === 'asc' ? ArrowUp : sorted === 'desc' ? ArrowDown : ArrowUpDown;
                  return (
                    <th key={h.id} scope="col" className="px-4 py-3" aria-sort={sorted === 'asc' ? 'ascending' : sorted === 'desc' ? 'descending' : 'none'}>
                      {h.column.getCanSort() ? (
                        <button type="button" onClick={h.column.getToggleSortingHandler()} className="inline-flex items-center gap-1 font-bold hover:text-heather-800">
                          {flexRender(h.column.columnDef.header, h.getContext())}
                          <Icon className={cn('size-4', sorted ? 'text-heather-700' : 'text-ink-soft')} aria-hidden />
                        </button>
                      ) : (
                        flexRender(h.column.columnDef.header, h.getContext())
                      )}
                    </th>
                  );
                })}
              </tr>
            ))}
          </thead>
          <tbody>
            {rows.map((r) => (
              <tr key={r.id} className="border-b border-oat-100 last:border-0 hover:bg-oat-50" data-testid="blanket-row">
                {r.getVisibleCells().map((c) => (
                  <td key={c.id} className="px-4 py-3 align-middle">
                    {flexRender(c.column.columnDef.cell, c.getContext())}
                  </td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
      </div>

      <ul className="space-y-4 md:hidden">
        {rows.map((r) => (
          <BlanketCard key={r.id} b={r.original} choosing={choosing} />
        ))}
      </ul>

      {total === 0 && <p className="py-6 text-center text-ink-soft">No blankets match. Clear the search or choose another status.</p>}

      {total > PAGE_SIZES[0]! && (
        <nav aria-label="Pages" className="flex flex-wrap items-center justify-between gap-3">
          <Button variant="secondary" onClick={() => table.previousPage()} disabled={!table.getCanPreviousPage()}>
            <ChevronLeft className="size-5" aria-hidden /> Previous
          </Button>
          <span>
            Page {pagination.pageIndex + 1} of {pageCount({ total, pageSize: pagination.pageSize })}
          </span>
          <label className="flex items-center gap-2">
            Per page
            <Select value={pagination.pageSize} onChange={(e) => table.setPageSize(Number(e.target.value))} className="w-auto">
              {PAGE_SIZES.map((n) => (
                <option key={n} value={n}>
                  {n}
                </option>
              ))}
            </Select>
          </label>
          <Button variant="secondary" onClick={() => table.nextPage()} disabled={!table.getCanNextPage()}>
            Next <ChevronRight className="size-5" aria-hidden />
          </Button>
        </nav>
      )}
    </div>
  );
}
