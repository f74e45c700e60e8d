/**
 * Modules (CONTRACTS §1, docs/decisions/004-modules.md): the pins an instance gets from its module's
 * ports, and the checks of a board's modules — ports, instances of missing modules, nesting cycles.
 */
import { CHANGING_INPUT_KINDS, type PinSet } from './kinds';
import { LABEL_RE } from './labels';
import type { ModulePins } from './pins';
import type { Module, Part } from './schema';

/** Kinds a module may not hold: a module's inputs are its ports. */
export const KINDS_OUTSIDE_MODULES = CHANGING_INPUT_KINDS;

/** A part list's pins as an instance shows them: ports `in` (its inputs), then ports `out`, each in part order. */
export function portPins(parts: readonly { kind: string; dir?: unknown; label?: unknown }[]): PinSet {
  const inputs: string[] = [];
  const outputs: string[] = [];
  for (const p of parts) {
    if (p.kind !== 'port' || typeof p.label !== 'string' || p.label === '') continue;
    const list = p.dir === 'out' ? outputs : inputs;
    if (!inputs.includes(p.label) && !outputs.includes(p.label)) list.push(p.label);
  }
  return { inputs, outputs };
}

/** Module id → the pins of its instances. */
export function modulePinTable(modules: readonly Pick<Module, 'id' | 'parts'>[] | undefined): ModulePins {
  const table = new Map<string, PinSet>();
  for (const m of modules ?? []) if (!table.has(m.id)) table.set(m.id, portPins(m.parts));
  return table;
}

/** A problem of a board's modules, naming the module and, when there is one, the part. */
export interface ModuleProblem {
  module?: string;
  id?: string;
  message: string;
}

/**
 * The first nesting cycle among `modules` as a chain of module ids (`['a', 'b', 'a']`), or null.
 * Depth-first with an explicit stack, so a deep nesting cannot overflow the call stack.
 */
export function moduleCycle(modules: readonly Pick<Module, 'id' | 'parts'>[]): string[] | null {
  const uses = new Map<string, string[]>();
  for (const m of modules) {
    if (uses.has(m.id)) continue;
    uses.set(m.id, [...new Set(m.parts.flatMap((p) => (p.kind === 'module' ? [p.module] : [])))]);
  }
  const state = new Map<string, 1 | 2>(); // 1 on the current path, 2 done
  for (const start of uses.keys()) {
    if (state.has(start)) continue;
    const path: string[] = [start];
    const next: number[] = [0];
    state.set(start, 1);
    while (path.length) {
      const top = path[path.length - 1];
      const children = uses.get(top) ?? [];
      const k = next[next.length - 1]++;
      if (k >= children.length) {
        state.set(top, 2);
        path.pop();
        next.pop();
        continue;
      }
      const child = children[k];
      if (!uses.has(child)) continue; // a missing module is reported on its own
      const s = state.get(child);
      if (s === 1) return [...path.slice(path.indexOf(child)), child];
      if (s === 2) continue;
      state.set(child, 1);
      path.push(child);
      next.push(0);
    }
  }
  return null;
}

/** Problems of the ports and contents of one part list that is a module's inside. */
export function checkModuleParts(moduleId: string, parts: readonly Part[]): ModuleProblem[] {
  const problems: ModuleProblem[] = [];
  const ports = new Map<string, string>();
  for (const p of parts) {
    if ((KINDS_OUTSIDE_MODULES as readonly string[]).includes(p.kind)) {
      problems.push({ module: moduleId, id: p.id, message: `module "${moduleId}": ${p.id} is a ${p.kind}; a module takes its inputs through ports` });
    }
    if (p.kind !== 'port') continue;
    const label = p.label ?? '';
    if (!LABEL_RE.test(label)) {
      problems.push({ module: moduleId, id: p.id, message: `module "${moduleId}": port ${p.id} needs a label that is a letter or _ followed by letters, digits or _ (has "${label}")` });
      continue;
    }
    const other = ports.get(label);
    if (other !== undefined) problems.push({ module: moduleId, id: p.id, message: `module "${moduleId}": ports ${other} and ${p.id} are both labelled "${label}"` });
    else ports.set(label, p.id);
  }
  return problems;
}

/** Problems of a board's modules as a whole: repeated module ids, instances of missing modules, nesting cycles. */
export function checkModuleGraph(modules: readonly Module[], topParts: readonly Part[]): ModuleProblem[] {
  const problems: ModuleProblem[] = [];
  const ids = new Set<string>();
  for (const m of modules) {
    if (ids.has(m.id)) problems.push({ module: m.id, message: `duplicate module id "${m.id}"` });
    ids.add(m.id);
  }
  const missing = (where: string, parts: readonly Part[]) => {
    for (const p of parts) {
      if (p.kind === 'module' && !ids.has(p.module)) {
        problems.push({ module: where || undefined, id: p.id, message: `${where ? `module "${where}": ` : ''}instance ${p.id} uses missing module "${p.module}"` });
      }
    }
  };
  missing('', topParts);
  for (const m of modules) missing(m.id, m.parts);
  const cycle = moduleCycle(modules);
  if (cycle) problems.push({ module: cycle[0], message: `module "${cycle[0]}" contains itself: ${cycle.join(' → ')}` });
  return problems;
}
