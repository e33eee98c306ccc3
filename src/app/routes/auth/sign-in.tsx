import { useState, type FormEvent } from 'react';
import { Link, useNavigate, useSearchParams } from 'react-router-dom';
import { useLogin } from '@/features/auth/api/login';
import { Button } from '@/components/ui/button';
import { Field, Input } from '@/components/ui/field';
import { Alert } from '@/components/ui/alert';
import { AuthCard } from './auth-card';

type Form = { email: string; password: string };
type Errors = Partial<Record<keyof Form, string>>;

/**
 * The two checks sign-in needs, written out: the first page most people open should not carry the
 * form and schema libraries (about 37 kB gzipped) for them. The server checks the same again.
 */
function checkSignIn(v: Form): Errors {
  const errors: Errors = {};
  if (!/^[^\s@]+@[^\s@]+\.[^\s@]+$/.test(v.email.trim())) errors.email = 'Enter a valid e-mail address';
  if (v.password.length === 0) errors.password = 'Enter your password';
  return errors;
}

export default function SignInPage() {
  const login = useLogin();
  const navigate = useNavigate();
  const [params] = useSearchParams();
  const next = params.get('next');
  const [values, setValues] = useState<Form>({ email: '', password: '' });
  const [errors, setErrors] = useState<Errors>({});
  const field = (name: keyof Form) => ({
    name,
    value: values[name],
    onChange: (e: { target: { value: string } }) => setValues((v) => ({ ...v, [name]: e.target.value })),
  });
  const onSubmit = (e: FormEvent<HTMLFormElement>) => {
    e.preventDefault();
    const found = checkSignIn(values);
    setErrors(found);
    if (Object.keys(found).length > 0) {
      (e.currentTarget.elements.namedItem(found.email ? 'email' : 'password') as HTMLInputElement | null)?.focus();
      return;
    }
    const v = { email: values.email.trim().toLowerCase(), password: values.password };
    login.mutate(v, { onSuccess: () => navigate(next && next.startsWith('/') && !next.startsWith('//') ? next : '/home', { replace: true }) });
  };
  return (
    <AuthCard title="Sign in" lead="Welcome back. Sign in to see your pledges and blankets.">
      <form onSubmit={onSubmit} className="space-y-4" noValidate>
        {login.error && <Alert kind="error">{login.error.message}</Alert>}
        {params.get('reset') === 'done' && <Alert kind="success">Your password is changed. Sign in with the new one.</Alert>}
        <Field label="E-mail" error={errors.email}>
          {({ id, describedBy, invalid }) => <Input id={id} type="email" autoComplete="email" aria-describedby={describedBy} aria-invalid={invalid} {...field('email')} />}
        </Field>
        <Field label="Password" error={errors.password}>
          {({ id, describedBy, invalid }) => <Input id={id} type="password" autoComplete="current-password" aria-describedby={describedBy} aria-invalid={invalid} {...field('password')} />}
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
