import { useMemo, useState } from 'react';
import type { BoardFile, FamilyId } from '../../../shared/board';
import { BuildError, buildSheet, type BuildSheet } from '../../../shared/build';

/** Level-check values a builder may edit, as text (`22k`, `-12`); empty means the family's default. */
export type Settings = Record<string, string>;

/** The settings as the build sheet's `set` (only the filled ones). */
export function settingsText(settings: Settings): string {
  return Object.entries(settings).filter(([, v]) => v.trim() !== '').map(([k, v]) => `${k}=${v.trim()}`).join(',');
}

/**
 * The build sheet of the live board for a chosen family (the board's own by default) and edited values,
 * computed in the page (shared/build is pure and fast); `highlight` is the critical path when shown.
 */
export function useBuildSheet(board: BoardFile) {
  const [picked, setFamily] = useState<FamilyId | null>(null);
  const family = picked ?? board.family;
  const [settings, setSettings] = useState<Settings>({});
  const [showPath, setShowPath] = useState(false);
  const set = settingsText(settings);
  const { sheet, error, fields } = useMemo((): { sheet: BuildSheet | null; error: string | null; fields: Record<string, string> } => {
    try {
      return { sheet: buildSheet(board, family, { set }), error: null, fields: {} };
    } catch (err) {
      if (!(err instanceof BuildError)) throw err;
      // a bad value: the family's own figures stay on screen beside the message
      let fallback: BuildSheet | null = null;
      try { fallback = set ? buildSheet(board, family) : null; } catch { fallback = null; }
      return { sheet: fallback, error: err.message, fields: err.fields };
    }
  }, [board, family, set]);
  const highlight = useMemo<ReadonlySet<string> | undefined>(
    () => (showPath && sheet?.criticalPath ? new Set(sheet.criticalPath.parts) : undefined),
    [showPath, sheet],
  );
  return {
    board, family, setFamily, settings, setSettings, set, sheet, error, fields, showPath, setShowPath, highlight,
  };
}

export type BuildSheetState = ReturnType<typeof useBuildSheet>;
