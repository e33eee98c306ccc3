import { useState } from 'react';
import { Check, ImageOff } from 'lucide-react';
import { Button } from '@/components/ui/button';
import { Checkbox, Field, Select } from '@/components/ui/field';
import { Alert } from '@/components/ui/alert';
import { formatCm } from '@shared/guidelines/wording';
import type { BoardNeed, WaitingBlanket } from '@shared/schemas/assignment';
import { useAssignBlanket } from '../api/assign-blankets';
import { needLabel, sizeText } from './words';

/**
 * A checked blanket waiting for a recipient: what it is, and a choice of the needs it can go to.
 * Needs it cannot go to are listed too, greyed out, with the reasons one click away, so an
 * organiser sees why before trying.
 */
export function WaitingBlanketRow({ b, needs, selected, onSelect }: { b: WaitingBlanket; needs: BoardNeed[]; selected: boolean; onSelect: (on: boolean) => void }) {
  const fitting = needs.filter((n) => b.fits.find((f) => f.needId === n.needId)?.ok);
  const pledged = b.pledgedFor && fitting.some((n) => n.needId === b.pledgedFor!.needId) ? String(b.pledgedFor.needId) : '';
  const [needId, setNeedId] = useState(pledged);
  const assign = useAssignBlanket();
  const notFitting = needs.filter((n) => !b.fits.find((f) => f.needId === n.needId)?.ok);
  return (
    <li className="space-y-3 py-4" data-testid={`waiting-${b.code}`}>
      <div className="flex gap-2 sm:gap-3">
        <Checkbox label={<span className="sr-only">Select {b.code}</span>} checked={selected} onChange={(e) => onSelect(e.target.checked)} />
        {b.thumbnailUrl ? (
          <img src={b.thumbnailUrl} alt={`Blanket ${b.code}`} width={72} height={72} className="size-14 shrink-0 rounded-lg border border-oat-300 object-cover sm:size-18" loading="lazy" />
        ) : (
          <span className="flex size-14 shrink-0 items-center justify-center rounded-lg border border-dashed border-oat-300 bg-oat-100 text-ink-soft sm:size-18" title="No photo">
            <ImageOff className="size-6" aria-hidden />
            <span className="sr-only">No photo</span>
          </span>
        )}
        <div className="min-w-0">
          <p className="font-mono text-lg font-bold tracking-wider">{b.code}</p>
          <p>
            {formatCm(b.widthCm)} × {formatCm(b.lengthCm)} cm {b.measured ? '(measured)' : '(as logged)'}, {sizeText(b.sizeCategory)}
          </p>
          <p className="text-ink-soft">
            {b.colours || 'colours not given'} · yarn weight {b.yarnWeight}
            {b.site ? ` · at ${b.site.name}` : ''}
          </p>
          <p className="text-sm text-ink-soft">
            {b.pledgedFor ? `Pledged for ${b.pledgedFor.recipientName} (${sizeText(b.pledgedFor.sizeCategory)})` : 'Pledged for wherever it is needed most'}
          </p>
        </div>
      </div>
      {fitting.length === 0 ? (
        <p className="font-bold text-brick-700">No open need on the board takes it as it is.</p>
      ) : (
        <div className="flex flex-wrap items-end gap-2">
          <Field label={`Assign ${b.code} to`} className="min-w-0 flex-1 basis-64">
            {(f) => (
              <Select id={f.id} value={needId} onChange={(e) => setNeedId(e.target.value)}>
                <option value="">Choose a need…</option>
                {fitting.map((n) => (
                  <option key={n.needId} value={n.needId}>
                    {needLabel(n)} ({n.open} open)
                  </option>
                ))}
                {notFitting.length > 0 && (
                  <optgroup label="Does not fit">
                    {notFitting.map((n) => (
                      <option key={n.needId} value={n.needId} disabled>
                        {needLabel(n)}
                      </option>
                    ))}
                  </optgroup>
                )}
              </Select>
            )}
          </Field>
          <Button disabled={!needId} busy={assign.isPending} onClick={() => assign.mutate({ blanketId: b.id, needId: Number(needId) })}>
            <Check className="size-5" aria-hidden /> Assign
          </Button>
        </div>
      )}
      {notFitting.length > 0 && (
        <details>
          <summary className="cursor-pointer text-heather-700">Why it can’t go to {notFitting.length === 1 ? 'one need' : `${notFitting.length} needs`}</summary>
          <ul className="mt-2 space-y-2">
            {notFitting.map((n) => (
              <li key={n.needId}>
                <span className="font-bold">{needLabel(n)}:</span> {b.fits.find((f) => f.needId === n.needId)?.reasons.join(' ')}
              </li>
            ))}
          </ul>
        </details>
      )}
      {assign.error && <Alert kind="error">{assign.error.message}</Alert>}
    </li>
  );
}
