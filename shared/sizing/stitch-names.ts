/**
 * US ↔ UK stitch names. The same abbreviation means different stitches on each side of the
 * Atlantic ("dc" is a US double but a UK treble), so conversion must map each token once and
 * never feed its output back in.
 */

export const US_UK_SOURCE = 'US ↔ UK stitch names: from memory (REFERENCES.md, crochet conventions; no handbook checked)';

export type UsStitch = 'sc' | 'hdc' | 'dc' | 'tr' | 'dtr';

/** The four pairs REFERENCES.md gives: US sc = UK dc, hdc = htr, dc = tr, tr = dtr. */
export const US_TO_UK_REFERENCED: Readonly<Record<Exclude<UsStitch, 'dtr'>, string>> = {
  sc: 'dc',
  hdc: 'htr',
  dc: 'tr',
  tr: 'dtr',
};

/**
 * US dtr is the UK triple treble: from memory, not in the reference list. Kept apart so the
 * reference test checks only what the reference states.
 */
export const US_TO_UK_FROM_MEMORY: Readonly<Record<'dtr', string>> = { dtr: 'trtr' };

export const US_TO_UK: Readonly<Record<UsStitch, string>> = { ...US_TO_UK_REFERENCED, ...US_TO_UK_FROM_MEMORY };

export const UK_TO_US: Readonly<Record<string, UsStitch>> = Object.fromEntries(
  (Object.entries(US_TO_UK) as [UsStitch, string][]).map(([us, uk]) => [uk, us]),
) as Record<string, UsStitch>;

// Letters-only boundaries so "sc2tog" and "4-dc" convert while "scallop" and "treble" do not.
// Longest alternatives first so "hdc" is never read as "dc".
const US_TOKEN = /(?<![A-Za-z])(dtr|hdc|sc|dc|tr)(?![A-Za-z])/gi;
const UK_TOKEN = /(?<![A-Za-z])(trtr|dtr|htr|dc|tr)(?![A-Za-z])/gi;

function keepCase(original: string, replacement: string): string {
  if (original === original.toUpperCase()) return replacement.toUpperCase();
  if (original[0] === original[0]!.toUpperCase()) return replacement[0]!.toUpperCase() + replacement.slice(1);
  return replacement;
}

/** Rewrite a US-terms instruction in UK terms, one token at a time (no cascading). */
export function usToUkText(text: string): string {
  return text.replace(US_TOKEN, (token) => keepCase(token, US_TO_UK[token.toLowerCase() as UsStitch]));
}

/** The reverse, for instructions a maker pastes in UK terms. */
export function ukToUsText(text: string): string {
  return text.replace(UK_TOKEN, (token) => keepCase(token, UK_TO_US[token.toLowerCase()]!));
}
