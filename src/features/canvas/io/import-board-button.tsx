/** Upload a board file into a NEW board, then open it; the server's problems (naming the bad ids) show as a toast. */
import { useRef, useState } from 'react';
import { useNavigate } from 'react-router-dom';
import { useQueryClient } from '@tanstack/react-query';
import { toast } from 'sonner';
import { errorMessage } from '../../../lib/api-client';
import { importBoardFile } from './board-file-io';

export function ImportBoardButton({ className, label = 'Import board file…' }: { className?: string; label?: string }) {
  const input = useRef<HTMLInputElement>(null);
  const [busy, setBusy] = useState(false);
  const navigate = useNavigate();
  const qc = useQueryClient();
  const onFile = async (file: File | undefined) => {
    if (!file) return;
    setBusy(true);
    try {
      const board = await importBoardFile(file);
      await qc.invalidateQueries({ queryKey: ['boards'] });
      toast.success(`Imported “${board.title}” as a new board`);
      navigate(`/boards/${board.id}`);
    } catch (err) {
      toast.error('Import refused', { description: errorMessage(err), duration: 12_000 });
    } finally {
      setBusy(false);
      if (input.current) input.current.value = '';
    }
  };
  return (
    <>
      <input ref={input} type="file" accept=".json,application/json" className="hidden" data-testid="import-board-input"
        onChange={(e) => void onFile(e.target.files?.[0])} />
      <button type="button" disabled={busy} onClick={() => input.current?.click()} data-testid="import-board-button"
        className={className ?? 'rounded border border-mat-600 bg-mat-800 px-2.5 py-1 text-xs text-slate-100 hover:bg-mat-700 disabled:opacity-60'}>
        {busy ? 'Importing…' : label}
      </button>
    </>
  );
}
