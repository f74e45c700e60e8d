/** The label rules of CONTRACTS §1 (owned by `shared/board`), checked before a rename. */
import { isNamedKind, LABEL_MAX_LENGTH, labelProblem as ruleProblem, namedLabels, type BoardFile } from '../../../../shared/board';

/** Why `label` cannot go on part `partId`, or null when it can ('' removes the label). */
export function labelProblem(board: BoardFile, partId: string, label: string): string | null {
  const part = board.parts.find((p) => p.id === partId);
  if (!part) return `no part "${partId}"`;
  if (label === '') return null;
  if (label.length > LABEL_MAX_LENGTH) return `a label has at most ${LABEL_MAX_LENGTH} characters`;
  if (!isNamedKind(part.kind)) return null;
  return ruleProblem(label, namedLabels(board.parts, partId));
}
