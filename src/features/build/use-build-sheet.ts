import { useCallback, useMemo, useRef, useState } from 'react';
import type { BoardFile, FamilyId } from '../../../shared/board';
import { BuildError, buildSheet, type BuildSheet } from '../../../shared/build';
import { circuitKey } from '../../lib/circuit-key';

/** Level-check values a builder may edit, as text (`22k`, `-12`); empty means the family's default. */
export type Settings = Record<string, string>;

/** The settings as the build sheet's `set` (only the filled ones). */
export function settingsText(settings: Settings): string {
  return Object.entries(settings).filter(([, v]) => v.trim() !== '').map(([k, v]) => `${k}=${v.trim()}`).join(',');
}

/**
 * The build sheet of the live board for a chosen family (the board's own by default) and edited values,
 * computed in the page (shared/build is pure and fast); `highlight` is the critical path when shown.
 * It is worked out once the panel has been on screen (`want`), and again when the circuit or the title
 * changes, not when a part moves.
 */
export function useBuildSheet(board: BoardFile) {
  const [seen, setSeen] = useState(false);
  const [picked, setFamily] = useState<FamilyId | null>(null);
  const family = picked ?? board.family;
  const [settings, setSettings] = useState<Settings>({});
  const [showPath, setShowPath] = useState(false);
  const set = settingsText(settings);
  const key = useMemo(() => (seen ? `${board.title}\n${circuitKey(board)}` : ''), [seen, board]);
  const boardRef = useRef(board);
  boardRef.current = board;
  const { sheet, error, fields } = useMemo((): { sheet: BuildSheet | null; error: string | null; fields: Record<string, string> } => {
    if (key === '') return { sheet: null, error: null, fields: {} };
    const board = boardRef.current;
    try {
      return { sheet: buildSheet(board, family, { set }), error: null, fields: {} };
    } catch (err) {
      if (!(err instanceof BuildError)) throw err;
      // a bad value: the family's own figures stay on screen beside the message
      let fallback: BuildSheet | null = null;
      try { fallback = set ? buildSheet(board, family) : null; } catch { fallback = null; }
      return { sheet: fallback, error: err.message, fields: err.fields };
    }
  }, [key, family, set]);
  const highlight = useMemo<ReadonlySet<string> | undefined>(
    () => (showPath && sheet?.criticalPath ? new Set(sheet.criticalPath.parts) : undefined),
    [showPath, sheet],
  );
  const want = useCallback(() => setSeen(true), []);
  return {
    board, family, setFamily, settings, setSettings, set, sheet, error, fields, showPath, setShowPath, highlight,
    /** the panel calls this once it is on screen: the sheet is worked out from then on */
    want,
  };
}

export type BuildSheetState = ReturnType<typeof useBuildSheet>;
