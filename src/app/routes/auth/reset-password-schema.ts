import { z } from 'zod';
import { PasswordSchema } from '@shared/schemas/user';

/** The new password, typed twice. */
export const ResetPasswordFormSchema = z
  .object({ password: PasswordSchema, again: z.string() })
  .refine((v) => v.password === v.again, { path: ['again'], message: 'The two passwords are not the same' });
export type ResetPasswordForm = z.infer<typeof ResetPasswordFormSchema>;
