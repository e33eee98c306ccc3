import { Check } from 'lucide-react';
import { cn } from '@/components/ui/cn';
import type { BlanketStatus } from '@shared/schemas/blanket';
import { STATUS_LABELS, timeline, type TimelineStep } from '@shared/blankets/status';

const stateWords = { done: 'done', current: 'now', upcoming: 'still to come' } as const;

function dotClass(s: TimelineStep, status: BlanketStatus, compact: boolean) {
  return cn(
    'flex shrink-0 items-center justify-center rounded-full border-2',
    compact ? 'size-3' : 'size-7',
    s.state === 'done' && 'border-moss-500 bg-moss-500 text-white',
    s.state === 'current' && !s.branch && 'border-heather-700 bg-heather-700 text-white ring-4 ring-heather-100',
    s.state === 'current' && status === 'needs_fix' && 'border-marigold-700 bg-marigold-400 text-ink ring-4 ring-marigold-100',
    s.state === 'current' && status === 'declined' && 'border-brick-700 bg-brick-500 text-white ring-4 ring-brick-100',
    s.state === 'upcoming' && 'border-oat-300 bg-white',
  );
}

/**
 * A small stepper of the blanket's life. `compact` draws dots only (for table rows); the full one
 * names every step, across on wide screens and down on phones. A fix or a decline sits on its own
 * branch, in a warning colour.
 */
export function StatusTimeline({ status, compact = false, className }: { status: BlanketStatus; compact?: boolean; className?: string }) {
  const steps = timeline(status);
  if (compact) {
    return (
      <ol aria-label={`Status: ${STATUS_LABELS[status]}`} className={cn('flex items-center', className)} data-testid="status-timeline">
        {steps.map((s, i) => (
          <li key={s.status} className="flex items-center" aria-current={s.state === 'current' ? 'step' : undefined}>
            <span className={dotClass(s, status, true)} title={`${s.label}: ${stateWords[s.state]}`} />
            <span className="sr-only">
              {s.label}, {stateWords[s.state]}
            </span>
            {i < steps.length - 1 && <span aria-hidden className={cn('h-0.5 w-1.5', steps[i + 1]!.state === 'upcoming' ? 'bg-oat-300' : 'bg-moss-500')} />}
          </li>
        ))}
      </ol>
    );
  }
  return (
    <ol aria-label={`Status: ${STATUS_LABELS[status]}`} className={cn('flex flex-col gap-2 sm:flex-row sm:gap-0', className)} data-testid="status-timeline">
      {steps.map((s, i) => (
        <li key={s.status} className="flex items-center gap-3 sm:flex-1 sm:items-start sm:gap-0 sm:last:flex-none" aria-current={s.state === 'current' ? 'step' : undefined}>
          <div className="flex items-center gap-3 sm:w-7 sm:flex-col sm:gap-1">
            <span className={dotClass(s, status, false)}>{s.state === 'done' && <Check className="size-4" aria-hidden />}</span>
            <span className={cn('text-sm leading-tight sm:w-16 sm:text-center sm:text-xs', s.state === 'current' ? 'font-bold text-ink' : 'text-ink-soft')}>
              {s.label}
              <span className="sr-only">, {stateWords[s.state]}</span>
            </span>
          </div>
          {i < steps.length - 1 && (
            <span aria-hidden className={cn('mt-3 hidden h-1 flex-1 sm:block', steps[i + 1]!.state === 'upcoming' ? 'bg-oat-300' : 'bg-moss-500')} />
          )}
        </li>
      ))}
    </ol>
  );
}
