import { describe, expect, it } from 'vitest';
import { hashPassword, verifyPassword } from '../../server/auth/password';
import { loadConfig } from '../../server/config/env';
import { PASSWORD_MIN_LENGTH, PasswordSchema } from '@shared/schemas/user';

describe('password storage — OWASP Password Storage Cheat Sheet (2026 text): scrypt N=2^17, r=8, p=1', () => {
  it('production default cost is N=2^17 (log2 17), r=8, p=1, recorded in the hash', async () => {
    expect(loadConfig({}).scryptLogN).toBe(17);
    const h = await hashPassword('correct horse battery staple');
    expect(h).toMatch(/^scrypt\$17\$8\$1\$[A-Za-z0-9_-]{22}\$[A-Za-z0-9_-]{43}$/);
    expect(await verifyPassword('correct horse battery staple', h)).toBe(true);
    expect(await verifyPassword('correct horse battery stapl', h)).toBe(false);
  });

  it('every hash gets its own salt', async () => {
    const [a, b] = await Promise.all([hashPassword('same words', 10), hashPassword('same words', 10)]);
    expect(a).not.toBe(b);
  });

  it('a hash made at a lower cost still verifies (its parameters travel with it)', async () => {
    const h = await hashPassword('older account', 12);
    expect(await verifyPassword('older account', h)).toBe(true);
  });
});

/**
 * NIST SP 800-63B-4, Digital Identity Guidelines: Authentication and Authenticator Management (final,
 * August 2025), section 3.1.1.2 "Password Verifiers": where a password is used as a single-factor
 * authenticator it SHALL be at least 15 characters (8 only when it is part of multi-factor
 * authentication); verifiers SHOULD permit at least 64; they SHALL NOT impose other composition rules;
 * each Unicode code point counts as one character. Kindloop signs in with a password alone.
 */
describe('password rules — NIST SP 800-63B-4 (2025), 3.1.1.2: single-factor passwords', () => {
  it('needs at least 15 characters where the password is the only factor', () => {
    expect(PASSWORD_MIN_LENGTH).toBe(15);
    expect(PasswordSchema.safeParse('fourteen chars').success).toBe(false);
    expect('fourteen chars'.length).toBe(14);
    expect(PasswordSchema.safeParse('fifteen chars!!').success).toBe(true);
    expect(PasswordSchema.safeParse('12345678').success).toBe(false);
  });
  it('counts each Unicode code point as one character', () => {
    // 15 emoji are 30 UTF-16 units but 15 code points: accepted; 14 of them are not, despite 28 units.
    expect(PasswordSchema.safeParse('🧶'.repeat(15)).success).toBe(true);
    expect(PasswordSchema.safeParse('🧶'.repeat(14)).success).toBe(false);
  });
  it('allows at least 64 characters and imposes no composition rules', () => {
    expect(PasswordSchema.safeParse('a'.repeat(64)).success).toBe(true);
    expect(PasswordSchema.safeParse('all lower case words only').success).toBe(true);
  });
  it('the demo accounts keep to the same minimum', () => {
    expect(loadConfig({}).demoPassword.length).toBeGreaterThanOrEqual(15);
    expect(() => loadConfig({ DEMO_PASSWORD: 'short-password' })).toThrow(/DEMO_PASSWORD/);
  });
});
