import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import { useNavigate, useSearchParams } from 'react-router-dom';
import { PasswordSchema } from '@shared/schemas/user';
import { useConfirmPasswordReset } from '@/features/auth/api/confirm-password-reset';
import { Button } from '@/components/ui/button';
import { Field, Input } from '@/components/ui/field';
import { Alert } from '@/components/ui/alert';
import { AuthCard } from './auth-card';

const FormSchema = z
  .object({ password: PasswordSchema, again: z.string() })
  .refine((v) => v.password === v.again, { path: ['again'], message: 'The two passwords are not the same' });

export default function ResetPasswordPage() {
  const [params] = useSearchParams();
  const token = params.get('token') ?? '';
  const confirm = useConfirmPasswordReset();
  const navigate = useNavigate();
  const { register, handleSubmit, formState } = useForm<z.infer<typeof FormSchema>>({ resolver: zodResolver(FormSchema) });
  return (
    <AuthCard title="Choose a new password">
      <form
        onSubmit={handleSubmit((v) => confirm.mutate({ token, password: v.password }, { onSuccess: () => navigate('/sign-in?reset=done') }))}
        className="space-y-4"
        noValidate
      >
        {!token && <Alert kind="error">This page needs the link from the e-mail we sent.</Alert>}
        {confirm.error && <Alert kind="error">{confirm.error.message}</Alert>}
        <Field label="New password" hint="At least 15 characters. A few words in a row are easy to remember and hard to guess." error={formState.errors.password?.message}>
          {({ id, describedBy, invalid }) => <Input id={id} type="password" autoComplete="new-password" aria-describedby={describedBy} aria-invalid={invalid} {...register('password')} />}
        </Field>
        <Field label="The same again" error={formState.errors.again?.message}>
          {({ id, describedBy, invalid }) => <Input id={id} type="password" autoComplete="new-password" aria-describedby={describedBy} aria-invalid={invalid} {...register('again')} />}
        </Field>
        <Button type="submit" size="lg" className="w-full" busy={confirm.isPending} disabled={!token}>
          Save the new password
        </Button>
      </form>
    </AuthCard>
  );
}
