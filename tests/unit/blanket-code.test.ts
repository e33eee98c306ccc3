import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { CODE_ALPHABET, CODE_LENGTH, CODE_PREFIX, codeFromBytes, isBlanketCode, normaliseCode } from '@shared/blankets/code';

describe('blanket codes', () => {
  it('leaves out the look-alikes 0, O, 1 and I, and has 32 distinct symbols', () => {
    for (const c of ['0', 'O', '1', 'I']) expect(CODE_ALPHABET).not.toContain(c);
    expect(new Set(CODE_ALPHABET).size).toBe(32);
    expect(CODE_ALPHABET).toMatch(/^[2-9A-Z]+$/);
  });

  it('maps every byte value onto the alphabet evenly, so no symbol is more likely', () => {
    const counts = new Map<string, number>();
    for (let b = 0; b < 256; b++) {
      const sym = codeFromBytes(new Uint8Array([b, 0, 0, 0])).charAt(CODE_PREFIX.length);
      counts.set(sym, (counts.get(sym) ?? 0) + 1);
    }
    expect(counts.size).toBe(32);
    expect(new Set(counts.values())).toEqual(new Set([8]));
  });

  it('builds KL- and four symbols from four bytes (0 → 2, 1 → 3, 31 → Z, 32 wraps to 2)', () => {
    expect(codeFromBytes(new Uint8Array([0, 1, 31, 32]))).toBe('KL-23Z2');
    expect(() => codeFromBytes(new Uint8Array([1, 2]))).toThrow(/4 random bytes/);
  });

  it('always makes a valid code that survives being typed in lower case (property)', () => {
    fc.assert(
      fc.property(fc.uint8Array({ minLength: CODE_LENGTH, maxLength: 8 }), (bytes) => {
        const code = codeFromBytes(bytes);
        expect(isBlanketCode(code)).toBe(true);
        expect(normaliseCode(code.toLowerCase())).toBe(code);
        expect(normaliseCode(` ${code.slice(CODE_PREFIX.length).toLowerCase()} `)).toBe(code);
      }),
    );
  });

  it('tidies what people type from a tag and refuses what cannot be a code', () => {
    expect(normaliseCode('kl-7q4m')).toBe('KL-7Q4M');
    expect(normaliseCode('KL7Q4M')).toBe('KL-7Q4M');
    expect(normaliseCode('7q4m')).toBe('KL-7Q4M');
    expect(normaliseCode('KL-7Q 4M')).toBe('KL-7Q4M');
    // A bare code may itself start with K and L.
    expect(normaliseCode('klmn')).toBe('KL-KLMN');
    expect(normaliseCode('KL-7Q4O')).toBeNull();
    expect(normaliseCode('KL-7Q4')).toBeNull();
    expect(normaliseCode('KL-7Q4MM')).toBeNull();
    expect(normaliseCode('')).toBeNull();
  });
});
