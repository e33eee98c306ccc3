import { CalendarX2 } from 'lucide-react';
import type { SlotView } from '@shared/schemas/booking';
import { Field, Input } from '@/components/ui/field';
import { Loading } from '@/components/ui/spinner';
import { QueryError } from '@/components/ui/query-error';
import { EmptyState } from '@/components/ui/empty-state';
import { cn } from '@/components/ui/cn';
import { useSlots } from '../api/get-slots';
import { dayIn, timeIn } from './when';

/** One day of a site's slots: each shows how many places are left; full ones cannot be chosen. */
export function SlotPicker({
  siteId,
  day,
  onDay,
  chosen,
  onChoose,
  minDay,
}: {
  siteId: number;
  day: string;
  onDay: (day: string) => void;
  chosen: string | null;
  onChoose: (slot: SlotView) => void;
  minDay: string;
}) {
  const slots = useSlots(siteId, day, day);
  const zone = slots.data?.timeZone ?? 'UTC';
  return (
    <div className="space-y-3">
      <Field label="Day" hint={slots.data ? `Times are ${zone} time.` : undefined}>
        {({ id, describedBy }) => (
          <Input id={id} type="date" className="max-w-60" min={minDay} value={day} aria-describedby={describedBy} onChange={(e) => e.target.value && onDay(e.target.value)} />
        )}
      </Field>
      {slots.isPending ? (
        <Loading label="Finding free times…" />
      ) : slots.error ? (
        <QueryError error={slots.error} />
      ) : slots.data.slots.length === 0 ? (
        <EmptyState icon={CalendarX2} title={slots.data.closures[0] ? `Closed: ${slots.data.closures[0].note || 'no drop-offs this day'}` : 'No drop-off times this day'}>
          The site is not open for drop-offs on {dayIn(`${day}T12:00:00Z`, 'UTC')}. Try another day, or one of the soonest times above.
        </EmptyState>
      ) : (
        <ul className="grid grid-cols-2 gap-2 sm:grid-cols-3 lg:grid-cols-4" aria-label={`Times on ${dayIn(`${day}T12:00:00Z`, 'UTC')}`}>
          {slots.data.slots.map((s) => {
            const full = s.remaining === 0;
            const on = chosen === s.start;
            return (
              <li key={s.start}>
                <button
                  type="button"
                  disabled={full}
                  aria-pressed={on}
                  onClick={() => onChoose(s)}
                  className={cn(
                    'w-full rounded-xl border-2 px-3 py-2 text-left min-h-11',
                    full
                      ? 'cursor-not-allowed border-oat-200 bg-oat-100 text-ink-soft'
                      : on
                        ? 'border-heather-700 bg-heather-700 text-white hover:bg-heather-800'
                        : 'border-heather-300 bg-white hover:bg-heather-50',
                  )}
                >
                  <span className="block text-lg font-bold">{timeIn(s.start, zone)}</span>
                  <span className="block text-sm">{full ? 'Full' : s.remaining === 1 ? `1 place left of ${s.capacity}` : `${s.remaining} places left of ${s.capacity}`}</span>
                </button>
              </li>
            );
          })}
        </ul>
      )}
    </div>
  );
}
