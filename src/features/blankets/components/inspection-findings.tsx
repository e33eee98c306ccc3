import { Ruler, Wrench, XCircle } from 'lucide-react';
import { formatDay } from '@/components/ui/format-day';
import { formatCm } from '@shared/guidelines/wording';
import type { BlanketDetail } from '@shared/schemas/blanket-log';

/**
 * What the organisers found at the drop-off table, while the blanket waits for a fix or was turned
 * away: their findings, what to do about each, their note and the size they measured.
 */
export function InspectionFindings({ blanket: b, isMaker }: { blanket: BlanketDetail; isMaker: boolean }) {
  const f = b.inspection;
  if (!f) return null;
  const fix = f.outcome === 'needs_fix';
  const measuredDiffers = b.measured && (b.measured.widthCm !== b.widthCm || b.measured.lengthCm !== b.lengthCm);
  return (
    <section
      aria-labelledby="findings-title"
      className="space-y-4 rounded-2xl border-2 border-brick-500/40 bg-white p-5 sm:p-6"
      data-testid="inspection-findings"
    >
      <h2 id="findings-title" className="flex items-center gap-2 text-xl font-bold text-ink">
        <Wrench className="size-6 shrink-0 text-brick-700" aria-hidden />
        {fix ? 'What to put right' : 'Why it was turned down'}
      </h2>
      <p className="text-ink-soft">
        Found at the drop-off table on {formatDay(f.at)}
        {f.recipientName ? `, checked for ${f.recipientName}` : ''}.
      </p>
      {f.findings.length > 0 && (
        <ul className="space-y-2">
          {f.findings.map((text) => (
            <li key={text} className="flex items-start gap-2">
              <XCircle className="mt-1 size-5 shrink-0 text-brick-700" aria-hidden /> {text}
            </li>
          ))}
        </ul>
      )}
      {f.fixes.length > 0 && (
        <div>
          <p className="font-bold">{isMaker ? 'What you can do' : 'What the maker can do'}</p>
          <ul className="mt-1 list-disc space-y-1 pl-6">
            {f.fixes.map((text) => (
              <li key={text}>{text}</li>
            ))}
          </ul>
        </div>
      )}
      {f.note && (
        <p className="rounded-xl bg-oat-100 p-3">
          <span className="font-bold">A note from the organiser: </span>
          {f.note}
        </p>
      )}
      {b.measured && (
        <p className="flex items-start gap-2" data-testid="measured-size">
          <Ruler className="mt-1 size-5 shrink-0 text-heather-700" aria-hidden />
          <span>
            Measured at the table: {formatCm(b.measured.widthCm)} × {formatCm(b.measured.lengthCm)} cm
            {measuredDiffers ? ` (logged as ${formatCm(b.widthCm)} × ${formatCm(b.lengthCm)} cm). The self-check uses the measured size.` : ', as logged.'}
          </span>
        </p>
      )}
      {fix && isMaker && <p>Once it is done, mark it as fixed below or bring it back to any drop-off point.</p>}
    </section>
  );
}
