/** Ordinals as a maker counts stitches: 1st, 2nd, 3rd, 11th, 21st. */

/** "st", "nd", "rd" or "th" for a whole number (11th, 12th, 13th, 21st, 112th). */
export function ordinalSuffix(n: number): string {
  const mod100 = n % 100;
  if (mod100 >= 11 && mod100 <= 13) return 'th';
  switch (n % 10) {
    case 1:
      return 'st';
    case 2:
      return 'nd';
    case 3:
      return 'rd';
    default:
      return 'th';
  }
}

export function ordinal(n: number): string {
  return `${n}${ordinalSuffix(n)}`;
}
