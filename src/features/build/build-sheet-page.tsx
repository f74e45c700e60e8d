/** `/boards/:id/build-sheet`: the build sheet as a printable page (light on paper, no app chrome when printed). */
import { useQuery } from '@tanstack/react-query';
import { Link, useSearchParams } from 'react-router-dom';
import { parseBoardFile, type FamilyId } from '../../../shared/board';
import { BuildError, buildSheet } from '../../../shared/build';
import { Button } from '../../components/ui/button';
import { ErrorState } from '../../components/ui/error-state';
import { LoadingState } from '../../components/ui/spinner';
import { api } from '../../lib/api-client';
import { FAMILY_LABELS } from '../../lib/families';
import { useIdParam } from '../../lib/use-id-param';
import { SafetyCaution } from '../boards';
import { volts, milliamps } from './format';
import { SheetView } from './sheet-view';

const PRINT_CSS = `@media print {
  body, #root { background: #fff !important; color: #000 !important; }
  body header, .gf-no-print { display: none !important; }
  .gf-build-print * { color: #000 !important; border-color: #999 !important; background: transparent !important; }
}`;

export function BuildSheetPage() {
  const id = useIdParam();
  const [params] = useSearchParams();
  const file = useQuery({ queryKey: ['boards', 'export', id], queryFn: () => api.get<unknown>(`/api/boards/${id}/export`), enabled: id !== null });
  if (id === null) return <ErrorState error={new Error('A board address ends in its number, like /boards/12/build-sheet.')} />;
  if (file.isPending) return <LoadingState label="Reading the board…" />;
  if (file.error) return <ErrorState error={file.error} onRetry={() => file.refetch()} />;
  const parsed = parseBoardFile(file.data);
  if (!parsed.ok) return <ErrorState error={new Error(parsed.problems[0].message)} />;
  const board = parsed.board;
  const family = (params.get('family') ?? board.family) as FamilyId;
  let sheet;
  try {
    sheet = buildSheet(board, family, { set: params.get('set') ?? undefined });
  } catch (err) {
    if (err instanceof BuildError) return <ErrorState error={err} />;
    throw err;
  }
  const lc = sheet.levelCheck;
  return (
    <main className="gf-build-print mx-auto max-w-3xl space-y-3 overflow-y-auto p-6 text-sm text-slate-200" data-testid="build-sheet-page">
      <style>{PRINT_CSS}</style>
      <div className="gf-no-print flex gap-2">
        <Link to={`/boards/${id}`} className="text-xs text-amber-300 hover:underline">← back to the board</Link>
        <Button size="sm" className="ml-auto" onClick={() => window.print()}>Print</Button>
      </div>
      <h1 className="text-lg font-semibold">Build sheet — {board.title}</h1>
      <p className="text-xs text-slate-400">Family: {FAMILY_LABELS[family] ?? family}{params.get('set') ? ` · values: ${params.get('set')}` : ''}</p>
      <SafetyCaution family={family} />
      <SheetView sheet={sheet} />
      {lc && (
        <section aria-label="Level check" className="text-xs">
          <h3 className="mt-2 font-semibold">Level check ({lc.device})</h3>
          <p>All inputs low: {volts(lc.low.grid)} (margin {lc.low.margin.toFixed(2)} V, {lc.low.pass ? 'pass' : 'warn'}); one input high: {volts(lc.high.grid)}{lc.high.clamped ? ` (open-circuit ${volts(lc.high.openCircuit)}, clamped)` : ''} (margin {lc.high.margin.toFixed(2)} V, {lc.high.pass ? 'pass' : 'warn'}).</p>
          {lc.indicator && <p>Indicator LED: {milliamps(lc.indicator.onMa)} on, {volts(lc.indicator.offVolts)} across it off ({lc.indicator.pass ? 'pass' : 'warn'}).</p>}
          <p className="text-slate-500">Values: {Object.entries(lc.values).map(([k, v]) => `${k} ${v}`).join(', ')}.</p>
        </section>
      )}
      <section aria-label="Sources" className="text-[10px] text-slate-500">
        <h3 className="font-semibold">Sources</h3>
        <ul className="list-disc pl-4">
          {[...new Set([sheet.criticalPath?.source, sheet.heater?.source, sheet.fanOut.source, ...sheet.rails.map((r) => r.source), ...sheet.parts.map((p) => p.source), ...(lc ? [lc.sources.cutoff, lc.sources.clamp] : [])].filter(Boolean))].map((s) => <li key={s}>{s}</li>)}
        </ul>
      </section>
    </main>
  );
}
