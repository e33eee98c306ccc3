import { useForm } from 'react-hook-form';
import { Link, useNavigate } from 'react-router-dom';
import { lazyZodResolver } from '@/lib/lazy-zod-resolver';
import { useRegister } from '@/features/auth/api/register';
import { Button } from '@/components/ui/button';
import { Field, Input } from '@/components/ui/field';
import { Alert } from '@/components/ui/alert';
import { AuthCard } from './auth-card';

type Form = { name: string; email: string; password: string };

const resolver = lazyZodResolver<Form>(() => import('@shared/schemas/user').then((m) => m.RegisterSchema));

export default function RegisterPage() {
  const reg = useRegister();
  const navigate = useNavigate();
  const { register, handleSubmit, formState } = useForm<Form>({ resolver });
  const onSubmit = handleSubmit((v) => reg.mutate(v, { onSuccess: () => navigate('/home', { replace: true }) }));
  return (
    <AuthCard title="Join as a maker" lead="Make an account to pledge blankets, save border plans and log what you finish.">
      <form onSubmit={onSubmit} className="space-y-4" noValidate>
        {reg.error && <Alert kind="error">{reg.error.message}</Alert>}
        <Field label="Your name" hint="Shown to the drive's organisers. Tags and lists can say 'anonymous' instead." error={formState.errors.name?.message}>
          {({ id, describedBy, invalid }) => <Input id={id} autoComplete="name" aria-describedby={describedBy} aria-invalid={invalid} {...register('name')} />}
        </Field>
        <Field label="E-mail" error={formState.errors.email?.message}>
          {({ id, describedBy, invalid }) => <Input id={id} type="email" autoComplete="email" aria-describedby={describedBy} aria-invalid={invalid} {...register('email')} />}
        </Field>
        <Field label="Password" hint="At least 15 characters. A few words in a row are easy to remember and hard to guess." error={formState.errors.password?.message}>
          {({ id, describedBy, invalid }) => <Input id={id} type="password" autoComplete="new-password" aria-describedby={describedBy} aria-invalid={invalid} {...register('password')} />}
        </Field>
        <Button type="submit" size="lg" className="w-full" busy={reg.isPending}>
          Create my account
        </Button>
        <p className="text-sm">
          Already have one? <Link to="/sign-in">Sign in</Link>
        </p>
      </form>
    </AuthCard>
  );
}
