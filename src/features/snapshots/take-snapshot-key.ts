/** Ctrl+Alt+S (Cmd+Alt+S): the canvas shortcuts never use Alt, so this cannot clash with them. */
export function isTakeSnapshotKey(e: { key: string; code?: string; ctrlKey: boolean; metaKey: boolean; altKey: boolean; shiftKey: boolean }): boolean {
  return (e.ctrlKey || e.metaKey) && e.altKey && !e.shiftKey && (e.code === 'KeyS' || e.key.toLowerCase() === 's');
}
