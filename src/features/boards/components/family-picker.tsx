import type { ApiBoard } from '../../../../shared/api';
import { FamilySchema } from '../../../../shared/board/schema';
import { FAMILY_LABELS, FAMILY_OPTIONS } from '../../../lib/families';
import { notifyError } from '../../../lib/notify';
import { useUpdateBoard } from '../api';

/** The logic family the board is planned for (it drives the build sheet); editors change it here. */
export function FamilyPicker({ board, editable }: { board: ApiBoard; editable: boolean }) {
  const update = useUpdateBoard(board.id);
  if (!editable) return <span className="text-xs text-slate-400">{FAMILY_LABELS[board.family] ?? board.family}</span>;
  return (
    <select
      aria-label="Logic family"
      value={board.family}
      disabled={update.isPending}
      onChange={(e) => {
        const family = FamilySchema.safeParse(e.target.value);
        if (family.success) update.mutate({ family: family.data }, { onError: (err) => notifyError(err, 'Could not change the family') });
      }}
      className="h-7 rounded border border-bench-600 bg-bench-950 px-2 text-xs text-slate-200 focus:border-amber-glow focus:outline-none"
    >
      {FAMILY_OPTIONS.map((o) => (
        <option key={o.value} value={o.value}>
          {o.label}
        </option>
      ))}
    </select>
  );
}
