/**
 * Everyone on a board hears of a restore: the server leaves a notice in the document's meta map
 * (who restored which snapshot, when), and each screen shows it as a toast when it arrives.
 */
import { useEffect, useRef } from 'react';
import { toast } from 'sonner';
import type * as Y from 'yjs';
import { RESTORE_NOTICE_KEY, type RestoreNotice } from '../../../shared/api';
import { metaMap } from '../../../shared/board';
import { formatDateTime } from '../../lib/format';

/** A notice older than this when it arrives (e.g. read with the board on opening) is not news. */
const FRESH_MS = 120_000;

export function useRestoreNotices(doc: Y.Doc, onNotice?: (notice: RestoreNotice) => void): void {
  const seen = useRef<string | null>(null);
  const callback = useRef(onNotice);
  callback.current = onNotice;
  useEffect(() => {
    const meta = metaMap(doc);
    const onChange = (event: Y.YMapEvent<unknown>) => {
      if (!event.keysChanged.has(RESTORE_NOTICE_KEY)) return;
      const notice = meta.get(RESTORE_NOTICE_KEY) as RestoreNotice | undefined;
      if (!notice || typeof notice.at !== 'string' || seen.current === notice.at) return;
      seen.current = notice.at;
      if (Date.now() - Date.parse(notice.at) > FRESH_MS) return;
      toast.info(`${notice.byName} restored the snapshot “${notice.snapshotName}”`, {
        description: `${formatDateTime(notice.at)} · every screen now shows it; the owner can undo it from the history (“Before restoring…”).`,
        duration: 8000,
      });
      callback.current?.(notice);
    };
    meta.observe(onChange);
    return () => meta.unobserve(onChange);
  }, [doc]);
}
