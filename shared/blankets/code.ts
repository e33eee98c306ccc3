/**
 * Short human codes printed on a blanket's tag, like KL-7Q4M. The alphabet leaves out 0/O and 1/I,
 * which people misread on a handwritten or faded tag. 32 symbols, so one random byte maps onto it
 * without bias (256 is a multiple of 32); 4 symbols give about a million codes for a drive.
 */
export const CODE_ALPHABET = '23456789ABCDEFGHJKLMNPQRSTUVWXYZ';
export const CODE_PREFIX = 'KL-';
export const CODE_LENGTH = 4;

const CODE_PATTERN = new RegExp(`^${CODE_PREFIX}[${CODE_ALPHABET}]{${CODE_LENGTH}}$`);

/** A code from random bytes (the server passes crypto-random ones); needs at least CODE_LENGTH bytes. */
export function codeFromBytes(bytes: Uint8Array): string {
  if (bytes.length < CODE_LENGTH) throw new Error(`A blanket code needs ${CODE_LENGTH} random bytes`);
  let body = '';
  for (let i = 0; i < CODE_LENGTH; i++) body += CODE_ALPHABET[bytes[i]! % CODE_ALPHABET.length];
  return CODE_PREFIX + body;
}

export const isBlanketCode = (s: string): boolean => CODE_PATTERN.test(s);

/**
 * What someone typed from a tag, tidied: upper case, no spaces, prefix added when left off.
 * Returns null when it cannot be a code, so a search box can say so instead of finding nothing.
 */
export function normaliseCode(input: string): string | null {
  const compact = input.trim().toUpperCase().replace(/[\s_]+/g, '');
  const bare = CODE_PREFIX.replace('-', '');
  const body = compact.startsWith(CODE_PREFIX)
    ? compact.slice(CODE_PREFIX.length)
    : compact.length === bare.length + CODE_LENGTH && compact.startsWith(bare)
      ? compact.slice(bare.length)
      : compact;
  const code = CODE_PREFIX + body;
  return isBlanketCode(code) ? code : null;
}

/** Pulls the code out of what a scanner or a paste gives us: the bare code or the tag's link. */
export function codeFromScan(input: string): string {
  const s = input.trim();
  const fromLink = /[?&]code=([A-Za-z0-9-]+)/.exec(s);
  return fromLink?.[1] ?? s;
}
