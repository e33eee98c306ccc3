import { cn } from './cn';

/** A labelled progress bar; `value` is 0..1. Used for uploads, exports and pledged-vs-wanted. */
export function ProgressBar({ value, label, tone = 'heather', showPercent = true, className }: { value: number; label: string; tone?: 'heather' | 'moss' | 'marigold'; showPercent?: boolean; className?: string }) {
  const pct = Math.round(Math.max(0, Math.min(1, value)) * 100);
  const fill = { heather: 'bg-heather-500', moss: 'bg-moss-500', marigold: 'bg-marigold-400' }[tone];
  return (
    <div className={cn('w-full', className)}>
      <div className="mb-1 flex justify-between text-sm">
        <span>{label}</span>
        {showPercent && <span className="font-bold">{pct}%</span>}
      </div>
      <div role="progressbar" aria-label={label} aria-valuemin={0} aria-valuemax={100} aria-valuenow={pct} className="h-3 w-full overflow-hidden rounded-full bg-oat-200">
        <div className={cn('h-full rounded-full transition-[width] duration-200', fill)} style={{ width: `${pct}%` }} />
      </div>
    </div>
  );
}
