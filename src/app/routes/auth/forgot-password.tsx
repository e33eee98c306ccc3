import { useForm } from 'react-hook-form';
import { lazyZodResolver } from '@/lib/lazy-zod-resolver';
import { useRequestPasswordReset } from '@/features/auth/api/request-password-reset';
import { Button } from '@/components/ui/button';
import { Field, Input } from '@/components/ui/field';
import { Alert } from '@/components/ui/alert';
import { AuthCard } from './auth-card';

const resolver = lazyZodResolver<{ email: string }>(() => import('@shared/schemas/user').then((m) => m.PasswordResetRequestSchema));

export default function ForgotPasswordPage() {
  const reset = useRequestPasswordReset();
  const { register, handleSubmit, formState } = useForm<{ email: string }>({ resolver });
  return (
    <AuthCard title="Forgotten password" lead="We'll e-mail you a link to choose a new one. It works once, for an hour.">
      {reset.isSuccess ? (
        <Alert kind="success" title="Check your inbox">
          If that address has an account, a reset link is on its way.
        </Alert>
      ) : (
        <form onSubmit={handleSubmit((v) => reset.mutate(v))} className="space-y-4" noValidate>
          {reset.error && <Alert kind="error">{reset.error.message}</Alert>}
          <Field label="E-mail" error={formState.errors.email?.message}>
            {({ id, describedBy, invalid }) => <Input id={id} type="email" autoComplete="email" aria-describedby={describedBy} aria-invalid={invalid} {...register('email')} />}
          </Field>
          <Button type="submit" size="lg" className="w-full" busy={reset.isPending}>
            Send the link
          </Button>
        </form>
      )}
    </AuthCard>
  );
}
