import { useState } from 'react';
import { Download } from 'lucide-react';
import { Button } from '@/components/ui/button';
import { Checkbox } from '@/components/ui/field';
import { ProgressBar } from '@/components/ui/progress-bar';
import { Alert } from '@/components/ui/alert';
import { useManifestDownload } from '../api/download-manifest';

/** The delivery list as CSV, with a byte order mark for spreadsheet programs if wanted, and its progress. */
export function ManifestDownload({ url, label = 'Download the delivery list (CSV)' }: { url: string; label?: string }) {
  const [bom, setBom] = useState(true);
  const d = useManifestDownload();
  return (
    <div className="space-y-3">
      <div className="flex flex-wrap items-center gap-4">
        <Button onClick={() => d.start(`${url}?bom=${bom}`)} busy={d.progress !== null}>
          <Download className="size-5" aria-hidden /> {label}
        </Button>
        <Checkbox checked={bom} onChange={(e) => setBom(e.target.checked)} label="For a spreadsheet program (adds a byte order mark so accents show right)" />
      </div>
      {d.progress !== null && <ProgressBar value={d.progress} label="Preparing the delivery list" />}
      {d.error && <Alert kind="error" title="The delivery list did not download">{d.error}</Alert>}
      {d.done && (
        <Alert kind="success" title="Delivery list downloaded">
          Saved as <span className="font-bold break-all">{d.done}</span>. A copy is kept on the Exports page.
        </Alert>
      )}
    </div>
  );
}
