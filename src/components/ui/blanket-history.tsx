import { STATUS_LABELS } from '@shared/blankets/status';
import type { BlanketStatus } from '@shared/schemas/blanket';
import type { BlanketHistoryEntry } from '@shared/schemas/intake-views';
import { formatMoment } from './format-day';
import { useDriveClock } from '@/lib/drive-clock';

/** One step of a blanket's history as both the maker's page and the intake page receive it. */
export type HistoryEvent = BlanketHistoryEntry;

const label = (s: string | null) => (s && s in STATUS_LABELS ? STATUS_LABELS[s as BlanketStatus] : null);
const plural = (n: number, one: string, many: string) => `${n} ${n === 1 ? one : many}`;

/** Words for the kinds of step that move no status; every kind the server writes has its own. */
const KIND_WORDS: Record<string, string> = {
  logged: 'Logged',
  edited: 'Log corrected',
  'photos-added': 'Photos added',
  'photo-removed': 'A photo removed',
  intake: 'Received',
  inspection: 'Checked',
  recipient: 'Recipient changed',
  assignment: 'Assigned',
  reassignment: 'Assignment changed',
  packing: 'Packed',
  run: 'Delivery run changed',
  delivery: 'Delivered',
  status: 'Status changed',
};

export function describeEvent(e: HistoryEvent): string {
  const d = (e.data ?? {}) as Record<string, unknown>;
  if (e.kind === 'logged') return `Logged as ${(label(e.toStatus) ?? STATUS_LABELS.in_progress).toLowerCase()}`;
  if (e.kind === 'edited') {
    const fields = (d.fields as string[] | undefined) ?? [];
    return `Log corrected${fields.length ? ` (${plural(fields.length, 'field', 'fields')})` : ''}`;
  }
  if (e.kind === 'photos-added') return `${plural(((d.photoIds as number[] | undefined) ?? []).length, 'photo', 'photos')} added`;
  if (e.toStatus && e.fromStatus && label(e.fromStatus) && label(e.toStatus)) return `${label(e.fromStatus)} → ${label(e.toStatus)}`;
  if (label(e.toStatus)) return label(e.toStatus)!;
  return KIND_WORDS[e.kind] ?? 'Updated';
}

/** What an intake or inspection step recorded beyond its status: where, the measured size, what to fix. */
export function eventDetail(e: HistoryEvent): string | null {
  const d = (e.data ?? {}) as Record<string, unknown>;
  if (e.kind === 'intake') {
    const m = d.measured as { widthCm: number; lengthCm: number } | undefined;
    const parts = [d.siteName ? `at ${String(d.siteName)}` : null, m ? `measured ${m.widthCm} × ${m.lengthCm} cm` : null, d.note ? String(d.note) : null];
    return parts.filter(Boolean).join(', ') || null;
  }
  if (e.kind === 'inspection') {
    const redirect = d.redirect as { toName?: string } | null;
    const fixes = (d.fixes as string[] | undefined) ?? [];
    const parts = [redirect?.toName ? `sent to ${redirect.toName}` : null, fixes.length ? `to fix: ${fixes.join(' ')}` : null, d.note ? String(d.note) : null];
    return parts.filter(Boolean).join('; ') || null;
  }
  return null;
}

/** Every step of the blanket's life, oldest first, with who took it, when, and why when they said. */
export function BlanketHistory({ events }: { events: HistoryEvent[] }) {
  const zone = useDriveClock().data?.timeZone;
  if (events.length === 0) return <p className="text-ink-soft">Nothing recorded yet.</p>;
  return (
    <>
      <ol className="space-y-3 border-l-4 border-heather-100 pl-5" data-testid="blanket-history" aria-label="History">
        {events.map((e) => {
          const detail = eventDetail(e);
          return (
            <li key={e.id} className="relative">
              <span className="absolute -left-[1.85rem] top-1.5 size-3 rounded-full border-2 border-white bg-heather-500" aria-hidden />
              <p className="font-bold">{describeEvent(e)}</p>
              <p className="text-sm text-ink-soft">
                {formatMoment(e.createdAt, zone)}
                {e.actor ? ` · ${e.actor.name}` : ''}
              </p>
              {detail && <p className="text-sm">{detail}</p>}
              {e.reason && <p className="mt-1 rounded-lg bg-oat-100 px-3 py-1">“{e.reason}”</p>}
            </li>
          );
        })}
      </ol>
      {zone && <p className="mt-3 text-sm text-ink-soft">Times are {zone} time, the drive's clock.</p>}
    </>
  );
}
