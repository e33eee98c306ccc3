import { useForm } from 'react-hook-form';
import { useNavigate, useSearchParams } from 'react-router-dom';
import { lazyZodResolver } from '@/lib/lazy-zod-resolver';
import type { ResetPasswordForm } from './reset-password-schema';
import { useConfirmPasswordReset } from '@/features/auth/api/confirm-password-reset';
import { Button } from '@/components/ui/button';
import { Field, Input } from '@/components/ui/field';
import { Alert } from '@/components/ui/alert';
import { AuthCard } from './auth-card';

const resolver = lazyZodResolver<ResetPasswordForm>(() => import('./reset-password-schema').then((m) => m.ResetPasswordFormSchema));

export default function ResetPasswordPage() {
  const [params] = useSearchParams();
  const token = params.get('token') ?? '';
  const confirm = useConfirmPasswordReset();
  const navigate = useNavigate();
  const { register, handleSubmit, formState } = useForm<ResetPasswordForm>({ resolver });
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
