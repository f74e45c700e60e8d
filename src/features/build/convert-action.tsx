/** Convert to NOR-only / NAND-only: a preview of the counts first, then a new board made from the converted file. */
import { useMemo, useState } from 'react';
import { useNavigate } from 'react-router-dom';
import { useQueryClient } from '@tanstack/react-query';
import { toast } from 'sonner';
import type { BoardFile } from '../../../shared/board';
import { canonicalBoard } from '../../../shared/board';
import { BuildError, convertBoard, type ConvertTarget } from '../../../shared/build';
import { Button } from '../../components/ui/button';
import { errorMessage } from '../../lib/api-client';
import { importBoardFile } from '../canvas';

export function ConvertAction({ board }: { board: BoardFile }) {
  const [target, setTarget] = useState<ConvertTarget | null>(null);
  const [busy, setBusy] = useState(false);
  const navigate = useNavigate();
  const qc = useQueryClient();
  const preview = useMemo(() => {
    if (!target) return null;
    try {
      return { result: convertBoard(board, target), error: null };
    } catch (err) {
      if (err instanceof BuildError) return { result: null, error: err.message };
      throw err;
    }
  }, [board, target]);
  const create = async () => {
    if (!preview?.result) return;
    setBusy(true);
    try {
      const text = `${JSON.stringify(canonicalBoard(preview.result.board), null, 2)}\n`;
      const created = await importBoardFile(new File([text], 'converted.gatefold.json', { type: 'application/json' }));
      await qc.invalidateQueries({ queryKey: ['boards'] });
      toast.success(`Created “${created.title}”`);
      setTarget(null);
      navigate(`/boards/${created.id}`);
    } catch (err) {
      toast.error('Could not create the converted board', { description: errorMessage(err) });
    } finally {
      setBusy(false);
    }
  };
  return (
    <div className="space-y-1.5" data-testid="convert-action">
      <div className="flex flex-wrap gap-1.5">
        <Button size="sm" onClick={() => setTarget('nor')} aria-pressed={target === 'nor'}>Convert to NOR-only…</Button>
        <Button size="sm" onClick={() => setTarget('nand')} aria-pressed={target === 'nand'}>Convert to NAND-only…</Button>
      </div>
      {preview?.error && <p role="alert" className="text-[11px] text-rose-300">{preview.error}</p>}
      {preview?.result && (
        <div className="rounded border border-mat-700 bg-mat-950/60 p-2 text-[11px] text-slate-300" data-testid="convert-preview">
          <p>
            {preview.result.partsBefore} part{preview.result.partsBefore === 1 ? '' : 's'} now → <strong className="text-amber-200">{preview.result.gates} {preview.result.target.toUpperCase()} gates</strong>
            {' '}({preview.result.inverters} inverter{preview.result.inverters === 1 ? '' : 's'}{preview.result.complementsUsed ? `, ${preview.result.complementsUsed} switch complement${preview.result.complementsUsed === 1 ? '' : 's'} used` : ''}); same truth table.
          </p>
          <p className="text-slate-500">The converted copy becomes a new board; this one stays as it is.</p>
          <div className="mt-1 flex gap-1.5">
            <Button size="sm" variant="primary" busy={busy} onClick={() => void create()} data-testid="convert-create">Create the {preview.result.target.toUpperCase()}-only board</Button>
            <Button size="sm" variant="ghost" onClick={() => setTarget(null)}>Cancel</Button>
          </div>
        </div>
      )}
    </div>
  );
}
