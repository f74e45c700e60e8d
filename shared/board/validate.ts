import { BoardFileSchema, type BoardFile, type Part } from './schema';
import { PART_KINDS, type PartKind } from './kinds';
import { isNamedKind, LABEL_RE, labelProblem } from './labels';
import { allPins, splitPinRef } from './pins';

/** One problem in a board file, naming the part or wire it is about. */
export interface BoardProblem {
  /** id of the part or wire at fault, when there is one */
  id?: string;
  /** where in the file: e.g. `parts[3].kind`, `wires[2].to` */
  path: string;
  message: string;
}

export type ParseResult = { ok: true; board: BoardFile } | { ok: false; problems: BoardProblem[] };

function idAt(raw: unknown, list: 'parts' | 'wires', index: unknown): string | undefined {
  if (typeof index !== 'number' || !raw || typeof raw !== 'object') return undefined;
  const arr = (raw as Record<string, unknown>)[list];
  if (!Array.isArray(arr)) return undefined;
  const item = arr[index] as Record<string, unknown> | undefined;
  return item && typeof item.id === 'string' ? item.id : undefined;
}

/**
 * Parses and checks a board file: the shape (zod), then the meaning — unique part and wire ids,
 * wires between existing pins, unique identifier labels on inputs and outputs.
 */
export function parseBoardFile(raw: unknown): ParseResult {
  const shaped = BoardFileSchema.safeParse(raw);
  if (!shaped.success) {
    const problems = shaped.error.issues.map((issue): BoardProblem => {
      const [list, index, field] = issue.path;
      const id = list === 'parts' || list === 'wires' ? idAt(raw, list, index) : undefined;
      const path = issue.path.map((p, i) => (typeof p === 'number' ? `[${p}]` : i ? `.${String(p)}` : String(p))).join('');
      let message = issue.message;
      if (list === 'parts' && (field === 'kind' || (issue.code === 'invalid_union' && field === undefined))) {
        const item = Array.isArray((raw as { parts?: unknown[] }).parts) ? (raw as { parts: Record<string, unknown>[] }).parts[index as number] : undefined;
        const kind = item?.kind;
        if (typeof kind === 'string' && !(PART_KINDS as readonly string[]).includes(kind)) message = `unknown kind "${kind}"`;
      }
      return { id, path: path || '(file)', message: id ? `${id}: ${message}` : `${path || 'file'}: ${message}` };
    });
    return { ok: false, problems };
  }
  const problems = checkBoard(shaped.data);
  return problems.length ? { ok: false, problems } : { ok: true, board: shaped.data };
}

/** Semantic checks of an already well-shaped board. */
export function checkBoard(board: BoardFile): BoardProblem[] {
  const problems: BoardProblem[] = [];
  const parts = new Map<string, Part>();
  board.parts.forEach((part, i) => {
    if (parts.has(part.id)) problems.push({ id: part.id, path: `parts[${i}].id`, message: `duplicate part id "${part.id}"` });
    parts.set(part.id, part);
  });
  const labels = new Map<string, string>();
  board.parts.forEach((part, i) => {
    if (!isNamedKind(part.kind)) return;
    const label = part.label;
    if (label === undefined || label === '') return;
    const problem = labelProblem(label, labels);
    if (problem) problems.push({ id: part.id, path: `parts[${i}].label`, message: `${part.id}: ${problem}` });
    else labels.set(label, part.id);
  });
  const wireIds = new Set<string>();
  board.wires.forEach((wire, i) => {
    if (wireIds.has(wire.id)) problems.push({ id: wire.id, path: `wires[${i}].id`, message: `duplicate wire id "${wire.id}"` });
    wireIds.add(wire.id);
    for (const end of ['from', 'to'] as const) {
      const ref = splitPinRef(wire[end]);
      if (!ref) {
        problems.push({ id: wire.id, path: `wires[${i}].${end}`, message: `${wire.id}: "${wire[end]}" is not of the form part.pin` });
        continue;
      }
      const part = parts.get(ref.part);
      if (!part) {
        problems.push({ id: wire.id, path: `wires[${i}].${end}`, message: `${wire.id}: wire to missing part "${ref.part}"` });
        continue;
      }
      if (!allPins(part).includes(ref.pin)) {
        problems.push({ id: wire.id, path: `wires[${i}].${end}`, message: `${wire.id}: part "${part.id}" (${part.kind}) has no pin "${ref.pin}"` });
      }
    }
  });
  return problems;
}

/** Default label-or-id used to name a part's signal (inputs and outputs prefer their labels). */
export function signalName(part: Part): string {
  return part.label && LABEL_RE.test(part.label) ? part.label : part.id;
}

export type { PartKind };
