import type { ReactNode } from 'react';
import type { LucideIcon } from 'lucide-react';

/** What a person sees when a list has nothing in it yet: what it is for and what to do first. */
export function EmptyState({
  icon: Icon,
  title,
  children,
  action,
  as: Heading = 'h3',
}: {
  icon: LucideIcon;
  title: string;
  children?: ReactNode;
  action?: ReactNode;
  /** h1 when the empty state is the whole page (not found, not for your role). */
  as?: 'h1' | 'h2' | 'h3';
}) {
  return (
    <div className="flex flex-col items-center rounded-2xl border-2 border-dashed border-oat-300 bg-oat-50 px-6 py-10 text-center">
      <Icon className="mb-3 size-12 text-heather-500" aria-hidden />
      <Heading className="text-xl font-bold">{title}</Heading>
      {children && <div className="mt-2 max-w-prose text-ink-soft">{children}</div>}
      {action && <div className="mt-5">{action}</div>}
    </div>
  );
}
