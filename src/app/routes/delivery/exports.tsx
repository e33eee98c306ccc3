import { useState } from 'react';
import { ChevronLeft, ChevronRight, FileDown, FileSpreadsheet } from 'lucide-react';
import { PageHeader } from '@/components/ui/page-header';
import { Button } from '@/components/ui/button';
import { Loading } from '@/components/ui/spinner';
import { QueryError } from '@/components/ui/query-error';
import { EmptyState } from '@/components/ui/empty-state';
import { Alert } from '@/components/ui/alert';
import { ProgressBar } from '@/components/ui/progress-bar';
import { formatDay } from '@/components/ui/format-day';
import { useExports } from '@/features/runs/api/get-exports';
import { useManifestDownload } from '@/features/runs/api/download-manifest';
import { pageCount } from '@shared/schemas/page';

const size = (bytes: number) => (bytes < 1024 ? `${bytes} B` : bytes < 1024 * 1024 ? `${(bytes / 1024).toFixed(1)} KB` : `${(bytes / 1024 / 1024).toFixed(1)} MB`);

export default function ExportsPage() {
  const [page, setPage] = useState(1);
  const exports = useExports(page);
  const d = useManifestDownload();
  return (
    <div className="space-y-6">
      <PageHeader title="Exports" lead="Every delivery list made, newest first. Download one again exactly as it was written." />
      {d.progress !== null && <ProgressBar value={d.progress} label="Downloading" />}
      {d.error && <Alert kind="error" title="The file did not download">{d.error}</Alert>}
      {exports.isPending ? (
        <Loading />
      ) : exports.error ? (
        <QueryError error={exports.error} />
      ) : exports.data.items.length === 0 ? (
        <EmptyState icon={FileSpreadsheet} title="No exports yet">
          Download a run's delivery list from its page; a copy of each one is listed here.
        </EmptyState>
      ) : (
        <>
          <div className="overflow-x-auto rounded-2xl border border-oat-200 bg-white shadow-sm">
            <table className="w-full text-left">
              <caption className="sr-only">Manifests written</caption>
              <thead className="bg-oat-50 text-sm">
                <tr>
                  <th className="p-3 font-bold">What</th>
                  <th className="p-3 font-bold">Made</th>
                  <th className="hidden p-3 font-bold sm:table-cell">By</th>
                  <th className="p-3 font-bold">Rows</th>
                  <th className="hidden p-3 font-bold sm:table-cell">Size</th>
                  <th className="p-3 font-bold">
                    <span className="sr-only">Download</span>
                  </th>
                </tr>
              </thead>
              <tbody>
                {exports.data.items.map((e) => (
                  <tr key={e.id} className="border-t border-oat-200">
                    <td className="p-3">
                      <span className="font-bold">{e.title}</span>
                      {e.bom && <span className="block text-sm text-ink-soft">for spreadsheets</span>}
                    </td>
                    <td className="p-3">{formatDay(e.createdAt)}</td>
                    <td className="hidden p-3 sm:table-cell">{e.createdBy?.name ?? '–'}</td>
                    <td className="p-3">{e.rows}</td>
                    <td className="hidden p-3 sm:table-cell">{size(e.bytes)}</td>
                    <td className="p-3">
                      <Button size="sm" variant="secondary" onClick={() => d.start(`/api/exports/${e.id}`)} aria-label={`Download ${e.title}, made ${formatDay(e.createdAt)}`}>
                        <FileDown className="size-4" aria-hidden /> CSV
                      </Button>
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
          {exports.data.total > exports.data.pageSize && (
            <nav aria-label="Pages of exports" className="flex items-center gap-3">
              <Button variant="secondary" size="sm" disabled={page <= 1} onClick={() => setPage((p) => p - 1)}>
                <ChevronLeft className="size-4" aria-hidden /> Newer
              </Button>
              <span>
                Page {page} of {pageCount(exports.data)}
              </span>
              <Button variant="secondary" size="sm" disabled={page >= pageCount(exports.data)} onClick={() => setPage((p) => p + 1)}>
                Older <ChevronRight className="size-4" aria-hidden />
              </Button>
            </nav>
          )}
        </>
      )}
    </div>
  );
}
