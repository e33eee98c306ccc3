import type { ReactNode } from 'react';
import { ClipboardCheck } from 'lucide-react';
import { cn } from '@/components/ui/cn';

/**
 * The self-check's box and heading: the panel draws its findings inside it, and the blanket form
 * shows it with the cautions while the panel and the check are still loading.
 */
export function SelfCheckFrame({ viewer = 'maker', className, children }: { viewer?: 'maker' | 'staff'; className?: string; children: ReactNode }) {
  return (
    <section aria-labelledby="self-check-title" aria-live="polite" className={cn('space-y-4 rounded-2xl border-2 border-heather-300 bg-white p-5', className)} data-testid="self-check">
      <h2 id="self-check-title" className="flex items-center gap-2 text-xl font-bold">
        <ClipboardCheck className="size-6 text-heather-700" aria-hidden /> {viewer === 'maker' ? 'Self-check' : 'Guideline check on what the maker logged'}
      </h2>
      {children}
    </section>
  );
}

/** What the check says before it has loaded, a moment after the form has painted. */
export const CHECK_PENDING = 'Getting the check ready…';
