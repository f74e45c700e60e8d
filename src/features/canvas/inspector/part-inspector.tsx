/**
 * The part inspector: a section at the top of the right-hand column (or, when that column is not shown,
 * a small card floating at the top right of the canvas, where it can cover parts) showing the one selected part's kind,
 * id, label, rotation and its kind's own fields (CONTRACTS §1). Every change is one named edit of
 * shared/board/edits on the session's own origin, so this user's undo takes it back; a refused value is
 * shown beside its field. Viewers see the values without controls. With several parts selected it
 * offers what applies to all of them: turn and delete.
 */
import { useState } from 'react';
import { deleteSelection, relabelPart, rotateParts, setPartField } from '../../../../shared/board';
import { KIND_TITLES } from '../../../../shared/board';
import type { Part } from '../../../../shared/board';
import { labelProblem } from '../lib/labels';
import type { BoardSession } from '../session/use-board-session';
import { DraftBox, KindField, RotationButtons, Row } from './field-controls';
import { inspectorFields, type InspectorField } from './inspector-fields';
import { useSelectedPartIds } from './use-selected-part-ids';

export type InspectorPlacement = 'panel' | 'float';
const CARD: Record<InspectorPlacement, string> = {
  panel: 'border-b border-mat-700 p-3 text-slate-100',
  float: 'pointer-events-auto w-64 rounded-lg border border-mat-600 bg-mat-900/95 p-3 text-slate-100 shadow-xl shadow-black/40 backdrop-blur-sm',
};
const actionClass = 'h-7 rounded border border-mat-600 bg-mat-800 px-2.5 text-xs text-slate-100 hover:border-mat-500 hover:bg-mat-700';

export function PartInspector({ session, placement }: { session: BoardSession; placement: InspectorPlacement }) {
  const ids = useSelectedPartIds();
  const parts = ids.map((id) => session.board.parts.find((p) => p.id === id)).filter((p): p is Part => !!p);
  if (parts.length === 0) return null;
  const cardClass = CARD[placement];
  return (
    <div className={placement === 'float' ? 'pointer-events-none absolute right-3 top-3 z-20' : ''} data-testid="part-inspector" data-placement={placement}>
      {parts.length === 1
        ? <OnePart key={parts[0].id} session={session} part={parts[0]} cardClass={cardClass} />
        : <ManyParts session={session} ids={parts.map((p) => p.id)} cardClass={cardClass} />}
    </div>
  );
}

function ManyParts({ session, ids, cardClass }: { session: BoardSession; ids: string[]; cardClass: string }) {
  return (
    <section className={cardClass} aria-label="Part inspector">
      <h2 className="text-sm font-semibold" data-testid="inspector-count">{ids.length} parts selected</h2>
      {!session.readOnly && (
        <div className="mt-2 flex gap-2">
          <button type="button" className={actionClass} data-testid="inspector-rotate-all" onClick={() => rotateParts(session.doc, ids, session.origin)}>Turn 90° ↻</button>
          <button type="button" className={`${actionClass} border-rose-800 text-rose-200 hover:bg-rose-950/60`} data-testid="inspector-delete-all"
            onClick={() => deleteSelection(session.doc, ids, [], session.origin)}>Delete</button>
        </div>
      )}
    </section>
  );
}

/** The value of a kind's own field, for viewers. */
function shown(spec: InspectorField, value: unknown): string {
  if (spec.control === 'check') return value === true ? 'yes' : 'no';
  if (spec.control === 'bit') return String(value ?? 0);
  if (spec.control === 'number') return value === undefined ? 'default' : `${String(value)} ${spec.unit}`;
  return String(value ?? '');
}

function OnePart({ session, part, cardClass }: { session: BoardSession; part: Part; cardClass: string }) {
  const { doc, origin, readOnly } = session;
  const [errors, setErrors] = useState<Record<string, string | undefined>>({});
  const fields = inspectorFields(part.kind);
  const record = part as Record<string, unknown>;
  const rotation = part.rotation ?? 0;
  const tid = (f: string) => `inspector-${part.id}-${f}`;

  /** Runs one edit; an EditError (or a label problem found first) is kept beside its field. */
  const attempt = (field: string, edit: () => void) => {
    try {
      edit();
      setErrors((e) => ({ ...e, [field]: undefined }));
    } catch (err) {
      setErrors((e) => ({ ...e, [field]: (err as Error).message }));
    }
  };
  const relabel = (text: string) => attempt('label', () => {
    const label = text.trim();
    const problem = labelProblem(session.board, part.id, label);
    if (problem) throw new Error(problem);
    relabelPart(doc, part.id, label, origin);
  });

  return (
    <section className={cardClass} aria-label="Part inspector" data-part={part.id}>
      <header className="mb-2 flex items-baseline justify-between gap-2 border-b border-mat-700 pb-2">
        <h2 className="truncate text-sm font-semibold text-amber-300" data-testid="inspector-kind">{KIND_TITLES[part.kind]}</h2>
        <code className="truncate font-mono text-[11px] text-slate-400" data-testid="inspector-id" title="part id">{part.id}</code>
      </header>
      <div className="space-y-2">
        <Row title="Label" htmlFor={tid('label')} error={errors.label}>
          {readOnly
            ? <p className="pt-1 font-mono text-xs" data-testid="inspector-label">{part.label ?? '—'}</p>
            : <DraftBox id={tid('label')} value={part.label ?? ''} onCommit={relabel} invalid={!!errors.label} testId="inspector-label" placeholder="no label" />}
        </Row>
        <Row title="Rotation" error={errors.rotation}>
          {readOnly
            ? <p className="pt-1 font-mono text-xs" data-testid="inspector-rotation">{rotation}°</p>
            : <RotationButtons value={rotation} onPick={(r) => attempt('rotation', () => setPartField(doc, part.id, 'rotation', r, origin))} />}
        </Row>
        {fields.map((spec) => (
          <Row key={spec.field} title={spec.title} htmlFor={spec.control === 'bit' ? undefined : tid(spec.field)} error={errors[spec.field]}>
            {readOnly
              ? <p className="whitespace-pre-wrap break-words pt-1 font-mono text-xs" data-testid={`inspector-${spec.field}`}>{shown(spec, record[spec.field])}</p>
              : <KindField spec={spec} inputId={tid(spec.field)} value={record[spec.field]} invalid={!!errors[spec.field]}
                  onCommit={(v) => attempt(spec.field, () => setPartField(doc, part.id, spec.field, v, origin))} />}
          </Row>
        ))}
      </div>
    </section>
  );
}
