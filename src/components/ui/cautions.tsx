import { ShieldAlert, Building2 } from 'lucide-react';
import type { Caution } from '@shared/guidelines/cautions';
import { cn } from './cn';

/**
 * The safety cautions for a population, with the facility-policy line last. Shown wherever a
 * blanket is planned, logged or checked for a recipient.
 */
export function Cautions({ cautions, className, compact }: { cautions: Caution[]; className?: string; compact?: boolean }) {
  const specific = cautions.filter((c) => c.id !== 'facility-policy');
  const policy = cautions.find((c) => c.id === 'facility-policy');
  return (
    <section aria-label="Safety cautions" className={cn('space-y-3', className)}>
      {specific.length > 0 && (
        <div className="rounded-xl border-2 border-marigold-300 bg-marigold-100 p-4">
          <p className="mb-2 flex items-center gap-2 font-bold text-marigold-700">
            <ShieldAlert className="size-5" aria-hidden /> Safety first
          </p>
          <ul className="list-disc space-y-2 pl-5">
            {specific.map((c) => (
              <li key={c.id}>
                {c.text}
                {!compact && <span className="block text-sm text-ink-soft">Source: {c.source}</span>}
              </li>
            ))}
          </ul>
        </div>
      )}
      {policy && (
        <p className="flex items-start gap-2 text-ink-soft" data-testid="facility-policy">
          <Building2 className="mt-1 size-5 shrink-0" aria-hidden />
          {policy.text}
        </p>
      )}
    </section>
  );
}
