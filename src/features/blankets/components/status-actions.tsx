import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { Field, Textarea } from '@/components/ui/field';
import { Alert } from '@/components/ui/alert';
import { serverFieldErrors } from '@/components/ui/form-errors';
import type { BlanketDetail, MoveView } from '../../../../shared/schemas/blanket-log';
import { MAX_REASON_LENGTH } from '../../../../shared/blankets/status';
import { useUpdateBlanket } from '../api/update-blanket';

/**
 * The moves this person may make from here. A backwards move asks for the reason first: the
 * server refuses one without, and the history keeps it.
 */
export function StatusActions({ blanket, onChanged }: { blanket: BlanketDetail; onChanged?: () => void }) {
  const update = useUpdateBlanket(onChanged);
  const [back, setBack] = useState<MoveView | null>(null);
  const [reason, setReason] = useState('');
  if (blanket.moves.length === 0) return null;
  const move = (m: MoveView, why?: string) =>
    update.mutate(
      { id: blanket.id, version: blanket.version, status: m.to, ...(why ? { reason: why } : {}) },
      {
        onSuccess: () => {
          setBack(null);
          setReason('');
        },
      },
    );
  const errors = serverFieldErrors(update.error);
  return (
    <div className="space-y-3">
      <div className="flex flex-wrap gap-2">
        {blanket.moves.map((m) => (
          <Button key={m.to} variant={m.direction === 'forward' ? 'primary' : 'secondary'} busy={update.isPending && update.variables?.status === m.to} onClick={() => (m.direction === 'back' ? setBack(m) : move(m))}>
            {m.action}
          </Button>
        ))}
      </div>
      {back && (
        <form
          className="space-y-3 rounded-xl border border-oat-200 bg-oat-50 p-4"
          onSubmit={(e) => {
            e.preventDefault();
            move(back, reason);
          }}
        >
          <Field label={`Why: ${back.action.toLowerCase()}?`} hint="Going back needs a reason; it is kept in the history." error={errors.reason}>
            {({ id, describedBy, invalid }) => (
              <Textarea id={id} value={reason} maxLength={MAX_REASON_LENGTH} onChange={(e) => setReason(e.target.value)} aria-describedby={describedBy} aria-invalid={invalid} required />
            )}
          </Field>
          <div className="flex gap-2">
            <Button type="submit" disabled={reason.trim() === ''} busy={update.isPending}>
              {back.action}
            </Button>
            <Button variant="quiet" onClick={() => setBack(null)}>
              Never mind
            </Button>
          </div>
        </form>
      )}
      {update.error && !errors.reason && <Alert kind="error">{update.error.message}</Alert>}
    </div>
  );
}
