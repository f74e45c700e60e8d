import type * as Y from 'yjs';
import { FamilySchema, type FamilyId } from '../../../shared/board';
import { setMeta } from '../../../shared/board';
import { FAMILY_LABELS, FAMILY_OPTIONS } from '../../lib/families';

/**
 * The board's logic family, read from the document; editors change it with a document edit, so
 * every screen re-simulates with the new floating-input reading and delays at once. (The safety
 * caution of dangerous families is the band above the workspace, which follows the same value.)
 */
export function FamilyField({ family, readOnly, doc, origin }: { family: FamilyId; readOnly: boolean; doc: Y.Doc; origin: object }) {
  return (
    <div className="space-y-1.5 text-xs">
      <label className="flex items-center gap-2 text-slate-400">
        Logic family
        {readOnly ? (
          <span className="text-slate-200">{FAMILY_LABELS[family]}</span>
        ) : (
          <select
            aria-label="Bench logic family"
            value={family}
            onChange={(e) => {
              const next = FamilySchema.safeParse(e.target.value);
              if (next.success) setMeta(doc, { family: next.data }, origin);
            }}
            className="h-7 flex-1 rounded border border-mat-600 bg-mat-950 px-2 text-slate-200 focus:border-amber-glow focus:outline-none"
          >
            {FAMILY_OPTIONS.map((o) => (
              <option key={o.value} value={o.value}>{o.label}</option>
            ))}
          </select>
        )}
      </label>
    </div>
  );
}
