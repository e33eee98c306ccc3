import { useCallback, useState } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { ApiError } from '@/lib/api-client';
import { runKeys } from './keys';
import { CsvRecordCounter } from '../lib/csv-record-counter';

export interface DownloadState {
  /** 0..1 while the manifest streams in, null when idle. */
  progress: number | null;
  error: string | null;
  done: string | null;
}

/**
 * Fetches a manifest as a stream and counts its records against the row count the server announces
 * (X-Manifest-Rows), so a long export shows real progress; then hands the file to the browser.
 */
export async function downloadManifest(url: string, onProgress: (fraction: number) => void): Promise<string> {
  const res = await fetch(url, { credentials: 'same-origin' });
  if (!res.ok || !res.body) {
    let message = `The download failed (${res.status})`;
    try {
      const body = (await res.json()) as { error?: { message?: string } };
      if (body.error?.message) message = body.error.message;
    } catch {
      /* not JSON */
    }
    throw new ApiError(res.status, message);
  }
  const rows = Number(res.headers.get('X-Manifest-Rows') ?? '0');
  const name = /filename="([^"]+)"/.exec(res.headers.get('Content-Disposition') ?? '')?.[1] ?? 'delivery-list.csv';
  const reader = res.body.getReader();
  const chunks: Uint8Array[] = [];
  const counter = new CsvRecordCounter();
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    chunks.push(value);
    // One header record plus one record per blanket.
    const records = counter.push(value);
    onProgress(rows > 0 ? Math.min(1, records / (rows + 1)) : 0.5);
  }
  onProgress(1);
  const href = URL.createObjectURL(new Blob(chunks as BlobPart[], { type: 'text/csv' }));
  const a = document.createElement('a');
  a.href = href;
  a.download = name;
  document.body.appendChild(a);
  a.click();
  a.remove();
  setTimeout(() => URL.revokeObjectURL(href), 10_000);
  return name;
}

export function useManifestDownload() {
  const qc = useQueryClient();
  const [state, setState] = useState<DownloadState>({ progress: null, error: null, done: null });
  const start = useCallback(
    async (url: string) => {
      setState({ progress: 0, error: null, done: null });
      try {
        const name = await downloadManifest(url, (p) => setState((s) => ({ ...s, progress: p })));
        setState({ progress: null, error: null, done: name });
        await qc.invalidateQueries({ queryKey: [...runKeys.all, 'exports'] });
      } catch (e) {
        setState({ progress: null, error: e instanceof Error ? e.message : 'The download failed', done: null });
      }
    },
    [qc],
  );
  return { ...state, start };
}
