import type { ReactNode } from 'react';
import { AlertTriangle, CheckCircle2, Info, ShieldAlert } from 'lucide-react';
import { cn } from './cn';

type Kind = 'info' | 'success' | 'warning' | 'error';
const styles: Record<Kind, string> = {
  info: 'border-sky-700/30 bg-sky-100 text-sky-700',
  success: 'border-moss-500/40 bg-moss-100 text-moss-700',
  warning: 'border-marigold-300 bg-marigold-100 text-marigold-700',
  error: 'border-brick-500/40 bg-brick-100 text-brick-700',
};
const icons = { info: Info, success: CheckCircle2, warning: AlertTriangle, error: ShieldAlert };

export function Alert({ kind = 'info', title, children, className }: { kind?: Kind; title?: string; children?: ReactNode; className?: string }) {
  const Icon = icons[kind];
  return (
    <div role={kind === 'error' ? 'alert' : 'status'} className={cn('flex gap-3 rounded-xl border-2 p-4', styles[kind], className)}>
      <Icon className="mt-0.5 size-6 shrink-0" aria-hidden />
      <div className="min-w-0 flex-1 space-y-1">
        {title && <p className="font-bold">{title}</p>}
        {children && <div className="text-ink">{children}</div>}
      </div>
    </div>
  );
}
