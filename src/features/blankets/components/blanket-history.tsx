import { STATUS_LABELS } from '@shared/blankets/status';
import type { BlanketEventView } from '@shared/schemas/blanket-log';

const when = (iso: string) =>
  new Date(iso).toLocaleString('en-GB', { day: 'numeric', month: 'short', year: 'numeric', hour: '2-digit', minute: '2-digit' });

function describe(e: BlanketEventView): string {
  if (e.kind === 'logged') return `Logged as ${STATUS_LABELS[e.toStatus ?? 'in_progress'].toLowerCase()}`;
  if (e.toStatus && e.fromStatus) return `${STATUS_LABELS[e.fromStatus]} → ${STATUS_LABELS[e.toStatus]}`;
  if (e.toStatus) return STATUS_LABELS[e.toStatus];
  if (e.kind === 'edited') {
    const fields = (e.data as { fields?: string[] } | null)?.fields ?? [];
    return `Log corrected${fields.length ? ` (${fields.length} field${fields.length === 1 ? '' : 's'})` : ''}`;
  }
  if (e.kind === 'photos-added') {
    const n = ((e.data as { photoIds?: number[] } | null)?.photoIds ?? []).length;
    return `${n} photo${n === 1 ? '' : 's'} added`;
  }
  if (e.kind === 'photo-removed') return 'A photo removed';
  return e.kind;
}

/** Every step of the blanket's life, newest last, with who took it and why when they said. */
export function BlanketHistory({ events }: { events: BlanketEventView[] }) {
  return (
    <ol className="space-y-3 border-l-4 border-heather-100 pl-5" data-testid="blanket-history">
      {events.map((e) => (
        <li key={e.id} className="relative">
          <span className="absolute -left-[1.85rem] top-1.5 size-3 rounded-full border-2 border-white bg-heather-500" aria-hidden />
          <p className="font-bold">{describe(e)}</p>
          <p className="text-sm text-ink-soft">
            {when(e.createdAt)}
            {e.actor ? ` · ${e.actor.name}` : ''}
          </p>
          {e.reason && <p className="mt-1 rounded-lg bg-oat-100 px-3 py-1">“{e.reason}”</p>}
        </li>
      ))}
    </ol>
  );
}
