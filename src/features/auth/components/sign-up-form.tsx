import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { SignupSchema, type ApiUser } from '../../../../shared/api';
import { Button } from '../../../components/ui/button';
import { Field, FormError } from '../../../components/ui/field';
import { Input } from '../../../components/ui/input';
import { applyServerErrors } from '../../../lib/form-errors';
import { notifyError } from '../../../lib/notify';
import { useSignUp } from '../api';

export function SignUpForm({ onSignedUp, defaultEmail = '' }: { onSignedUp: (user: ApiUser) => void; defaultEmail?: string }) {
  const signUp = useSignUp();
  const form = useForm({ resolver: zodResolver(SignupSchema), defaultValues: { name: '', email: defaultEmail, password: '' } });
  const { errors } = form.formState;

  const onSubmit = form.handleSubmit((body) =>
    signUp.mutate(body, {
      onSuccess: ({ user }) => onSignedUp(user),
      onError: (err) => {
        if (!applyServerErrors(err, form.setError, ['name', 'email', 'password'], { email_taken: 'email' })) notifyError(err);
      },
    }),
  );

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4" aria-label="Sign up">
      <Field label="Name" error={errors.name?.message} hint="Shown to the people you share boards with.">
        <Input autoComplete="name" autoFocus {...form.register('name')} />
      </Field>
      <Field label="E-mail" error={errors.email?.message}>
        <Input type="email" autoComplete="email" {...form.register('email')} />
      </Field>
      <Field label="Password" error={errors.password?.message} hint="At least 8 characters.">
        <Input type="password" autoComplete="new-password" {...form.register('password')} />
      </Field>
      <FormError message={errors.root?.server?.message} />
      <Button type="submit" variant="primary" busy={signUp.isPending}>
        Create account
      </Button>
    </form>
  );
}
