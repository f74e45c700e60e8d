import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { CreateBoardSchema, type ApiBoard } from '../../../../shared/api';
import { Button } from '../../../components/ui/button';
import { Field, FormError } from '../../../components/ui/field';
import { Input } from '../../../components/ui/input';
import { Select } from '../../../components/ui/select';
import { FAMILY_OPTIONS } from '../../../lib/families';
import { applyServerErrors } from '../../../lib/form-errors';
import { notifyError, notifySuccess } from '../../../lib/notify';
import { useCreateBoard } from '../api';

/** A new, empty board: its title and the logic family it will be built in (changeable later). */
export function CreateBoardForm({ onCreated }: { onCreated: (board: ApiBoard) => void }) {
  const create = useCreateBoard();
  const form = useForm({ resolver: zodResolver(CreateBoardSchema), defaultValues: { title: '', family: 'ideal' as const } });
  const { errors } = form.formState;

  const onSubmit = form.handleSubmit((body) =>
    create.mutate(body, {
      onSuccess: (board) => {
        notifySuccess(`Board “${board.title}” created`);
        form.reset();
        onCreated(board);
      },
      onError: (err) => {
        if (!applyServerErrors(err, form.setError, ['title', 'family'])) notifyError(err, 'Could not create the board');
      },
    }),
  );

  return (
    <form onSubmit={onSubmit} noValidate aria-label="New board" className="flex flex-col gap-3 sm:flex-row sm:items-start">
      <div className="sm:flex-1">
        <Field label="Title" error={errors.title?.message}>
          <Input placeholder="e.g. Half adder" {...form.register('title')} />
        </Field>
      </div>
      <div className="sm:w-64">
        <Field label="Logic family" error={errors.family?.message}>
          <Select options={FAMILY_OPTIONS} {...form.register('family')} />
        </Field>
      </div>
      <div className="flex flex-col gap-2 sm:pt-[22px]">
        <Button type="submit" variant="primary" busy={create.isPending}>
          Create board
        </Button>
      </div>
      <FormError message={errors.root?.server?.message} />
    </form>
  );
}
