import { z } from 'zod';

import { ROLES } from './user-values';

export { ROLES };
export const RoleSchema = z.enum(ROLES);
export type Role = z.infer<typeof RoleSchema>;

const email = z.string().trim().toLowerCase().email('Enter a valid e-mail address').max(254);

/**
 * NIST SP 800-63B-4 (August 2025), 3.1.1.2 Password Verifiers: where a password is the only factor, as
 * here, at least 15 characters; allow at least 64; no composition rules; each Unicode code point
 * counts as one character.
 */
export const PASSWORD_MIN_LENGTH = 15;
export const PASSWORD_MAX_LENGTH = 128;
const codePoints = (s: string) => [...s].length;

export const PasswordSchema = z
  .string()
  .refine((s) => codePoints(s) >= PASSWORD_MIN_LENGTH, `Use at least ${PASSWORD_MIN_LENGTH} characters; a few words in a row work well`)
  .refine((s) => codePoints(s) <= PASSWORD_MAX_LENGTH, `Use at most ${PASSWORD_MAX_LENGTH} characters`);

export const RegisterSchema = z.object({
  name: z.string().trim().min(1, 'Tell us your name').max(120),
  email,
  password: PasswordSchema,
});
export const LoginSchema = z.object({ email, password: z.string().min(1, 'Enter your password').max(128) });
export const PasswordResetRequestSchema = z.object({ email });
export const PasswordResetConfirmSchema = z.object({
  token: z.string().regex(/^[A-Za-z0-9_-]{20,100}$/, 'This reset link is not valid'),
  password: PasswordSchema,
});

export const UserSchema = z.object({
  id: z.number().int(),
  name: z.string(),
  email: z.string(),
  role: RoleSchema,
  active: z.boolean().optional(),
});
export type User = z.infer<typeof UserSchema>;

export const UserUpdateSchema = z
  .object({ role: RoleSchema.optional(), active: z.boolean().optional() })
  .refine((v) => v.role !== undefined || v.active !== undefined, 'Send a role or an active flag');

/** PUT /api/users/me/thank-you-mail: whether a thank-you saying where your blankets went is e-mailed on delivery. */
export const ThankYouPreferenceSchema = z.object({ thankYouMail: z.boolean({ error: 'thankYouMail must be true or false' }) }).strict();
export type ThankYouPreference = z.infer<typeof ThankYouPreferenceSchema>;

export const IdParamSchema = z.object({ id: z.coerce.number().int().positive('Not a valid id') });
