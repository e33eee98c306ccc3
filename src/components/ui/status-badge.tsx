import { Badge, type Tone } from './badge';
import type { BlanketStatus } from '@shared/schemas/blanket';
import { STATUS_LABELS } from '@shared/blankets/status';

/**
 * The one colour table for a blanket's status, used wherever a status is shown: heather while the
 * maker has it, sky while it waits with the organisers, marigold when it needs a fix, brick when
 * declined, moss once it is checked and on its way.
 */
export const STATUS_TONES: Readonly<Record<BlanketStatus, Tone>> = {
  in_progress: 'neutral',
  finished: 'heather',
  booked: 'heather',
  received: 'sky',
  checked: 'moss',
  needs_fix: 'marigold',
  declined: 'brick',
  assigned: 'moss',
  packed: 'moss',
  delivered: 'moss',
};

export function StatusBadge({ status }: { status: BlanketStatus }) {
  return (
    <Badge tone={STATUS_TONES[status]} data-status={status}>
      {STATUS_LABELS[status]}
    </Badge>
  );
}
