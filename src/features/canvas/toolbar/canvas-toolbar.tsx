/** The canvas toolbar: undo / redo of your own edits, rotate, duplicate, delete, file, picture and Verilog export, help. */
import { useState, type ReactNode } from 'react';
import { toast } from 'sonner';
import { download, boardFileName, downloadBoardFile, downloadVerilog } from '../io/board-file-io';
import { renderBoardImage } from '../io/export-image';
import { ImportBoardButton } from '../io/import-board-button';
import type { BoardSession } from '../session/use-board-session';
import type { CanvasApi } from '../workspace/board-canvas';

function Tool({ onClick, disabled, title, children, testId }: { onClick(): void; disabled?: boolean; title: string; children: ReactNode; testId: string }) {
  return (
    <button type="button" onClick={onClick} disabled={disabled} title={title} aria-label={title} data-testid={testId}
      className="h-7 rounded px-2 text-xs text-slate-200 hover:bg-mat-700 disabled:cursor-not-allowed disabled:opacity-40">
      {children}
    </button>
  );
}

interface Props {
  session: BoardSession;
  canvas: CanvasApi | null;
  onHelp(): void;
}

export function CanvasToolbar({ session, canvas, onHelp }: Props) {
  const [busy, setBusy] = useState(false);
  const editing = !session.readOnly;
  const picture = async (format: 'png' | 'svg') => {
    setBusy(true);
    try {
      const url = await renderBoardImage(session.board, format);
      download(url, boardFileName(session.board.title || 'board', format));
    } catch (err) {
      toast.error(`Could not make the ${format.toUpperCase()}: ${(err as Error).message}`);
    } finally {
      setBusy(false);
    }
  };
  return (
    <div className="flex items-center gap-0.5" role="toolbar" aria-label="Canvas tools" data-testid="canvas-toolbar">
      {editing && (
        <>
          <Tool testId="tool-undo" title="Undo your last edit (Ctrl+Z)" disabled={!session.canUndo} onClick={session.undo}>↶ Undo</Tool>
          <Tool testId="tool-redo" title="Redo (Ctrl+Shift+Z)" disabled={!session.canRedo} onClick={session.redo}>↷ Redo</Tool>
          <span className="mx-1 h-4 w-px bg-mat-600" />
          <Tool testId="tool-rotate" title="Rotate the selection (R)" onClick={() => canvas?.run('rotate')}>⟳ Rotate</Tool>
          <Tool testId="tool-duplicate" title="Duplicate the selection (Ctrl+D)" onClick={() => canvas?.run('duplicate')}>⧉ Duplicate</Tool>
          <Tool testId="tool-delete" title="Delete the selection (Delete)" onClick={() => canvas?.run('delete')}>✕ Delete</Tool>
          <Tool testId="tool-make-module" title="Make a module of the selection (M)" onClick={() => canvas?.run('makeModule')}>▣ Module</Tool>
          <span className="mx-1 h-4 w-px bg-mat-600" />
        </>
      )}
      <Tool testId="tool-export-file" title="Download the board file (.gatefold.json)" onClick={() => downloadBoardFile(session.board)}>⤓ File</Tool>
      <Tool testId="tool-export-png" title="Download a PNG picture of the board" disabled={busy} onClick={() => void picture('png')}>PNG</Tool>
      <Tool testId="tool-export-svg" title="Download an SVG picture of the board" disabled={busy} onClick={() => void picture('svg')}>SVG</Tool>
      <Tool testId="tool-export-verilog" title="Download the board as structural Verilog (.v)" onClick={() => {
        try { downloadVerilog(session.board); } catch (err) { toast.error(`Could not write the Verilog: ${(err as Error).message}`); }
      }}>Verilog</Tool>
      {/* importing makes a new board of your own, so viewers may do it too (a guest without an account gets the server's 401) */}
      <ImportBoardButton label="⤒ Import" className="h-7 rounded px-2 text-xs text-slate-200 hover:bg-mat-700 disabled:opacity-40" />
      <span className="mx-1 h-4 w-px bg-mat-600" />
      <Tool testId="tool-help" title="Keyboard shortcuts (?)" onClick={onHelp}>?</Tool>
    </div>
  );
}
