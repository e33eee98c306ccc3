import { STATUS_LABELS } from '@shared/blankets/status';
import type { BlanketStatus } from '@shared/schemas/blanket';
import type { BlanketHistoryEntry } from '@shared/schemas/intake-views';

const when = (iso: string) => new Date(iso).toLocaleString(undefined, { day: 'numeric', month: 'short', hour: '2-digit', minute: '2-digit' });

function detail(e: BlanketHistoryEntry): string | null {
  const d = (e.data ?? {}) as Record<string, unknown>;
  if (e.kind === 'intake') {
    const m = d.measured as { widthCm: number; lengthCm: number } | undefined;
    return [d.siteName ? `at ${String(d.siteName)}` : null, m ? `measured ${m.widthCm} × ${m.lengthCm} cm` : null, d.note ? String(d.note) : null].filter(Boolean).join(', ');
  }
  if (e.kind === 'inspection') {
    const redirect = d.redirect as { toName?: string } | null;
    const fixes = (d.fixes as string[] | undefined) ?? [];
    return [redirect?.toName ? `sent to ${redirect.toName}` : null, fixes.length ? `to fix: ${fixes.join(' ')}` : null, d.note ? String(d.note) : null].filter(Boolean).join('; ');
  }
  return null;
}

/** Every step of the blanket's life with who took it and when. */
export function BlanketHistory({ history }: { history: BlanketHistoryEntry[] }) {
  if (history.length === 0) return <p className="text-ink-soft">Nothing recorded yet.</p>;
  return (
    <ol className="space-y-3 border-l-4 border-heather-100 pl-4" aria-label="History">
      {history.map((e) => (
        <li key={e.id}>
          <p className="font-bold">
            {e.toStatus ? STATUS_LABELS[e.toStatus as BlanketStatus] : e.kind}
            <span className="font-normal text-ink-soft">
              {' '}
              · {when(e.createdAt)}
              {e.actor ? ` · ${e.actor.name}` : ''}
            </span>
          </p>
          {detail(e) && <p className="text-sm">{detail(e)}</p>}
          {e.reason && <p className="text-sm italic">Reason: {e.reason}</p>}
        </li>
      ))}
    </ol>
  );
}
