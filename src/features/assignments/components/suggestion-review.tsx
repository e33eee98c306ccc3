import { useMemo, useState } from 'react';
import { CheckCheck, X } from 'lucide-react';
import { Card, CardTitle } from '@/components/ui/card';
import { Button } from '@/components/ui/button';
import { Checkbox } from '@/components/ui/field';
import { Alert } from '@/components/ui/alert';
import type { BatchResult, Suggestion } from '@shared/schemas/assignment';
import { useAssignBatch } from '../api/assign-blankets';
import { sizeText } from './words';

/**
 * The suggestion as a list to review: every pair ticked to start with, each with its reasons; the
 * needs it leaves short and the blankets it leaves over, with why. Nothing changes until the
 * organiser accepts; then the ticked pairs go in one batch and come back applied or in conflict.
 */
export function SuggestionReview({ suggestion, onClose }: { suggestion: Suggestion; onClose: () => void }) {
  const [ticked, setTicked] = useState<Set<number>>(() => new Set(suggestion.pairs.map((p) => p.blanketId)));
  const [result, setResult] = useState<BatchResult | null>(null);
  const batch = useAssignBatch();
  const chosen = useMemo(() => suggestion.pairs.filter((p) => ticked.has(p.blanketId)), [suggestion, ticked]);
  const toggle = (id: number, on: boolean) =>
    setTicked((s) => {
      const next = new Set(s);
      if (on) next.add(id);
      else next.delete(id);
      return next;
    });
  const accept = () =>
    batch.mutate({ source: 'suggestion', pairs: chosen.map((p) => ({ blanketId: p.blanketId, needId: p.needId })) }, { onSuccess: setResult });

  if (result) {
    const conflicts = result.outcomes.filter((o) => !o.ok);
    return (
      <Card className="space-y-3" aria-live="polite">
        <CardTitle>Suggestion accepted</CardTitle>
        <Alert kind="success">
          {result.applied} blanket{result.applied === 1 ? '' : 's'} assigned.
        </Alert>
        {conflicts.length > 0 && (
          <Alert kind="warning" title={`${conflicts.length} could not be assigned`}>
            <ul className="list-disc pl-5">
              {conflicts.map((c) => (
                <li key={c.blanketId}>{c.message}</li>
              ))}
            </ul>
          </Alert>
        )}
        <Button variant="secondary" onClick={onClose}>
          Back to the board
        </Button>
      </Card>
    );
  }

  return (
    <Card className="space-y-4" aria-labelledby="suggestion-title">
      <div className="flex flex-wrap items-start justify-between gap-2">
        <CardTitle>
          <span id="suggestion-title">Suggested: {suggestion.pairs.length} blanket{suggestion.pairs.length === 1 ? '' : 's'} placed</span>
        </CardTitle>
        <Button variant="quiet" size="sm" onClick={onClose}>
          <X className="size-4" aria-hidden /> Close without changes
        </Button>
      </div>
      <p className="text-ink-soft">
        The most blankets the open needs can take, then the best fit by size, the maker’s pledge, the deadline and what each unit asked for. Untick any you want to place by hand.
      </p>
      {suggestion.pairs.length === 0 ? (
        <p>No waiting blanket fits an open need right now.</p>
      ) : (
        <>
          <div className="flex flex-wrap gap-2">
            <Button size="sm" variant="secondary" onClick={() => setTicked(new Set(suggestion.pairs.map((p) => p.blanketId)))}>
              Tick all
            </Button>
            <Button size="sm" variant="secondary" onClick={() => setTicked(new Set())}>
              Untick all
            </Button>
          </div>
          <ul className="max-h-[32rem] divide-y divide-oat-200 overflow-y-auto rounded-xl border border-oat-300 bg-white px-3" aria-label="Suggested pairs">
            {suggestion.pairs.map((p) => (
              <li key={p.blanketId} className="py-3">
                <Checkbox
                  checked={ticked.has(p.blanketId)}
                  onChange={(e) => toggle(p.blanketId, e.target.checked)}
                  label={
                    <span>
                      <span className="font-mono font-bold tracking-wider">{p.blanketCode}</span> → {p.recipientName}, {sizeText(p.sizeCategory)}
                      <span className="block text-sm text-ink-soft">{p.reasons.join(' · ')}</span>
                    </span>
                  }
                />
              </li>
            ))}
          </ul>
        </>
      )}
      {suggestion.short.length > 0 && (
        <details>
          <summary className="cursor-pointer font-bold">Needs left short ({suggestion.short.length})</summary>
          <ul className="mt-2 list-disc pl-5">
            {suggestion.short.map((s) => (
              <li key={s.needId}>
                {s.recipientName}, {sizeText(s.sizeCategory)}: {s.missing} more wanted
              </li>
            ))}
          </ul>
        </details>
      )}
      {suggestion.unplaced.length > 0 && (
        <details>
          <summary className="cursor-pointer font-bold">Blankets left over ({suggestion.unplaced.length})</summary>
          <ul className="mt-2 list-disc pl-5">
            {suggestion.unplaced.map((u) => (
              <li key={u.blanketId}>
                <span className="font-mono font-bold">{u.blanketCode}</span>: {u.reason}
              </li>
            ))}
          </ul>
        </details>
      )}
      {batch.error && <Alert kind="error">{batch.error.message}</Alert>}
      {suggestion.pairs.length > 0 && (
        <Button size="lg" disabled={chosen.length === 0} busy={batch.isPending} onClick={accept}>
          <CheckCheck className="size-5" aria-hidden /> Accept {chosen.length} ticked
        </Button>
      )}
    </Card>
  );
}
