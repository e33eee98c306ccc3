import type { BlanketStatus } from '@shared/schemas/blanket';
import type { DriveProgress } from '@shared/schemas/pledge';
import { STATUS_LABELS } from '@shared/blankets/status';

export interface RecipientProgress {
  name: string;
  wanted: number;
  pledged: number;
  inHand: number;
  assigned: number;
}

/**
 * Wanted, pledged, in hand and assigned per recipient, as the server counted them (the same counts
 * as "What's needed" and the recipient pages), most wanted first.
 */
export function recipientProgress(rows: DriveProgress['recipients']): RecipientProgress[] {
  return [...rows]
    .sort((a, b) => b.wanted - a.wanted || a.name.localeCompare(b.name))
    .map((r) => ({ name: r.name, wanted: r.wanted, pledged: r.pledged, inHand: r.inHand, assigned: r.assigned }));
}

const ORDER: BlanketStatus[] = ['in_progress', 'finished', 'booked', 'received', 'needs_fix', 'declined', 'checked', 'assigned', 'packed', 'delivered'];

/** How many blankets stand at each step, in the order of a blanket's life, every step shown. */
export function statusCounts(counts: DriveProgress['statuses']): Array<{ status: BlanketStatus; label: string; count: number }> {
  const by = new Map(counts.map((c) => [c.status, c.count]));
  return ORDER.map((status) => ({ status, label: STATUS_LABELS[status], count: by.get(status) ?? 0 }));
}

const LINE_CHARS = 20;
const MAX_LINES = 3;

/** A recipient's name in lines of whole words, at most three; a longer name ends in "…". */
export function wrapName(name: string, lineChars = LINE_CHARS, maxLines = MAX_LINES): string[] {
  const lines: string[] = [];
  for (const word of name.split(/\s+/).filter(Boolean)) {
    const last = lines[lines.length - 1];
    if (last !== undefined && (last + ' ' + word).length <= lineChars) lines[lines.length - 1] = `${last} ${word}`;
    else lines.push(word);
  }
  if (lines.length <= maxLines) return lines;
  const kept = lines.slice(0, maxLines);
  const tail = kept[maxLines - 1]!;
  kept[maxLines - 1] = `${tail.length >= lineChars ? tail.slice(0, lineChars - 1) : tail}…`;
  return kept;
}
