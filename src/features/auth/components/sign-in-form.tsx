import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { LoginSchema, type ApiUser } from '../../../../shared/api';
import { Button } from '../../../components/ui/button';
import { Field, FormError } from '../../../components/ui/field';
import { Input } from '../../../components/ui/input';
import { applyServerErrors } from '../../../lib/form-errors';
import { notifyError } from '../../../lib/notify';
import { useSignIn } from '../api';
import { DEMO_PASSWORD, DemoSignIns } from './demo-sign-ins';

/** E-mail and password; with `showDemo`, the demo accounts below it fill the form when clicked. */
export function SignInForm({ onSignedIn, defaultEmail = '', showDemo = false }: { onSignedIn: (user: ApiUser) => void; defaultEmail?: string; showDemo?: boolean }) {
  const signIn = useSignIn();
  const form = useForm({ resolver: zodResolver(LoginSchema), defaultValues: { email: defaultEmail, password: '' } });
  const { errors } = form.formState;

  const onSubmit = form.handleSubmit((body) =>
    signIn.mutate(body, {
      onSuccess: ({ user }) => onSignedIn(user),
      onError: (err) => {
        if (!applyServerErrors(err, form.setError, ['email', 'password'])) notifyError(err);
      },
    }),
  );

  const pickDemo = (email: string) => {
    form.setValue('email', email, { shouldValidate: false });
    form.setValue('password', DEMO_PASSWORD, { shouldValidate: false });
    form.clearErrors();
  };

  return (
    <>
      <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4" aria-label="Sign in">
        <Field label="E-mail" error={errors.email?.message}>
          <Input type="email" autoComplete="email" autoFocus {...form.register('email')} />
        </Field>
        <Field label="Password" error={errors.password?.message}>
          <Input type="password" autoComplete="current-password" {...form.register('password')} />
        </Field>
        <FormError message={errors.root?.server?.message} />
        <Button type="submit" variant="primary" busy={signIn.isPending}>
          Sign in
        </Button>
      </form>
      {showDemo && <DemoSignIns onPick={pickDemo} />}
    </>
  );
}
