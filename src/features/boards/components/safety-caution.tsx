import type { FamilyId } from '../../../../shared/board';
import { safetyCautionFor } from '../../../lib/families';

/**
 * One line of caution for families whose real build can hurt someone: under the board's header, and again
 * wherever tube or mains figures appear (the build sheet), each place with its own test id.
 */
export function SafetyCaution({ family, testId = 'safety-caution' }: { family: FamilyId; testId?: string }) {
  const text = safetyCautionFor(family);
  if (!text) return null;
  return (
    <p role="note" data-testid={testId} className="flex items-start gap-2 border-b border-amber-600/40 bg-amber-600/10 px-4 py-1.5 text-xs text-amber-200">
      <span aria-hidden="true" className="font-mono font-semibold text-amber-glow">
        ⚠
      </span>
      <span>
        <strong className="font-semibold">Caution:</strong> {text}
      </span>
    </p>
  );
}
