import { CheckCircle2, Wrench, XCircle } from 'lucide-react';
import { Cautions } from '@/components/ui/cautions';
import { joinWords } from '@shared/guidelines/wording';
import type { Verdict } from '@shared/schemas/guidelines';
import type { Caution } from '@shared/schemas/pledge';
import type { SelfCheck } from '../hooks/use-self-check';
import { CHECK_PENDING, SelfCheckFrame } from './self-check-frame';

/** The check's verdicts as a maker hears them at home, before anything is decided at intake. */
const VERDICT_FOR_MAKER: Record<Verdict, string> = {
  ready: 'Ready to go',
  mend: 'A small fix at home and it can go',
  reroute: 'As it is, it would go to another recipient instead',
  decline: 'As it is, it would be turned down',
};

/**
 * What the guideline check says about the blanket, in the maker's words: each problem, and how to
 * put it right at home where that can be done. Never blocks saving: the maker decides.
 */
export function SelfCheckPanel({
  outcome,
  cautions = [],
  className,
  viewer = 'maker',
  notes = [],
}: {
  outcome: SelfCheck;
  cautions?: Caution[];
  className?: string;
  /** The maker checks their own work; organisers see the same check on what the maker logged. */
  viewer?: 'maker' | 'staff';
  /** What the reader should know about what was checked, e.g. that it used the size measured at intake. */
  notes?: string[];
}) {
  return (
    <SelfCheckFrame viewer={viewer} className={className}>
      {outcome.state === 'pending' && <p className="text-ink-soft">{CHECK_PENDING}</p>}
      {outcome.state === 'incomplete' && <p className="text-ink-soft">Fill in {joinWords(outcome.missing)} and the check will tell you whether it meets the guidelines.</p>}

      {outcome.state === 'checked' && outcome.result.ok && (
        <p className="flex items-start gap-2 font-bold text-moss-700" data-testid="self-check-ok">
          <CheckCircle2 className="mt-0.5 size-6 shrink-0" aria-hidden /> It meets {outcome.recipient.name}’s guidelines.
        </p>
      )}
      {outcome.state === 'checked' && !outcome.result.ok && (
        <div className="space-y-3" data-testid="self-check-problems">
          <p className="font-bold text-brick-700">
            {VERDICT_FOR_MAKER[outcome.result.verdict]}: {outcome.result.reasons.length === 1 ? 'one thing' : `${outcome.result.reasons.length} things`} would be caught at intake for{' '}
            {outcome.recipient.name}.
          </p>
          <ul className="space-y-3">
            {outcome.result.reasons.map((r) => (
              <li key={r.rule} className="rounded-xl border border-brick-500/40 bg-brick-100 p-3">
                <p className="flex items-start gap-2">
                  <XCircle className="mt-1 size-5 shrink-0 text-brick-700" aria-hidden />
                  {r.message}
                </p>
                {r.fix && (
                  <p className="mt-2 flex items-start gap-2 font-bold">
                    <Wrench className="mt-1 size-5 shrink-0 text-heather-700" aria-hidden /> Fix at home: {r.fix}
                  </p>
                )}
              </li>
            ))}
          </ul>
          {outcome.result.alsoFits.length > 0 && <p>As it is, it would suit {joinWords(outcome.result.alsoFits.map((r) => r.name), 'or')}.</p>}
        </div>
      )}
      {outcome.state === 'checked' && outcome.result.notes.map((n) => <p key={n} className="text-ink-soft">{n}</p>)}
      {notes.map((n) => (
        <p key={n} className="text-ink-soft" data-testid="self-check-note">
          {n}
        </p>
      ))}

      {outcome.state === 'anywhere' &&
        (outcome.fits.length > 0 ? (
          <p className="flex items-start gap-2 font-bold text-moss-700" data-testid="self-check-ok">
            <CheckCircle2 className="mt-0.5 size-6 shrink-0" aria-hidden /> As it is, it would suit {joinWords(outcome.fits.map((r) => r.name), 'or')}.
          </p>
        ) : (
          <p className="font-bold text-brick-700" data-testid="self-check-problems">
            As it is, none of the recipients collecting now would take it.
            {outcome.nearly.length > 0 && ` A small fix at home would make it right for ${joinWords(outcome.nearly.map((r) => r.name), 'or')}.`}
          </p>
        ))}
      {cautions.length > 0 && <Cautions cautions={cautions} compact />}
    </SelfCheckFrame>
  );
}
