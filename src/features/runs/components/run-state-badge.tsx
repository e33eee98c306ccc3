import { Badge, type Tone } from '@/components/ui/badge';
import { RUN_STATE_LABELS } from '@shared/schemas/run-values';
import type { RunState, StopState } from '@shared/schemas/run';

const RUN_TONES: Record<RunState, Tone> = { empty: 'neutral', planned: 'heather', packed: 'marigold', 'partly-delivered': 'sky', delivered: 'moss' };

export function RunStateBadge({ state }: { state: RunState }) {
  return <Badge tone={RUN_TONES[state]}>{RUN_STATE_LABELS[state]}</Badge>;
}

const STOP: Record<StopState, { tone: Tone; label: string }> = {
  planned: { tone: 'heather', label: 'To pack' },
  packed: { tone: 'marigold', label: 'Packed' },
  delivered: { tone: 'moss', label: 'Delivered' },
};

export function StopStateBadge({ state }: { state: StopState }) {
  return <Badge tone={STOP[state].tone}>{STOP[state].label}</Badge>;
}

/** "3.4 km", or a dash when a pin is missing. */
export const km = (v: number | null) => (v === null ? '–' : `${v.toFixed(1)} km`);
