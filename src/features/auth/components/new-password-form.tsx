import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { ResetSchema } from '../../../../shared/api';
import { Button } from '../../../components/ui/button';
import { Field, FormError } from '../../../components/ui/field';
import { Input } from '../../../components/ui/input';
import { isApiError } from '../../../lib/api-client';
import { applyServerErrors } from '../../../lib/form-errors';
import { notifyError } from '../../../lib/notify';
import { useResetPassword } from '../api';

/** Sets a new password with the token from the e-mailed link (the token travels in a hidden field). */
export function NewPasswordForm({ token, onDone }: { token: string; onDone: () => void }) {
  const reset = useResetPassword();
  const form = useForm({ resolver: zodResolver(ResetSchema), defaultValues: { token, password: '' } });
  const { errors } = form.formState;

  const onSubmit = form.handleSubmit((body) =>
    reset.mutate(body, {
      onSuccess: onDone,
      onError: (err) => {
        if (isApiError(err) && err.code === 'invalid_token') {
          form.setError('root.server', { message: 'This reset link is unknown, used or expired. Ask for a new one.' });
          return;
        }
        if (!applyServerErrors(err, form.setError, ['password'])) notifyError(err);
      },
    }),
  );

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4" aria-label="Choose a new password">
      <input type="hidden" {...form.register('token')} />
      <Field label="New password" error={errors.password?.message ?? errors.token?.message} hint="At least 8 characters.">
        <Input type="password" autoComplete="new-password" autoFocus {...form.register('password')} />
      </Field>
      <FormError message={errors.root?.server?.message} />
      <Button type="submit" variant="primary" busy={reset.isPending}>
        Save new password
      </Button>
    </form>
  );
}
