import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { AddMemberSchema } from '../../../../shared/api';
import { Button } from '../../../components/ui/button';
import { Field, FormError } from '../../../components/ui/field';
import { Input } from '../../../components/ui/input';
import { Select } from '../../../components/ui/select';
import { applyServerErrors } from '../../../lib/form-errors';
import { notifyError, notifySuccess } from '../../../lib/notify';
import { useAddMember } from '../api';
import { ROLE_OPTIONS } from './role-options';

/**
 * Adds someone by e-mail: an existing account joins at once; an address without an account gets an
 * invitation e-mail and shows under pending invitations until accepted.
 */
export function AddMemberForm({ boardId }: { boardId: number }) {
  const add = useAddMember(boardId);
  const form = useForm({ resolver: zodResolver(AddMemberSchema), defaultValues: { email: '', role: 'editor' as const } });
  const { errors } = form.formState;

  const onSubmit = form.handleSubmit((body) =>
    add.mutate(body, {
      onSuccess: (res) => {
        if ('member' in res) notifySuccess(`${res.member.name} added as ${res.member.role}`);
        else notifySuccess(`Invitation sent to ${res.invitation.email}`, 'They join when they accept the e-mailed link.');
        form.reset({ email: '', role: body.role });
      },
      onError: (err) => {
        if (!applyServerErrors(err, form.setError, ['email', 'role'], { already_member: 'email' })) notifyError(err, 'Could not add the member');
      },
    }),
  );

  return (
    <form onSubmit={onSubmit} noValidate aria-label="Add member" className="flex flex-col gap-3 sm:flex-row sm:items-start">
      <div className="sm:flex-1">
        <Field label="E-mail" error={errors.email?.message}>
          <Input type="email" placeholder="name@example.org" {...form.register('email')} />
        </Field>
      </div>
      <div className="sm:w-40">
        <Field label="Role" error={errors.role?.message}>
          <Select options={ROLE_OPTIONS} {...form.register('role')} />
        </Field>
      </div>
      <div className="sm:pt-[22px]">
        <Button type="submit" variant="primary" busy={add.isPending}>
          Add member
        </Button>
      </div>
      <FormError message={errors.root?.server?.message} />
    </form>
  );
}
