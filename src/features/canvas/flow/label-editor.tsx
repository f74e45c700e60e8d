/**
 * A part's label above its symbol; editors double-click the part to rename it in place. Labels of
 * inputs and outputs must be identifiers and unique on the board (CONTRACTS §1): a bad one is refused
 * with the reason, before any edit.
 */
import { useState } from 'react';
import { usePartActions } from './part-actions';

export function PartLabel({ partId, label, editing, onDone }: { partId: string; label: string | undefined; editing: boolean; onDone(): void }) {
  const actions = usePartActions();
  const [draft, setDraft] = useState(label ?? '');
  if (!editing) return label ? <div className="gf-label">{label}</div> : null;
  const commit = () => {
    if (draft.trim() !== (label ?? '')) actions.relabel(partId, draft.trim());
    onDone();
  };
  return (
    <input className="gf-label-edit nodrag" autoFocus value={draft} aria-label="Part label" data-testid={`label-edit-${partId}`}
      onChange={(e) => setDraft(e.target.value)} onBlur={commit} onFocus={(e) => e.target.select()}
      onKeyDown={(e) => {
        e.stopPropagation();
        if (e.key === 'Enter') commit();
        if (e.key === 'Escape') onDone();
      }} />
  );
}
