/** The ids of the parts selected on this user's canvas (React Flow's local selection, never the document). */
import { useMemo } from 'react';
import { useStore, type ReactFlowState } from '@xyflow/react';

// One string, so the inspector re-renders only when the selection itself changes, not on every drag frame.
const selectedKey = (s: ReactFlowState) => s.nodes.filter((n) => n.selected).map((n) => n.id).join('\n');

export function useSelectedPartIds(): string[] {
  const key = useStore(selectedKey);
  return useMemo(() => (key ? key.split('\n') : []), [key]);
}
