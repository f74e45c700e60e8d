import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { ResetRequestSchema } from '../../../../shared/api';
import { Button } from '../../../components/ui/button';
import { Field, FormError } from '../../../components/ui/field';
import { Input } from '../../../components/ui/input';
import { applyServerErrors } from '../../../lib/form-errors';
import { notifyError } from '../../../lib/notify';
import { useResetRequest } from '../api';

/**
 * Asks for a reset link. The server answers the same whether or not the address has an account
 * (so nobody can probe for accounts), and so does this form.
 */
export function ResetRequestForm() {
  const request = useResetRequest();
  const form = useForm({ resolver: zodResolver(ResetRequestSchema), defaultValues: { email: '' } });
  const { errors } = form.formState;

  if (request.isSuccess) {
    return (
      <p role="status" className="rounded-md border border-mat-600 bg-mat-800 px-3 py-3 text-sm text-slate-200">
        If <span className="font-mono text-amber-300">{request.variables.email}</span> has a Gatefold account, a link to choose a
        new password is on its way. The link works once, for one hour.
      </p>
    );
  }

  const onSubmit = form.handleSubmit((body) =>
    request.mutate(body, {
      onError: (err) => {
        if (!applyServerErrors(err, form.setError, ['email'])) notifyError(err);
      },
    }),
  );

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4" aria-label="Reset password">
      <Field label="E-mail" error={errors.email?.message}>
        <Input type="email" autoComplete="email" autoFocus {...form.register('email')} />
      </Field>
      <FormError message={errors.root?.server?.message} />
      <Button type="submit" variant="primary" busy={request.isPending}>
        Send reset link
      </Button>
    </form>
  );
}
