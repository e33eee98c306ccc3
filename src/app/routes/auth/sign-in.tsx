import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { Link, useNavigate, useSearchParams } from 'react-router-dom';
import { LoginSchema } from '@shared/schemas/user';
import { useLogin } from '@/features/auth/api/login';
import { Button } from '@/components/ui/button';
import { Field, Input } from '@/components/ui/field';
import { Alert } from '@/components/ui/alert';
import { AuthCard } from './auth-card';

type Form = { email: string; password: string };

export default function SignInPage() {
  const login = useLogin();
  const navigate = useNavigate();
  const [params] = useSearchParams();
  const next = params.get('next');
  const { register, handleSubmit, formState } = useForm<Form>({ resolver: zodResolver(LoginSchema) });
  const onSubmit = handleSubmit((v) =>
    login.mutate(v, { onSuccess: () => navigate(next && next.startsWith('/') && !next.startsWith('//') ? next : '/home', { replace: true }) }),
  );
  return (
    <AuthCard title="Sign in" lead="Welcome back. Sign in to see your pledges and blankets.">
      <form onSubmit={onSubmit} className="space-y-4" noValidate>
        {login.error && <Alert kind="error">{login.error.message}</Alert>}
        {params.get('reset') === 'done' && <Alert kind="success">Your password is changed. Sign in with the new one.</Alert>}
        <Field label="E-mail" error={formState.errors.email?.message}>
          {({ id, describedBy, invalid }) => <Input id={id} type="email" autoComplete="email" aria-describedby={describedBy} aria-invalid={invalid} {...register('email')} />}
        </Field>
        <Field label="Password" error={formState.errors.password?.message}>
          {({ id, describedBy, invalid }) => <Input id={id} type="password" autoComplete="current-password" aria-describedby={describedBy} aria-invalid={invalid} {...register('password')} />}
        </Field>
        <Button type="submit" size="lg" className="w-full" busy={login.isPending}>
          Sign in
        </Button>
        <div className="flex flex-wrap justify-between gap-2 text-sm">
          <Link to="/forgot-password">Forgotten your password?</Link>
          <Link to="/register">New here? Join as a maker</Link>
        </div>
      </form>
    </AuthCard>
  );
}
