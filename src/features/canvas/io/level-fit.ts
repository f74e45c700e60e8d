/**
 * What a level of the board may hold, checked on the client before a paste or a placement, so the user
 * hears why a part did not go in instead of seeing the room's repair remove it (shared/board
 * module-repair.ts): a module takes its inputs through its ports, so switches, buttons and clocks stay on
 * the top level; a port exists only inside a module.
 */
import { KINDS_OUTSIDE_MODULES, splitPinRef, type Fragment, type Part, type PartKind } from '../../../../shared/board';

const OUTSIDE_MODULES = new Set<string>(KINDS_OUTSIDE_MODULES);

/** Whether a part of `kind` may stand on the level being edited (inside a module or on the top level). */
export function kindFitsLevel(kind: PartKind, inModule: boolean): boolean {
  return inModule ? !OUTSIDE_MODULES.has(kind) : kind !== 'port';
}

/**
 * The part of `fragment` that may go into the level being edited: parts that may not are left out, with
 * the wires to them. `fragment` itself is returned when nothing is left out.
 */
export function fitFragmentToLevel(fragment: Fragment, inModule: boolean): { fragment: Fragment; leftOut: Part[] } {
  const leftOut = fragment.parts.filter((p) => !kindFitsLevel(p.kind, inModule));
  if (!leftOut.length) return { fragment, leftOut };
  const gone = new Set(leftOut.map((p) => p.id));
  const touches = (ref: string) => gone.has(splitPinRef(ref)?.part ?? '');
  return {
    fragment: {
      ...fragment,
      parts: fragment.parts.filter((p) => !gone.has(p.id)),
      wires: fragment.wires.filter((w) => !touches(w.from) && !touches(w.to)),
    },
    leftOut,
  };
}

const NOUNS: Partial<Record<PartKind, [one: string, many: string]>> = {
  switch: ['switch', 'switches'], button: ['button', 'buttons'], clock: ['clock', 'clocks'], port: ['port', 'ports'],
};

/** "2 switches (A, B) and 1 clock (CLK)": what was left out, by kind, with labels where there are some. */
function listParts(parts: readonly Part[]): string {
  const byKind = new Map<PartKind, Part[]>();
  for (const p of parts) byKind.set(p.kind, [...(byKind.get(p.kind) ?? []), p]);
  const items = [...byKind].map(([kind, list]) => {
    const [one, many] = NOUNS[kind] ?? [kind, `${kind}s`];
    const labels = list.map((p) => p.label).filter((l): l is string => Boolean(l));
    return `${list.length} ${list.length === 1 ? one : many}${labels.length ? ` (${labels.join(', ')})` : ''}`;
  });
  return items.length > 1 ? `${items.slice(0, -1).join(', ')} and ${items.at(-1)}` : items[0] ?? '';
}

/** Why a part of this level's forbidden kinds cannot go in. */
export function levelRule(inModule: boolean): string {
  return inModule
    ? 'Switches, buttons and clocks stay on the top level: a module takes its inputs through ports.'
    : 'Ports belong inside a module: open one (double-click an instance) to add them.';
}

/** The notice after a paste that left parts out: what, and why. */
export function leftOutNotice(leftOut: readonly Part[], inModule: boolean, pasted: number): string {
  const what = `Left out ${listParts(leftOut)}`;
  return `${pasted ? `Pasted ${pasted} part(s). ` : 'Nothing pasted. '}${what}. ${levelRule(inModule)}`;
}

/** The notice when a part of `kind` is placed where it may not stand, or null when it may. */
export function placementRefusal(kind: PartKind, inModule: boolean): string | null {
  if (kindFitsLevel(kind, inModule)) return null;
  const [one] = NOUNS[kind] ?? [kind];
  return `A ${one} cannot go here. ${levelRule(inModule)}`;
}
