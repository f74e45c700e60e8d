/**
 * The bench clipboard holds a board-file FRAGMENT as JSON text, on the system clipboard when the
 * browser allows it (so pasting works between boards, tabs and windows) and always in memory too.
 */
import { FragmentSchema, type Fragment } from '../../../../shared/board/schema';

let memory: string | null = null;

/** Puts a fragment on the clipboard. */
export async function writeFragment(fragment: Fragment): Promise<void> {
  const text = JSON.stringify(fragment);
  memory = text;
  try {
    await navigator.clipboard?.writeText(text);
  } catch {
    // No permission (or no secure context): the in-memory copy still serves this tab.
  }
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

/** The fragment on the clipboard: the system clipboard's if it holds one, else the in-memory copy. */
export async function readFragment(): Promise<Fragment | null> {
  try {
    const text = await navigator.clipboard?.readText();
    const fromSystem = parseFragment(text);
    if (fromSystem) return fromSystem;
  } catch {
    // Reading needs a permission the page may not have; fall back to memory.
  }
  return parseFragment(memory);
}

/** Top-left corner of a fragment's parts (to paste it where the pointer is). */
export function fragmentOrigin(fragment: Fragment): { x: number; y: number } {
  if (!fragment.parts.length) return { x: 0, y: 0 };
  return { x: Math.min(...fragment.parts.map((p) => p.x)), y: Math.min(...fragment.parts.map((p) => p.y)) };
}
