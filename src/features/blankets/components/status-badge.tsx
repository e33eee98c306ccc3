import { Badge, type Tone } from '@/components/ui/badge';
import type { BlanketStatus } from '@shared/schemas/blanket';
import { STATUS_LABELS } from '@shared/blankets/status';

const TONES: Record<BlanketStatus, Tone> = {
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
  return <Badge tone={TONES[status]}>{STATUS_LABELS[status]}</Badge>;
}
