import type { FamilyId } from '../../../../shared/board';
import { safetyCautionFor } from '../../../lib/families';

/** One line of caution under the header for families whose real build can hurt someone. */
export function SafetyCaution({ family }: { family: FamilyId }) {
  const text = safetyCautionFor(family);
  if (!text) return null;
  return (
    <p role="note" data-testid="safety-caution" className="flex items-start gap-2 border-b border-amber-600/40 bg-amber-600/10 px-4 py-1.5 text-xs text-amber-200">
      <span aria-hidden="true" className="font-mono font-semibold text-amber-glow">
        ⚠
      </span>
      <span>
        <strong className="font-semibold">Caution:</strong> {text}
      </span>
    </p>
  );
}
