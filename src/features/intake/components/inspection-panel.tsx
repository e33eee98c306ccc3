import { useMemo, useState } from 'react';
import { ClipboardCheck } from 'lucide-react';
import { Button } from '@/components/ui/button';
import { Checkbox, Field, Select, Textarea } from '@/components/ui/field';
import { Alert } from '@/components/ui/alert';
import { Cautions } from '@/components/ui/cautions';
import { Loading } from '@/components/ui/spinner';
import { cn } from '@/components/ui/cn';
import { ApiError } from '@/lib/api-client';
import { cautionsFor } from '@shared/guidelines/cautions';
import { featureLabel, fibreLabel, isInfantPopulation, yarnWeightName } from '@shared/guidelines/wording';
import { FEATURES, FIBRES, YARN_WEIGHTS, pickBlanketFields } from '@shared/schemas/blanket-values';
import type { BlanketFields, Feature, Fibre } from '@shared/schemas/blanket';
import type { Checklist, InspectionOutcome } from '@shared/schemas/intake';
import { CHECKLIST_ITEMS, OUTCOME_LABELS, suggestOutcome, type ChecklistKey } from '@shared/intake/rules';
import type { IntakeBlanketView } from '@shared/schemas/intake-views';
import { useCheckBlanket } from '../api/check-blanket';
import { useInspectBlanket } from '../api/inspect-blanket';
import { useIntakeRecipients } from '../api/get-intake-recipients';
import { CheckResult } from './check-result';

type Answers = Record<ChecklistKey, boolean | null>;
const unanswered = Object.fromEntries(CHECKLIST_ITEMS.map((i) => [i.key, null])) as Answers;

interface Choice {
  outcome: InspectionOutcome;
  redirectRecipientId?: number;
}
const sameChoice = (a: Choice | null, b: Choice | null) => !!a && !!b && a.outcome === b.outcome && a.redirectRecipientId === b.redirectRecipientId;

// The view carries fibres and features as plain strings; they came from a validated log.
const fieldsOf = (b: IntakeBlanketView): BlanketFields => ({ ...pickBlanketFields(b), fibres: b.fibres as Fibre[], features: b.features as Feature[] });

const toggle = <T,>(list: readonly T[], item: T, on: boolean): T[] => (on ? [...list.filter((x) => x !== item), item] : list.filter((x) => x !== item));

function YesNo({ label, value, onChange }: { label: string; value: boolean | null; onChange: (v: boolean) => void }) {
  const btn = (v: boolean, text: string) => (
    <button
      type="button"
      aria-pressed={value === v}
      onClick={() => onChange(v)}
      className={cn(
        'min-h-11 min-w-16 rounded-xl border-2 px-3 font-bold',
        value === v ? (v ? 'border-moss-700 bg-moss-700 text-white' : 'border-brick-700 bg-brick-700 text-white') : 'border-oat-300 bg-white hover:bg-oat-100',
      )}
    >
      {text}
    </button>
  );
  return (
    <div role="group" aria-label={label} className="flex items-center justify-between gap-3 border-b border-oat-200 py-2 last:border-0">
      <span className="font-bold">{label}</span>
      <span className="flex gap-2">
        {btn(true, 'Yes')}
        {btn(false, 'No')}
      </span>
    </div>
  );
}

