import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { z } from 'zod';
import { TitleSchema, type ApiBoard } from '../../../../shared/api';
import { Button } from '../../../components/ui/button';
import { Input } from '../../../components/ui/input';
import { applyServerErrors } from '../../../lib/form-errors';
import { notifyError, notifySuccess } from '../../../lib/notify';
import { useUpdateBoard } from '../api';

const RenameSchema = z.object({ title: TitleSchema });

function RenameForm({ board, title: current, onClose }: { board: ApiBoard; title: string; onClose: () => void }) {
  const update = useUpdateBoard(board.id);
  const form = useForm({ resolver: zodResolver(RenameSchema), defaultValues: { title: current } });
  const error = form.formState.errors.title?.message ?? form.formState.errors.root?.server?.message;

  const onSubmit = form.handleSubmit(({ title }) => {
    if (title === current) return onClose();
    update.mutate(
      { title },
      {
        onSuccess: () => {
          notifySuccess('Board renamed');
          onClose();
        },
        onError: (err) => {
          if (!applyServerErrors(err, form.setError, ['title'])) notifyError(err, 'Could not rename the board');
        },
      },
    );
  });

  return (
    <form onSubmit={onSubmit} noValidate aria-label="Rename board" className="flex items-center gap-2" onKeyDown={(e) => e.key === 'Escape' && onClose()}>
      <Input aria-label="Board title" aria-invalid={error ? true : undefined} autoFocus className="h-7 w-64 font-semibold" {...form.register('title')} />
      <Button type="submit" size="sm" variant="primary" busy={update.isPending}>
        Save
      </Button>
      <Button size="sm" variant="ghost" onClick={onClose}>
        Cancel
      </Button>
      {error && (
        <span role="alert" className="text-xs text-rose-300">
          {error}
        </span>
      )}
    </form>
  );
}

/**
 * The board's title (`title`: the live document's, which every screen shares); editors and owners
 * rename it in place. The rename goes through the API, which writes it into that document.
 */
export function BoardTitleEditor({ board, title, editable }: { board: ApiBoard; title: string; editable: boolean }) {
  const [editing, setEditing] = useState(false);
  if (editing) return <RenameForm board={board} title={title} onClose={() => setEditing(false)} />;
  return (
    <div className="flex min-w-0 items-center gap-1.5">
      <h1 className="truncate text-base font-semibold text-slate-100" data-testid="board-title">
        {title}
      </h1>
      {editable && (
        <button
          type="button"
          onClick={() => setEditing(true)}
          aria-label="Rename board"
          title="Rename board"
          className="rounded p-1 text-slate-500 hover:bg-mat-800 hover:text-amber-300"
        >
          <svg width="14" height="14" viewBox="0 0 14 14" aria-hidden="true">
            <path d="M2 12l1-3.5L9.5 2 12 4.5 5.5 11z" fill="none" stroke="currentColor" strokeWidth="1.4" strokeLinejoin="round" />
          </svg>
        </button>
      )}
    </div>
  );
}
