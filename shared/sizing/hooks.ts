/**
 * Crochet hook sizes, millimetres ↔ US letter/number. Millimetres are the stored value: they are
 * printed on every hook, while US labels vary by brand for the smallest sizes.
 */

export const HOOK_CHART_SOURCE =
  'Crochet hook sizes, mm ↔ US: from memory (no chart we can name was checked; the pairs match REFERENCES.md)';

export interface HookSize {
  mm: number;
  us: string;
  /** A millimetre size some brands print under the same US label. */
  brandVariantMm?: number;
}

export const HOOK_SIZES: readonly HookSize[] = [
  { mm: 2.25, us: 'B-1', brandVariantMm: 2.0 },
  { mm: 2.75, us: 'C-2', brandVariantMm: 2.5 },
  { mm: 3.25, us: 'D-3' },
  { mm: 3.5, us: 'E-4' },
  { mm: 3.75, us: 'F-5' },
  { mm: 4.0, us: 'G-6' },
  { mm: 4.5, us: '7' },
  { mm: 5.0, us: 'H-8' },
  { mm: 5.5, us: 'I-9' },
  { mm: 6.0, us: 'J-10' },
  { mm: 6.5, us: 'K-10½' },
  { mm: 8.0, us: 'L-11' },
  { mm: 9.0, us: 'M/N-13' },
  { mm: 10.0, us: 'N/P-15' },
  { mm: 15, us: 'P/Q' },
  { mm: 16, us: 'Q' },
];

/** Floating-point tolerance: "2.75" typed by a person must match 2.75 in the chart. */
const MM_TOLERANCE = 1e-6;

/** US label for a hook size, accepting the brand variants (2.0 → B-1, 2.5 → C-2). */
export function usLabelForMm(mm: number): string | undefined {
  const hit = HOOK_SIZES.find(
    (h) =>
      Math.abs(h.mm - mm) < MM_TOLERANCE ||
      (h.brandVariantMm !== undefined && Math.abs(h.brandVariantMm - mm) < MM_TOLERANCE),
  );
  return hit?.us;
}

// "K-10½", "k10.5", "K 10 1/2", "m/n 13", "7", "H8" all name one label.
function normaliseUs(label: string): string {
  return label
    .toUpperCase()
    .replace(/\s*1\/2/g, '½')
    .replace(/\.5/g, '½')
    .replace(/[\s-]/g, '');
}

/** Millimetres for a US label (the chart's size, not the brand variant). */
export function mmForUsLabel(label: string): number | undefined {
  const wanted = normaliseUs(label);
  return HOOK_SIZES.find((h) => normaliseUs(h.us) === wanted)?.mm;
}
