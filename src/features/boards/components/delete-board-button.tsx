import { useNavigate } from 'react-router-dom';
import type { ApiBoard } from '../../../../shared/api';
import { ConfirmButton } from '../../../components/ui/confirm-button';
import { notifyError, notifySuccess } from '../../../lib/notify';
import { useDeleteBoard } from '../api';

/** Owners only: deletes the board for every member, after a confirmation. */
export function DeleteBoardButton({ board }: { board: ApiBoard }) {
  const remove = useDeleteBoard(board.id);
  const navigate = useNavigate();
  return (
    <ConfirmButton
      size="sm"
      busy={remove.isPending}
      title={`Delete “${board.title}”?`}
      description="The board, its content, its members and its pending invitations are removed for every member. This cannot be undone."
      confirmLabel="Delete board"
      onConfirm={() =>
        remove.mutate(undefined, {
          onSuccess: () => {
            notifySuccess(`Board “${board.title}” deleted`);
            navigate('/boards', { replace: true });
          },
          onError: (err) => notifyError(err, 'Could not delete the board'),
        })
      }
    >
      Delete
    </ConfirmButton>
  );
}
