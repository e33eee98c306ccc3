import { usToUkText } from '@shared/sizing/stitch-names';
import type { Terms } from '../hooks/use-planner';

/** Every stitch name on the planner is written in US terms and shown in the maker's chosen terms. */
export const inTerms = (text: string, terms: Terms) => (terms === 'uk' ? usToUkText(text) : text);

export function formatLength(value: number, unit: 'cm' | 'in'): string {
  const rounded = unit === 'cm' ? Math.round(value) : Math.round(value * 2) / 2;
  return `${rounded.toLocaleString('en-GB')} ${unit}`;
}

export const signed = (n: number) => (n > 0 ? `+${n}` : n < 0 ? `−${-n}` : '0');