/** The checklist, the pre-filled check, the suggested outcome and the organiser's decision. */
export function InspectionPanel({ blanket }: { blanket: IntakeBlanketView }) {
  const recipients = useIntakeRecipients();
  const inspect = useInspectBlanket();
  const logged = useMemo(() => fieldsOf(blanket), [blanket]);
  const [answers, setAnswers] = useState<Answers>(unanswered);
  const [fields, setFields] = useState<BlanketFields>(logged);
  const [targetId, setTargetId] = useState<number | null>(blanket.recipient?.id ?? null);
  const [picked, setPicked] = useState<Choice | null>(null);
  const [overrideReason, setOverrideReason] = useState('');
  const [fixNote, setFixNote] = useState('');
  const [note, setNote] = useState('');

  const check = useCheckBlanket(targetId, fields);
  const allAnswered = CHECKLIST_ITEMS.every((i) => answers[i.key] !== null);
  const checklist = answers as Checklist;
  const suggestion = allAnswered && check.data ? suggestOutcome(checklist, check.data, check.data.guidelines) : null;
  const suggestedChoice: Choice | null = suggestion
    ? { outcome: suggestion.outcome, redirectRecipientId: suggestion.redirectRecipientId ?? undefined }
    : null;
  const choice = picked ?? suggestedChoice;

  const physicalProblem = CHECKLIST_ITEMS.some((i) => i.key !== 'matchesLog' && answers[i.key] === false);
  const fitsAsIs = (id: number | undefined) => !!check.data?.alsoFits.some((a) => a.recipientId === id);
  const needsReason =
    !!choice &&
    !!suggestion &&
    (choice.outcome === 'redirect' ? !fitsAsIs(choice.redirectRecipientId) || physicalProblem : choice.outcome !== suggestion.outcome);

  const corrections = Object.fromEntries(
    (Object.keys(fields) as Array<keyof BlanketFields>)
      .filter((k) => JSON.stringify(fields[k]) !== JSON.stringify(logged[k]))
      .map((k) => [k, fields[k]]),
  ) as Partial<BlanketFields>;
  const hasCorrections = Object.keys(corrections).length > 0;

  const serverErrors: Record<string, string> = {};
  if (inspect.error instanceof ApiError) for (const i of inspect.error.issues) serverErrors[i.path] ??= i.message;

  const redirectTarget = choice?.outcome === 'redirect' ? recipients.data?.find((r) => r.id === choice.redirectRecipientId) : undefined;
  const others = (recipients.data ?? []).filter((r) => r.id !== targetId);

  const submit = () => {
    if (!choice) return;
    inspect.mutate({
      id: blanket.id,
      checklist,
      corrections: answers.matchesLog === false && hasCorrections ? corrections : undefined,
      recipientId: blanket.recipient ? undefined : (targetId ?? undefined),
      outcome: choice.outcome,
      redirectRecipientId: choice.outcome === 'redirect' ? choice.redirectRecipientId : undefined,
      overrideReason: needsReason || overrideReason ? overrideReason || undefined : undefined,
      fixNote: choice.outcome === 'needs_fix' && fixNote ? fixNote : undefined,
      note: note || undefined,
      version: blanket.version,
    });
  };

  const outcomeButton = (c: Choice, label: string) => {
    const isSuggested = sameChoice(c, suggestedChoice);
    const isChosen = sameChoice(c, choice);
    return (
      <button
        key={`${c.outcome}-${c.redirectRecipientId ?? ''}`}
        type="button"
        aria-pressed={isChosen}
        onClick={() => setPicked(c)}
        className={cn(
          'flex min-h-14 flex-col items-start rounded-xl border-2 px-4 py-2 text-left font-bold',
          isChosen ? 'border-heather-700 bg-heather-700 text-white' : 'border-heather-300 bg-white text-heather-800 hover:bg-heather-50',
        )}
      >
        {label}
        {isSuggested && <span className={cn('text-sm font-normal', isChosen ? 'text-white' : 'text-ink-soft')}>suggested</span>}
      </button>
    );
  };

  return (
    <div className="space-y-6">
      {!blanket.recipient && (
        <Field label="Check it against" hint="Pledged for wherever it's needed most: choose the recipient to check it for." error={serverErrors.recipientId}>
          {(a) => (
            <Select id={a.id} value={targetId ?? ''} onChange={(e) => setTargetId(e.target.value ? Number(e.target.value) : null)}>
              <option value="">Choose a recipient…</option>
              {(recipients.data ?? []).map((r) => (
                <option key={r.id} value={r.id}>
                  {r.name}
                </option>
              ))}
            </Select>
          )}
        </Field>
      )}

      <section aria-labelledby="checklist-title">
        <div className="mb-2 flex flex-wrap items-center justify-between gap-2">
          <h3 id="checklist-title" className="text-lg font-bold">
            On the table
          </h3>
          <Button size="sm" variant="secondary" onClick={() => setAnswers(Object.fromEntries(CHECKLIST_ITEMS.map((i) => [i.key, true])) as Answers)}>
            All six are fine
          </Button>
        </div>
        <div className="rounded-xl border border-oat-200 bg-white px-4">
          {CHECKLIST_ITEMS.map((item) => (
            <YesNo key={item.key} label={item.label} value={answers[item.key]} onChange={(v) => setAnswers((a) => ({ ...a, [item.key]: v }))} />
          ))}
        </div>
      </section>

      {answers.matchesLog === false && (
        <section aria-labelledby="corrections-title" className="space-y-4 rounded-xl border-2 border-marigold-300 bg-marigold-100/40 p-4">
          <h3 id="corrections-title" className="text-lg font-bold">
            What differs from the log?
          </h3>
          {serverErrors.corrections && <Alert kind="error">{serverErrors.corrections}</Alert>}
          <fieldset>
            <legend className="mb-1 font-bold">Features it really has</legend>
            <div className="grid gap-x-4 sm:grid-cols-2">
              {FEATURES.map((f) => (
                <Checkbox key={f} label={featureLabel(f)} checked={fields.features.includes(f)} onChange={(e) => setFields((x) => ({ ...x, features: toggle(x.features, f, e.target.checked) }))} />
              ))}
            </div>
          </fieldset>
          <fieldset>
            <legend className="mb-1 font-bold">Fibres</legend>
            <div className="grid grid-cols-2 gap-x-4 sm:grid-cols-3">
              {FIBRES.map((f) => (
                <Checkbox key={f} label={fibreLabel(f)} checked={fields.fibres.includes(f)} onChange={(e) => setFields((x) => ({ ...x, fibres: toggle(x.fibres, f, e.target.checked) }))} />
              ))}
            </div>
          </fieldset>
          <Field label="Yarn weight">
            {(a) => (
              <Select id={a.id} className="max-w-xs" value={fields.yarnWeight} onChange={(e) => setFields((x) => ({ ...x, yarnWeight: Number(e.target.value) }))}>
                {YARN_WEIGHTS.map((w) => (
                  <option key={w} value={w}>
                    {w} · {yarnWeightName(w)}
                  </option>
                ))}
              </Select>
            )}
          </Field>
          <div className="grid gap-x-4 sm:grid-cols-2">
            {(
              [
                ['machineWashable', 'Machine washable'],
                ['dryerSafe', 'Dryer safe'],
                ['smokeFree', 'From a smoke-free home'],
                ['petFree', 'From a pet-free home'],
                ['newYarn', 'New yarn'],
              ] as const
            ).map(([k, label]) => (
              <Checkbox key={k} label={label} checked={fields[k]} onChange={(e) => setFields((x) => ({ ...x, [k]: e.target.checked }))} />
            ))}
          </div>
        </section>
      )}

      <section aria-label="Check result" className="space-y-3">
        {targetId === null ? (
          <p className="text-ink-soft">Choose a recipient to run the check.</p>
        ) : check.isPending ? (
          <Loading label="Checking against the guidelines…" />
        ) : check.error ? (
          <Alert kind="error">{check.error.message}</Alert>
        ) : (
          <>
            <CheckResult check={check.data} />
            {/* The page already shows the cautions for where it was meant to go. */}
            {!blanket.recipient && <Cautions cautions={check.data.cautions} compact />}
          </>
        )}
      </section>

      <section aria-labelledby="outcome-title" className="space-y-4">
        <h3 id="outcome-title" className="text-lg font-bold">
          Outcome
        </h3>
        {!allAnswered ? (
          <p className="text-ink-soft">Answer the six questions above and the suggested outcome appears here.</p>
        ) : suggestion ? (
          <>
            <div className="rounded-xl bg-oat-100 p-4" data-testid="suggestion">
              <p>
                Suggested: <strong>{suggestion.outcome === 'redirect' ? `Send to ${check.data?.alsoFits[0]?.name}` : OUTCOME_LABELS[suggestion.outcome]}</strong>
              </p>
              {suggestion.because.length > 0 && (
                <ul className="mt-1 list-disc pl-5 text-sm">
                  {suggestion.because.map((b) => (
                    <li key={b}>{b}</li>
                  ))}
                </ul>
              )}
            </div>
            <div className="flex flex-wrap gap-2" role="group" aria-label="Choose the outcome">
              {outcomeButton({ outcome: 'checked' }, OUTCOME_LABELS.checked)}
              {outcomeButton({ outcome: 'needs_fix' }, OUTCOME_LABELS.needs_fix)}
              {outcomeButton({ outcome: 'declined' }, OUTCOME_LABELS.declined)}
              {check.data?.verdict !== 'ready' &&
                check.data?.alsoFits.map((a) => outcomeButton({ outcome: 'redirect', redirectRecipientId: a.recipientId }, `Send to ${a.name}`))}
            </div>
            <Field label="Or send it somewhere else" hint="Where the guidelines don't take it as it is, say why below.">
              {(a) => (
                <Select
                  id={a.id}
                  className="max-w-md"
                  value={choice?.outcome === 'redirect' && (check.data?.verdict === 'ready' || !fitsAsIs(choice.redirectRecipientId)) ? String(choice.redirectRecipientId) : ''}
                  onChange={(e) => e.target.value && setPicked({ outcome: 'redirect', redirectRecipientId: Number(e.target.value) })}
                >
                  <option value="">Choose…</option>
                  {others.map((r) => (
                    <option key={r.id} value={r.id}>
                      {r.name}
                    </option>
                  ))}
                </Select>
              )}
            </Field>
            {redirectTarget && isInfantPopulation(redirectTarget.population) && (
              <Cautions cautions={cautionsFor(redirectTarget.population)} compact />
            )}
            {choice?.outcome === 'needs_fix' && (
              <div className="space-y-2">
                {suggestion.fixes.length > 0 && (
                  <div>
                    <p className="font-bold">The maker will be asked to:</p>
                    <ul className="list-disc pl-5">
                      {suggestion.fixes.map((f) => (
                        <li key={f}>{f}</li>
                      ))}
                    </ul>
                  </div>
                )}
                <Field label="A note to the maker" hint={suggestion.fixes.length ? 'Optional: a kind word, or more detail.' : 'Say what needs doing.'} error={serverErrors.fixNote}>
                  {(a) => <Textarea id={a.id} aria-invalid={a.invalid} aria-describedby={a.describedBy} value={fixNote} onChange={(e) => setFixNote(e.target.value)} />}
                </Field>
              </div>
            )}
            {needsReason && (
              <Field label="Why not the suggested outcome?" hint="Kept on the blanket's history." error={serverErrors.overrideReason}>
                {(a) => <Textarea id={a.id} aria-invalid={a.invalid} aria-describedby={a.describedBy} value={overrideReason} onChange={(e) => setOverrideReason(e.target.value)} />}
              </Field>
            )}
            <Field
              label={answers.matchesLog === false && !hasCorrections ? 'What differs from the log' : 'Note for the history (optional)'}
              hint={answers.matchesLog === false && !hasCorrections ? 'Tick what differs above, or describe it here.' : undefined}
              error={serverErrors.note}
            >
              {(a) => <Textarea id={a.id} className="min-h-16" value={note} onChange={(e) => setNote(e.target.value)} />}
            </Field>
            {inspect.error && <Alert kind="error">{inspect.error.message}</Alert>}
            <Button size="lg" busy={inspect.isPending} disabled={!choice || (needsReason && overrideReason.trim() === '')} onClick={submit}>
              <ClipboardCheck className="size-5" aria-hidden /> Record: {choice?.outcome === 'redirect' ? `send to ${others.find((r) => r.id === choice.redirectRecipientId)?.name ?? check.data?.alsoFits.find((x) => x.recipientId === choice.redirectRecipientId)?.name ?? 'another recipient'}` : choice ? OUTCOME_LABELS[choice.outcome].toLowerCase() : '…'}
            </Button>
          </>
        ) : (
          <Loading label="Working out the suggestion…" />
        )}
      </section>
    </div>
  );
}
