/** The label rules of CONTRACTS §1, checked before a rename: inputs' and outputs' labels are unique identifiers. */
import { isInputKind, isOutputKind } from '../../../../shared/board/kinds';
import { LABEL_RE, type BoardFile } from '../../../../shared/board/schema';

/** Why `label` cannot go on part `partId`, or null when it can ('' removes the label). */
export function labelProblem(board: BoardFile, partId: string, label: string): string | null {
  const part = board.parts.find((p) => p.id === partId);
  if (!part) return `no part "${partId}"`;
  if (label === '') return null;
  if (label.length > 64) return 'a label has at most 64 characters';
  if (!isInputKind(part.kind) && !isOutputKind(part.kind)) return null;
  if (!LABEL_RE.test(label)) return `label "${label}" must be a letter or _ followed by letters, digits or _`;
  const other = board.parts.find((p) => p.id !== partId && p.label === label && (isInputKind(p.kind) || isOutputKind(p.kind)));
  return other ? `label "${label}" is already on ${other.id}` : null;
}
