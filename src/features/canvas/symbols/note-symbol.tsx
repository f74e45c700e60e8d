/** A text note on the canvas: double-click to edit (editors only). */
import { useState } from 'react';
import type { Part } from '../../../../shared/board';
import { usePartActions } from '../flow/part-actions';

type NotePart = Extract<Part, { kind: 'note' }>;

export function NoteSymbol({ part }: { part: NotePart }) {
  const actions = usePartActions();
  const [draft, setDraft] = useState<string | null>(null);
  if (draft !== null) {
    return (
      <textarea className="nodrag gf-note-edit" autoFocus value={draft} onChange={(e) => setDraft(e.target.value)}
        onKeyDown={(e) => { e.stopPropagation(); if (e.key === 'Escape') setDraft(null); }}
        onBlur={() => { actions.editText(part.id, draft); setDraft(null); }} />
    );
  }
  return (
    <div className="gf-note" onDoubleClick={() => { if (!actions.readOnly()) setDraft(part.text); }}>
      {part.text || <span className="gf-note-empty">double-click to write</span>}
    </div>
  );
}
