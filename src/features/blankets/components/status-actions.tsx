import { useState } from 'react';
import { Button, ButtonLink } from '@/components/ui/button';
import { Field, Select, Textarea } from '@/components/ui/field';
import { Alert } from '@/components/ui/alert';
import { serverFieldErrors } from '@/components/ui/form-errors';
import type { BlanketDetail, MoveView } from '@shared/schemas/blanket-log';
import { MAX_REASON_LENGTH } from '@shared/blankets/status';
import { useUpdateBlanket } from '../api/update-blanket';

export interface DropOffSite {
  id: number;
  name: string;
  address: string;
}

/**
 * The moves this person may make from here. A backwards move asks for the reason first: the
 * server refuses one without, and the history keeps it. Booking a drop-off asks where.
 */
export function StatusActions({ blanket, sites = [], onChanged }: { blanket: BlanketDetail; sites?: DropOffSite[]; onChanged?: () => void }) {
  const update = useUpdateBlanket(onChanged);
  const [back, setBack] = useState<MoveView | null>(null);
  const [booking, setBooking] = useState<MoveView | null>(null);
  const [reason, setReason] = useState('');
  const [siteId, setSiteId] = useState<string>(blanket.siteId ? String(blanket.siteId) : '');
  if (blanket.moves.length === 0 && !blanket.atIntake) return null;
  const move = (m: MoveView, extra: { reason?: string; siteId?: number } = {}) =>
    update.mutate(
      { id: blanket.id, version: blanket.version, status: m.to, ...extra },
      {
        onSuccess: () => {
          setBack(null);
          setBooking(null);
          setReason('');
        },
      },
    );
  const choose = (m: MoveView) => {
    if (m.direction === 'back') setBack(m);
    else if (m.to === 'booked' && sites.length > 0) setBooking(m);
    else move(m);
  };
  const errors = serverFieldErrors(update.error);
  return (
    <div className="space-y-3">
      <div className="flex flex-wrap gap-2">
        {blanket.atIntake && (
          <ButtonLink to={`/organiser/intake?code=${encodeURIComponent(blanket.code)}`}>Receive or inspect at intake</ButtonLink>
        )}
        {blanket.moves.map((m) => (
          <Button key={m.to} variant={m.direction === 'forward' ? 'primary' : 'secondary'} busy={update.isPending && update.variables?.status === m.to} onClick={() => choose(m)}>
            {m.action}
          </Button>
        ))}
      </div>
      {back && (
        <form
          className="space-y-3 rounded-xl border border-oat-200 bg-oat-50 p-4"
          onSubmit={(e) => {
            e.preventDefault();
            move(back, { reason });
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
      {booking && (
        <form
          className="space-y-3 rounded-xl border border-oat-200 bg-oat-50 p-4"
          aria-label="Book a drop-off"
          onSubmit={(e) => {
            e.preventDefault();
            move(booking, { siteId: Number(siteId) });
          }}
        >
          <Field label="Where will you bring it?" hint="The organisers look out for it there." error={errors.siteId}>
            {({ id, describedBy, invalid }) => (
              <Select id={id} value={siteId} onChange={(e) => setSiteId(e.target.value)} aria-describedby={describedBy} aria-invalid={invalid} required>
                <option value="">Choose a drop-off point</option>
                {sites.map((s) => (
                  <option key={s.id} value={s.id}>
                    {s.name}, {s.address}
                  </option>
                ))}
              </Select>
            )}
          </Field>
          <div className="flex gap-2">
            <Button type="submit" disabled={siteId === ''} busy={update.isPending}>
              Book it
            </Button>
            <Button variant="quiet" onClick={() => setBooking(null)}>
              Never mind
            </Button>
          </div>
        </form>
      )}
      {update.error && !errors.reason && !errors.siteId && <Alert kind="error">{update.error.message}</Alert>}
    </div>
  );
}
