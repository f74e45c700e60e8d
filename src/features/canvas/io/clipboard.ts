/**
 * The canvas clipboard holds a board-file FRAGMENT as JSON text: on the system clipboard through the
 * browser's copy/paste events (so pasting works between boards, tabs and windows; see
 * use-canvas-commands) and always in this tab's memory too.
 */
import { FragmentSchema, type Fragment } from '../../../../shared/board';

let memory: string | null = null;

/** Keeps a fragment in this tab's memory (the fallback when the system clipboard is out of reach). */
export function rememberFragment(fragment: Fragment): string {
  memory = JSON.stringify(fragment);
  return memory;
}

/** The fragment in this tab's memory, if any. */
export function rememberedFragment(): Fragment | null {
  return parseFragment(memory);
}

/** Parses clipboard text into a fragment, or null when it is not one. */
export function parseFragment(text: string | null | undefined): Fragment | null {
  if (!text) return null;
  try {
    const parsed = FragmentSchema.safeParse(JSON.parse(text));
    return parsed.success ? parsed.data : null;
  } catch {
    return null;
  }
}

/** Top-left corner of a fragment's parts (to paste it where the pointer is). */
export function fragmentOrigin(fragment: Fragment): { x: number; y: number } {
  if (!fragment.parts.length) return { x: 0, y: 0 };
  return { x: Math.min(...fragment.parts.map((p) => p.x)), y: Math.min(...fragment.parts.map((p) => p.y)) };
}
