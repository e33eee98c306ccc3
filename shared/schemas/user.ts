import { z } from 'zod';

export const ROLES = ['volunteer', 'organiser', 'coordinator'] as const;
export const RoleSchema = z.enum(ROLES);
export type Role = z.infer<typeof RoleSchema>;

const email = z.string().trim().toLowerCase().email('Enter a valid e-mail address').max(254);

/** NIST SP 800-63B (via OWASP Authentication Cheat Sheet): at least 8, allow at least 64, no composition rules. */
export const PasswordSchema = z
  .string()
  .min(8, 'Use at least 8 characters')
  .max(128, 'Use at most 128 characters');

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

export const IdParamSchema = z.object({ id: z.coerce.number().int().positive('Not a valid id') });
