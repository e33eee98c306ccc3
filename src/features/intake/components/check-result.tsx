import { CheckCircle2, Info, Wrench, XCircle, ArrowRightLeft } from 'lucide-react';
import { VERDICT_TEXT } from '@shared/guidelines/wording';
import type { Verdict } from '@shared/schemas/guidelines';
import type { CheckAnswer } from '../api/check-blanket';
import { cn } from '@/components/ui/cn';

const look: Record<Verdict, { icon: typeof Info; box: string }> = {
  ready: { icon: CheckCircle2, box: 'border-moss-500/40 bg-moss-100 text-moss-700' },
  mend: { icon: Wrench, box: 'border-marigold-300 bg-marigold-100 text-marigold-700' },
  reroute: { icon: ArrowRightLeft, box: 'border-sky-700/30 bg-sky-100 text-sky-700' },
  decline: { icon: XCircle, box: 'border-brick-500/40 bg-brick-100 text-brick-700' },
};

/** The guideline check in plain words: the verdict, every failed rule, and where else it fits. */
export function CheckResult({ check }: { check: CheckAnswer }) {
  const { icon: Icon, box } = look[check.verdict];
  return (
    <section aria-label="Guideline check" className={cn('space-y-3 rounded-xl border-2 p-4', box)} data-testid="check-result">
      <div className="flex items-start gap-2">
        <Icon className="mt-0.5 size-6 shrink-0" aria-hidden />
        <p>
          <span className="block text-lg font-bold" data-testid="verdict">
            {VERDICT_TEXT[check.verdict]}
          </span>
          <span className="block text-ink">Checked against {check.recipient.name}</span>
        </p>
      </div>
      {check.reasons.length > 0 && (
        <ul className="list-disc space-y-2 pl-6 text-ink">
          {check.reasons.map((r) => (
            <li key={r.rule}>
              {r.message}
              {r.fix && <span className="block text-sm font-bold">Fix at home: {r.fix}</span>}
            </li>
          ))}
        </ul>
      )}
      {check.notes.map((n) => (
        <p key={n} className="text-ink">
          {n}
        </p>
      ))}
      {check.alsoFits.length > 0 && (
        <p className="text-ink">
          <strong>Fits as it is:</strong> {check.alsoFits.map((a) => a.name).join(', ')}
        </p>
      )}
      {check.alsoFitsAfterMend.length > 0 && (
        <p className="text-ink">
          <strong>Fits after a fix at home:</strong> {check.alsoFitsAfterMend.map((a) => a.name).join(', ')}
        </p>
      )}
    </section>
  );
}
