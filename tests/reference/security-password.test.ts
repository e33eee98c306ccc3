import { describe, expect, it } from 'vitest';
import { hashPassword, verifyPassword } from '../../server/auth/password';
import { loadConfig } from '../../server/config/env';
import { PasswordSchema } from '@shared/schemas/user';

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

describe('password rules — NIST SP 800-63B via OWASP Authentication Cheat Sheet', () => {
  it('needs at least 8 characters', () => {
    expect(PasswordSchema.safeParse('1234567').success).toBe(false);
    expect(PasswordSchema.safeParse('12345678').success).toBe(true);
  });
  it('allows at least 64 characters and imposes no composition rules', () => {
    expect(PasswordSchema.safeParse('a'.repeat(64)).success).toBe(true);
    expect(PasswordSchema.safeParse('all lower case words only').success).toBe(true);
  });
});
