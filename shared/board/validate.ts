import { BoardFileSchema, type BoardFile, type Part, type Wire } from './schema';
import { checkModuleGraph, checkModuleParts, modulePinTable } from './modules';
import type { ModulePins } from './pins';
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

/** Semantic checks of an already well-shaped board, its modules included. */
export function checkBoard(board: BoardFile): BoardProblem[] {
  const modules = board.modules ?? [];
  const pins = modulePinTable(modules);
  const problems: BoardProblem[] = [];
  // the hierarchy first: a cycle or a missing module explains the rest
  for (const p of checkModuleGraph(modules, board.parts)) {
    const mi = modules.findIndex((m) => m.id === p.module);
    problems.push({ id: p.id ?? p.module, path: mi >= 0 ? `modules[${mi}]` : 'parts', message: p.message });
  }
  // then each module's ports (a clash explains the wires to a pin that is not there)
  modules.forEach((m, mi) => {
    for (const p of checkModuleParts(m.id, m.parts)) {
      const i = m.parts.findIndex((part) => part.id === p.id);
      problems.push({ id: p.id, path: `modules[${mi}].parts[${i}]`, message: p.message });
    }
  });
  problems.push(...checkScope(board.parts, board.wires, pins, null, modules.length > 0));
  modules.forEach((m, mi) => problems.push(...checkScope(m.parts, m.wires, pins, { id: m.id, index: mi }, true)));
  return problems;
}

/**
 * Checks of one part list with its wires: the top level (`inModule` null) or a module's inside. Labels of
 * inputs and outputs are unique per list; in a board with modules no part id may hold a `/`, which
 * separates the path of a part inside an instance (`u3/g2`).
 */
function checkScope(
  list: readonly Part[], wires: readonly Wire[], modulePins: ModulePins, inModule: { id: string; index: number } | null, paths: boolean,
): BoardProblem[] {
  const problems: BoardProblem[] = [];
  const at = inModule ? `modules[${inModule.index}].` : '';
  const where = inModule ? `module "${inModule.id}": ` : '';
  const parts = new Map<string, Part>();
  list.forEach((part, i) => {
    if (parts.has(part.id)) problems.push({ id: part.id, path: `${at}parts[${i}].id`, message: `${where}duplicate part id "${part.id}"` });
    parts.set(part.id, part);
    if (paths && part.id.includes('/')) problems.push({ id: part.id, path: `${at}parts[${i}].id`, message: `${where}part id "${part.id}" may not contain "/" (it separates paths inside instances)` });
    if (!inModule && part.kind === 'port') problems.push({ id: part.id, path: `parts[${i}].kind`, message: `${part.id}: a port belongs inside a module` });
  });
  const labels = new Map<string, string>();
  list.forEach((part, i) => {
    if (!isNamedKind(part.kind)) return;
    const label = part.label;
    if (label === undefined || label === '') return;
    const problem = labelProblem(label, labels);
    if (problem) problems.push({ id: part.id, path: `${at}parts[${i}].label`, message: `${where}${part.id}: ${problem}` });
    else labels.set(label, part.id);
  });
  // a part's pins are listed once per check, not at every wire end (a 1,000-part board has some 4,000 ends)
  const pinsByPart = new Map<Part, readonly string[]>();
  const pinsOnce = (part: Part): readonly string[] => {
    let pins = pinsByPart.get(part);
    if (!pins) pinsByPart.set(part, (pins = allPins(part, modulePins)));
    return pins;
  };
  const wireIds = new Set<string>();
  wires.forEach((wire, i) => {
    if (wireIds.has(wire.id)) problems.push({ id: wire.id, path: `${at}wires[${i}].id`, message: `${where}duplicate wire id "${wire.id}"` });
    wireIds.add(wire.id);
    for (const end of ['from', 'to'] as const) {
      const ref = splitPinRef(wire[end]);
      if (!ref) {
        problems.push({ id: wire.id, path: `${at}wires[${i}].${end}`, message: `${where}${wire.id}: "${wire[end]}" is not of the form part.pin` });
        continue;
      }
      const part = parts.get(ref.part);
      if (!part) {
        problems.push({ id: wire.id, path: `${at}wires[${i}].${end}`, message: `${where}${wire.id}: wire to missing part "${ref.part}"` });
        continue;
      }
      // an instance of a missing module is reported once, as such, not at every wire to it
      if (part.kind === 'module' && !modulePins.has(part.module)) continue;
      if (!pinsOnce(part).includes(ref.pin)) {
        const what = part.kind === 'module' ? `instance of module "${part.module}"` : part.kind;
        problems.push({ id: wire.id, path: `${at}wires[${i}].${end}`, message: `${where}${wire.id}: part "${part.id}" (${what}) has no pin "${ref.pin}"` });
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
