/**
 * The strict check of the document's `modules` root (docs/decisions/004-modules.md), called by
 * doc-check.ts as the check of a root of its own: every module is a Y.Map {id, title, order, parts,
 * wires, origin?} whose part and wire maps hold entries that pass the same entry checks as the top
 * level's. Problems are `shape` problems (an update that makes one is refused); a wire inside a module
 * to a part someone deleted is left out by docToBoard, as at the top level.
 */
import * as Y from 'yjs';
import { ModuleOriginSchema, ModuleSchema } from './schema';

export const MODULES_ROOT = 'modules';

const MODULE_KEYS = new Set(['id', 'title', 'order', 'parts', 'wires', 'origin']);

/** Entry checks of doc-check.ts, passed in so that this file does not import it back. */
export interface EntryChecks {
  part(key: string, value: unknown): { message: string }[];
  wire(key: string, value: unknown): { message: string }[];
}

/** Messages of every shape problem under `modules` (empty when the root is absent or fine). */
export function checkModulesRoot(doc: Y.Doc, checks: EntryChecks): string[] {
  if (!doc.share.has(MODULES_ROOT)) return [];
  const root = doc.getMap<unknown>(MODULES_ROOT);
  const problems: string[] = [];
  for (const [key, value] of root.entries()) {
    const at = `module ${JSON.stringify(key.length > 60 ? key.slice(0, 60) + '…' : key)}`;
    if (!(value instanceof Y.Map)) {
      problems.push(`${at}: is not a module`);
      continue;
    }
    const unknown = [...value.keys()].find((k) => !MODULE_KEYS.has(k));
    if (unknown !== undefined) {
      problems.push(`${at}: unknown field ${JSON.stringify(unknown)}`);
      continue;
    }
    if (value.get('id') !== key) problems.push(`${at}: its id is not its key`);
    const title = value.get('title');
    if (!ModuleSchema.shape.title.safeParse(title).success) problems.push(`${at}: title must be text of at most 200 characters`);
    const order = value.get('order');
    if (order !== undefined && (typeof order !== 'number' || !Number.isFinite(order))) problems.push(`${at}: order is not a number`);
    const origin = value.get('origin');
    if (origin !== undefined && !ModuleOriginSchema.safeParse(origin).success) problems.push(`${at}: origin must be {library, version}`);
    const parts = value.get('parts');
    const wires = value.get('wires');
    if (!(parts instanceof Y.Map) || !(wires instanceof Y.Map)) {
      problems.push(`${at}: parts and wires must be maps`);
      continue;
    }
    for (const [k, v] of parts.entries()) for (const p of checks.part(k, v)) problems.push(`${at}: ${p.message}`);
    for (const [k, v] of wires.entries()) for (const p of checks.wire(k, v)) problems.push(`${at}: ${p.message}`);
  }
  return problems;
}
