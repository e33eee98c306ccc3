import { randomBytes, scrypt as scryptCb, timingSafeEqual, type ScryptOptions } from 'node:crypto';

function scrypt(password: string, salt: Buffer, keylen: number, opts: ScryptOptions): Promise<Buffer> {
  return new Promise((resolve, reject) =>
    scryptCb(password, salt, keylen, opts, (err, key) => (err ? reject(err) : resolve(key))),
  );
}

const KEY_LENGTH = 32;

/**
 * scrypt at the OWASP Password Storage Cheat Sheet's parameters (N=2^17, r=8, p=1) in production.
 * The stored string records N, r and p, so the cost can be raised later and old hashes still verify.
 * Format: scrypt$<log2N>$<r>$<p>$<salt b64url>$<key b64url>
 */
export async function hashPassword(password: string, logN = 17): Promise<string> {
  const salt = randomBytes(16);
  const r = 8;
  const p = 1;
  const key = await scrypt(password.normalize('NFC'), salt, KEY_LENGTH, scryptOptions(logN, r, p));
  return ['scrypt', logN, r, p, salt.toString('base64url'), key.toString('base64url')].join('$');
}

function scryptOptions(logN: number, r: number, p: number): ScryptOptions {
  const N = 2 ** logN;
  // Node's default maxmem (32 MiB) is below what N=2^17, r=8 needs (128 * N * r bytes = 128 MiB).
  return { N, r, p, maxmem: 128 * N * r * p + 16 * 1024 * 1024 };
}

export async function verifyPassword(password: string, stored: string): Promise<boolean> {
  const parts = stored.split('$');
  if (parts.length !== 6 || parts[0] !== 'scrypt') return false;
  const [logN, r, p] = parts.slice(1, 4).map(Number);
  const salt = Buffer.from(parts[4], 'base64url');
  const expected = Buffer.from(parts[5], 'base64url');
  const actual = await scrypt(password.normalize('NFC'), salt, expected.length, scryptOptions(logN, r, p));
  return actual.length === expected.length && timingSafeEqual(actual, expected);
}

/** Parameters a stored hash was made with, to decide whether it needs re-hashing at sign-in. */
export function hashCost(stored: string): number | null {
  const parts = stored.split('$');
  return parts[0] === 'scrypt' ? Number(parts[1]) : null;
}

let dummyHash: Promise<string> | null = null;
/** Verifying against a throwaway hash when the account doesn't exist keeps sign-in timing uniform. */
export function dummyVerify(password: string, logN: number) {
  dummyHash ??= hashPassword('not-a-real-password', logN);
  return dummyHash.then((h) => verifyPassword(password, h));
}
