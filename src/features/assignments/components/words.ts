import { sizeCategoryRow } from '@shared/guidelines/size-categories';
import type { SizeCategory } from '@shared/schemas/blanket';
import type { BoardNeed, Urgency } from '@shared/schemas/assignment';
import type { Tone } from '@/components/ui/badge';

export const sizeText = (c: SizeCategory | null) => (c ? sizeCategoryRow(c).label : 'no usual size');

/** "Willow Newborn Unit · preemie blanket": how a need is named in selects and messages. */
export const needLabel = (n: Pick<BoardNeed, 'recipientName' | 'sizeCategory'>) => `${n.recipientName} · ${sizeText(n.sizeCategory)}`;

export const URGENCY: Record<Urgency, { text: (days: number) => string; tone: Tone }> = {
  overdue: { text: (d) => `Overdue by ${-d} day${d === -1 ? '' : 's'}`, tone: 'brick' },
  soon: { text: (d) => (d === 0 ? 'Due today' : `Due in ${d} day${d === 1 ? '' : 's'}`), tone: 'marigold' },
  later: { text: (d) => `Due in ${d} days`, tone: 'moss' },
};
