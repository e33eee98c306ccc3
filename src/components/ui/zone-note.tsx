import { Clock } from 'lucide-react';
import { cn } from './cn';

/** Names the drive's time zone once on a page that shows times. */
export function ZoneNote({ zone, className }: { zone: string | undefined; className?: string }) {
  if (!zone) return null;
  return (
    <p className={cn('flex items-center gap-2 text-ink-soft', className)} data-testid="zone-note">
      <Clock className="size-5 shrink-0" aria-hidden />
      <span>
        Times are <strong className="text-ink">{zone}</strong> time, the drive's clock.
      </span>
    </p>
  );
}
